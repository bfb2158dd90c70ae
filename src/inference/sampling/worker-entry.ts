/**
 * Worker-thread entry of the sampling pool: loads the log-posterior named by
 * a module reference once, then evaluates batches of points posted by the
 * main thread (through comlink).
 */
import { parentPort } from 'node:worker_threads';
import { expose, transfer } from 'comlink';
import { nodeEndpoint } from './comlink-node.js';
import { evaluatePoints, type EvaluatedBatch } from './evaluate-points.js';
import { loadLogPosterior } from './load-log-posterior.js';
import { climbFromStart, type ModeClimb } from '../optimize/climb-from-start.js';
import type { LogPosterior, LogPosteriorReference } from './log-posterior-reference.js';
import type { BoundedParameter } from './sampled-parameter.js';

let logPost: LogPosterior | null = null;

const api = {
  async load(ref: Required<LogPosteriorReference>): Promise<void> {
    logPost = await loadLogPosterior(ref);
  },
  evaluate(points: Float64Array, dim: number): EvaluatedBatch {
    if (logPost === null) throw new Error('sampling worker: evaluate called before load');
    const result = evaluatePoints(logPost, points, dim);
    return transfer(result, [result.values.buffer, result.status.buffer]);
  },
  /** Local maximisations from each start (count x dim, row-wise), for the mode search. */
  climb(starts: Float64Array, parameters: readonly BoundedParameter[]): ModeClimb[] {
    if (logPost === null) throw new Error('sampling worker: climb called before load');
    const f = logPost;
    const dim = parameters.length;
    return Array.from({ length: starts.length / dim }, (_, i) => climbFromStart(f, parameters, starts.subarray(i * dim, (i + 1) * dim)));
  },
};

export type SamplingWorkerApi = typeof api;

if (parentPort) expose(api, nodeEndpoint(parentPort));
