import type { EvaluatedBatch } from './evaluate-points.js';

/** Evaluates batches of points (count x dim, row-wise) of one log-posterior. */
export interface BatchEvaluator {
  /** Number of worker threads (0: evaluated on the calling thread). */
  readonly workers: number;
  evaluate(points: Float64Array, dim: number): Promise<EvaluatedBatch>;
  /** Worker replacements made so far. */
  readonly restarts: number;
  close(): Promise<void>;
}

/** A worker died and could not be replaced: the run must stop. */
export class WorkerCrashError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'WorkerCrashError';
  }
}
