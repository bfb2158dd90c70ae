import { poolDraws } from './pool-draws.js';

/** Quantile p of all draws pooled, interpolating linearly between order statistics (numpy's default rule). */
export function pooledQuantile(chains: readonly Float64Array[], p: number): number {
  const all = poolDraws(chains).sort();
  const total = all.length;
  const h = (total - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, total - 1);
  return all[lo] + (h - lo) * (all[hi] - all[lo]);
}
