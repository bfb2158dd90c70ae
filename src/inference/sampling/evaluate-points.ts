import type { LogPosterior } from './log-posterior-reference.js';

/** Outcome codes of one evaluation (0: a number, the log-posterior). */
export const evaluationNaN = 1;
export const evaluationThrew = 2;

/** Log-posterior values of a batch; failed points hold -Infinity and a non-zero status. */
export interface EvaluatedBatch {
  readonly values: Float64Array;
  readonly status: Uint8Array;
  /** Message of the first exception in the batch, if any. */
  readonly firstError: string | null;
}

/**
 * Evaluate `count` points stored row-wise in `points` (count x dim). A value
 * of NaN counts as zero probability; an exception is caught and its message kept.
 */
export function evaluatePoints(logPost: LogPosterior, points: Float64Array, dim: number): EvaluatedBatch {
  const count = points.length / dim;
  const values = new Float64Array(count);
  const status = new Uint8Array(count);
  let firstError: string | null = null;
  for (let i = 0; i < count; i++) {
    const theta = points.subarray(i * dim, (i + 1) * dim);
    try {
      const v = logPost(theta);
      if (Number.isNaN(v) || typeof v !== 'number') {
        values[i] = -Infinity;
        status[i] = evaluationNaN;
      } else {
        values[i] = v;
      }
    } catch (err) {
      values[i] = -Infinity;
      status[i] = evaluationThrew;
      firstError ??= err instanceof Error ? err.message : String(err);
    }
  }
  return { values, status, firstError };
}
