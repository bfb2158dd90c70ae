import type { BatchEvaluator } from './batch-evaluator.js';
import { evaluatePoints, type EvaluatedBatch } from './evaluate-points.js';
import { loadLogPosterior } from './load-log-posterior.js';
import type { LogPosterior, LogPosteriorReference } from './log-posterior-reference.js';

/** Evaluates on the calling thread (workers = 0): for cheap targets and debugging. */
export class InThreadEvaluator implements BatchEvaluator {
  readonly workers = 0;
  readonly restarts = 0;

  private constructor(private readonly logPost: LogPosterior) {}

  static async start(target: Required<LogPosteriorReference>): Promise<InThreadEvaluator> {
    return new InThreadEvaluator(await loadLogPosterior(target));
  }

  async evaluate(points: Float64Array, dim: number): Promise<EvaluatedBatch> {
    return evaluatePoints(this.logPost, points, dim);
  }

  async close(): Promise<void> {}
}
