import { chainMoments } from './chain-moments.js';
import { pooledQuantile } from './pooled-quantile.js';
import { rankNormalize } from './rank-normalize.js';
import { splitChains } from './split-chains.js';

/** Potential scale reduction sqrt(var+ / W) of chains used as given (Gelman & Rubin 1992). */
export function potentialScaleReduction(chains: readonly Float64Array[]): number {
  const { within, pooled } = chainMoments(chains);
  if (!(within > 0)) return within === 0 && pooled === 0 ? 1 : Number.NaN;
  return Math.sqrt(pooled / within);
}

/**
 * Rank-normalised split R-hat (Vehtari et al. 2021, sec. 4.1): the larger of
 * the bulk R-hat (split, rank-normalised draws) and the tail R-hat (the same
 * for the folded draws |theta - median|). Needs at least 4 draws per chain.
 */
export function rankNormalizedSplitRhat(chains: readonly Float64Array[]): number {
  const split = splitChains(chains);
  if (split[0].length < 2) return Number.NaN;
  const bulk = potentialScaleReduction(rankNormalize(split));
  const med = pooledQuantile(split, 0.5);
  const folded = split.map((c) => c.map((v) => Math.abs(v - med)));
  const tail = potentialScaleReduction(rankNormalize(folded));
  return Math.max(bulk, tail);
}
