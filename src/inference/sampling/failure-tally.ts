import { evaluationNaN, evaluationThrew, type EvaluatedBatch } from './evaluate-points.js';

/** Counts of failed log-posterior evaluations over a run, saved in checkpoints. */
export interface FailureCounts {
  evaluations: number;
  /** Evaluations that returned NaN (taken as zero probability). */
  nan: number;
  /** Evaluations that threw (taken as zero probability, and limited by maxLikelihoodErrors). */
  thrown: number;
  /** The first exception: its message and the point that raised it. */
  firstError: { message: string; theta: number[] } | null;
}

export function emptyFailureCounts(): FailureCounts {
  return { evaluations: 0, nan: 0, thrown: 0, firstError: null };
}

/** Add one evaluated batch (points count x dim) to the counts. */
export function tallyFailures(counts: FailureCounts, batch: EvaluatedBatch, points: Float64Array, dim: number): void {
  counts.evaluations += batch.status.length;
  for (let i = 0; i < batch.status.length; i++) {
    if (batch.status[i] === evaluationNaN) counts.nan++;
    else if (batch.status[i] === evaluationThrew) {
      counts.thrown++;
      counts.firstError ??= { message: batch.firstError ?? 'unknown error', theta: Array.from(points.subarray(i * dim, (i + 1) * dim)) };
    }
  }
}

/** The log-posterior threw more often than allowed: the run must stop. */
export class LikelihoodFailureError extends Error {
  constructor(counts: FailureCounts, limit: number, names: readonly string[]) {
    const e = counts.firstError;
    const at = e ? names.map((n, i) => `${n}=${e.theta[i]}`).join(', ') : '';
    super(
      `the log-posterior threw on ${counts.thrown} of ${counts.evaluations} evaluations (limit maxLikelihoodErrors = ${limit}); ` +
        `first error: "${e?.message}" at ${at}`,
    );
    this.name = 'LikelihoodFailureError';
  }
}
