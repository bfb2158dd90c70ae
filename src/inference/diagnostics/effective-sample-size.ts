import { summedAutocovariance } from './autocovariance.js';
import { chainMoments } from './chain-moments.js';
import { pooledQuantile } from './pooled-quantile.js';
import { rankNormalize } from './rank-normalize.js';
import { splitChains } from './split-chains.js';

/**
 * Effective sample size of M chains of N draws (used as given, not split),
 * Vehtari et al. 2021, sec. 3.2: the multi-chain autocorrelation
 * rho_t = 1 - (W - mean_m acov_m(t)) / var+ (eq. 10), summed with Geyer's
 * initial monotone sequence: P_k = rho_2k + rho_2k+1 taken while positive,
 * forced non-increasing, tau = -1 + 2 sum_k P_k, ESS = M N / tau.
 */
export function effectiveSampleSize(chains: readonly Float64Array[]): number {
  const m = chains.length;
  const n = chains[0].length;
  if (n < 4) return Number.NaN;
  const { within, pooled } = chainMoments(chains);
  if (!(pooled > 0)) return Number.NaN;
  const meanAcov = summedAutocovariance(chains).map((v) => v / m);
  const rho = (t: number) => (t === 0 ? 1 : 1 - (within - meanAcov[t]) / pooled);
  let tau = -1;
  let previous = Infinity;
  for (let k = 0; 2 * k + 1 < n; k++) {
    let pair = rho(2 * k) + rho(2 * k + 1);
    if (!(pair > 0)) break;
    if (pair > previous) pair = previous;
    tau += 2 * pair;
    previous = pair;
  }
  return (m * n) / tau;
}

/** Bulk ESS: ESS of the split, rank-normalised chains (Vehtari et al. 2021, sec. 4.2). */
export function bulkEffectiveSampleSize(chains: readonly Float64Array[]): number {
  return effectiveSampleSize(rankNormalize(splitChains(chains)));
}

/**
 * Tail ESS: the smaller ESS of the indicators I(theta <= q05) and
 * I(theta <= q95) on the split chains (Vehtari et al. 2021, sec. 4.3).
 */
export function tailEffectiveSampleSize(chains: readonly Float64Array[]): number {
  const split = splitChains(chains);
  let least = Infinity;
  for (const p of [0.05, 0.95]) {
    const q = pooledQuantile(split, p);
    const indicator = split.map((c) => c.map((v) => (v <= q ? 1 : 0)));
    least = Math.min(least, effectiveSampleSize(indicator));
  }
  return least;
}
