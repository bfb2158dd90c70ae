import type { BatchEvaluator } from './batch-evaluator.js';
import { InThreadEvaluator } from './in-thread-evaluator.js';
import type { LogPosteriorReference } from './log-posterior-reference.js';
import { WorkerPool } from './worker-pool.js';

/** A pool of `workers` threads, or evaluation on this thread when workers = 0. */
export function openEvaluator(target: Required<LogPosteriorReference>, workers: number, maxRestarts: number): Promise<BatchEvaluator> {
  return workers === 0 ? InThreadEvaluator.start(target) : WorkerPool.start(target, workers, maxRestarts);
}
