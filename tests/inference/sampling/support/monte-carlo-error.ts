import { integratedAutocorrelationTime } from '../../../../src/inference/diagnostics/autocorrelation-time.js';
import type { ChainHistory } from '../../../../src/inference/sampling/chain-history.js';

/**
 * Estimate of a mean over the draws of all members, with its Monte Carlo
 * standard error sd / sqrt(N / tau), tau the Sokal-windowed autocorrelation
 * time of the same per-member series (N draws in all).
 */
export function meanWithError(series: Float64Array[]): { value: number; error: number } {
  let n = 0;
  let sum = 0;
  for (const s of series) {
    for (const v of s) sum += v;
    n += s.length;
  }
  const value = sum / n;
  let ss = 0;
  for (const s of series) for (const v of s) ss += (v - value) ** 2;
  const { tau } = integratedAutocorrelationTime(series);
  return { value, error: Math.sqrt(ss / (n - 1) / (n / tau)) };
}

/** Mean and covariance estimates of the kept draws, each with its Monte Carlo standard error. */
export function momentsWithErrors(history: ChainHistory, from: number) {
  const d = history.dim;
  const draws = Array.from({ length: d }, (_, p) => history.seriesByMember(p, from));
  const means = draws.map((x) => meanWithError(x));
  const cov: { value: number; error: number }[][] = [];
  for (let i = 0; i < d; i++) {
    cov.push([]);
    for (let j = 0; j < d; j++) {
      const products = draws[i].map((xi, m) => xi.map((v, t) => (v - means[i].value) * (draws[j][m][t] - means[j].value)));
      cov[i].push(meanWithError(products));
    }
  }
  return { means, cov };
}
