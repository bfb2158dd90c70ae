import type { LogPosterior } from '../sampling/log-posterior-reference.js';
import { withinParameterBounds, type BoundedParameter } from '../sampling/sampled-parameter.js';
import type { LocalSearchResult } from './nelder-mead.js';
import { quasiNewton } from './quasi-newton.js';
import { restartedNelderMead } from './restarted-nelder-mead.js';

/** One local maximisation of a log-posterior. */
export interface ModeClimb {
  readonly start: number[];
  readonly theta: number[];
  readonly logPosterior: number;
  readonly evaluations: number;
  readonly converged: boolean;
}

/**
 * Maximise logPost from `start`: restarted Nelder–Mead on -logPost (points
 * outside the bounds, NaN or throwing count as zero probability), with a
 * starting simplex of each parameter's scale (else a tenth of its range),
 * then a BFGS polish kept only if it improves and stays inside the bounds.
 */
export function climbFromStart(logPost: LogPosterior, parameters: readonly BoundedParameter[], start: Float64Array): ModeClimb {
  const objective = (x: Float64Array) => {
    if (!withinParameterBounds(parameters, x)) return Infinity;
    try {
      const v = -logPost(x);
      return Number.isNaN(v) ? Infinity : v;
    } catch {
      return Infinity;
    }
  };
  const step = Float64Array.from(parameters, (p) => p.scale ?? (p.upper - p.lower) / 10);
  let best: LocalSearchResult = restartedNelderMead(objective, start, { step });
  let evaluations = best.evaluations;
  if (Number.isFinite(best.value)) {
    const polished = quasiNewton(objective, best.x);
    evaluations += polished.evaluations;
    if (polished.value <= best.value && withinParameterBounds(parameters, polished.x)) best = polished;
  }
  return { start: Array.from(start), theta: Array.from(best.x), logPosterior: -best.value, evaluations, converged: best.converged };
}
