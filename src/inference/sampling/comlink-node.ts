import type { Endpoint } from 'comlink';
// @ts-expect-error comlink ships node-adapter.d.ts beside an .mjs file, a pairing NodeNext resolution does not make
import untypedNodeEndpoint from 'comlink/dist/esm/node-adapter.mjs';

/** The part of a worker_threads Worker or MessagePort that comlink's node adapter uses. */
export interface NodeMessageEnd {
  postMessage(message: unknown, transfer?: readonly unknown[]): void;
  on(type: string, listener: (value: unknown) => void): unknown;
  off(type: string, listener: (value: unknown) => void): unknown;
  start?: () => void;
}

/** comlink's node adapter (comlink/dist/esm/node-adapter.mjs), typed. */
export const nodeEndpoint = untypedNodeEndpoint as (end: NodeMessageEnd) => Endpoint;
