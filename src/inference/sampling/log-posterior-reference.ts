import { isAbsolute, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { InputError } from '../../contracts/input-error.js';

/**
 * How a log-posterior reaches a worker thread: functions cannot be posted,
 * so the target is named by module and export. Each worker (or the main
 * thread when no workers are used) runs once
 *   const logPost = await (await import(module))[exportName](options)
 * and then calls logPost(theta) for every point. `options` must survive
 * JSON and structured cloning (numbers, strings, arrays, plain objects).
 */
export interface LogPosteriorReference {
  /** Absolute path, path relative to the working directory, or file: URL of an ES module. */
  readonly module: string;
  /** Name of the export: a function options => logPost (sync or async). */
  readonly exportName: string;
  /** Handed to the export once per worker. */
  readonly options?: unknown;
}

/** The log-posterior itself: ln p(theta | data) up to a constant; -Infinity outside the support. */
export type LogPosterior = (theta: Float64Array) => number;

/** A reference with its module as a file: URL and its options JSON-checked. */
export function normalizeLogPosteriorReference(ref: LogPosteriorReference, field = 'target'): Required<LogPosteriorReference> {
  if (ref === null || typeof ref !== 'object') throw new InputError(`${field} must be an object { module, exportName, options }`);
  if (typeof ref.module !== 'string' || ref.module.length === 0) throw new InputError(`${field}.module must be a non-empty path or file: URL`);
  if (typeof ref.exportName !== 'string' || ref.exportName.length === 0) throw new InputError(`${field}.exportName must be a non-empty string`);
  let options: unknown;
  try {
    options = ref.options === undefined ? null : JSON.parse(JSON.stringify(ref.options));
  } catch {
    throw new InputError(`${field}.options must be JSON-serialisable`);
  }
  const module = ref.module.startsWith('file:')
    ? ref.module
    : pathToFileURL(isAbsolute(ref.module) ? ref.module : resolve(ref.module)).href;
  return { module, exportName: ref.exportName, options };
}
