import { nelderMead, type LocalSearchResult, type NelderMeadOptions, type Objective } from './nelder-mead.js';

/**
 * Nelder–Mead restarted from its own result with a fresh simplex of the
 * original size, until a restart no longer improves f by more than
 * fTolerance (1 + |f|) (common practice: a collapsed simplex can stall away
 * from the minimum). At most `maxRestarts` restarts (default 10).
 */
export function restartedNelderMead(f: Objective, start: Float64Array, options: NelderMeadOptions & { maxRestarts?: number }): LocalSearchResult {
  const fTol = options.fTolerance ?? 1e-12;
  let result = nelderMead(f, start, options);
  let evaluations = result.evaluations;
  for (let r = 0; r < (options.maxRestarts ?? 10); r++) {
    const next = nelderMead(f, result.x, options);
    evaluations += next.evaluations;
    const improved = result.value - next.value > fTol * (1 + Math.abs(next.value));
    if (next.value <= result.value) result = next;
    if (!improved && result.converged) break;
  }
  return { ...result, evaluations };
}
