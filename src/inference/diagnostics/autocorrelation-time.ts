import { summedAutocovariance } from './autocovariance.js';

/** Sokal's window constant: the window M is the smallest lag with M >= c tau(M). */
export const defaultWindowFactor = 5;

export interface AutocorrelationTime {
  /** Integrated autocorrelation time tau = 1 + 2 sum_{t=1}^{M} rho(t). */
  readonly tau: number;
  /** The window M chosen automatically. */
  readonly window: number;
  /** False when no lag up to the series length satisfied M >= c tau(M): tau is then a lower bound. */
  readonly converged: boolean;
}

/**
 * Integrated autocorrelation time with Sokal's automatic windowing
 * (Sokal 1997, "Monte Carlo methods in statistical mechanics", sec. 3):
 * tau(M) = 1 + 2 sum_{t=1}^{M} rho(t), M = the smallest lag with M >= c tau(M).
 *
 * `series` holds one or more chains of equal length (e.g. the walkers of an
 * ensemble for one parameter). Their autocovariances are averaged before
 * normalising, so a walker that barely moves does not dominate.
 */
export function integratedAutocorrelationTime(
  series: readonly ArrayLike<number>[],
  windowFactor = defaultWindowFactor,
): AutocorrelationTime {
  if (series.length === 0) throw new RangeError('integratedAutocorrelationTime: no series given');
  const n = series[0].length;
  if (n < 2) return { tau: 1, window: 0, converged: false };
  const acov = summedAutocovariance(series); // a sum over series: the normalisation cancels below
  if (!(acov[0] > 0)) return { tau: 1, window: 0, converged: false }; // constant chains
  let tau = 1;
  for (let m = 1; m < n; m++) {
    tau += (2 * acov[m]) / acov[0];
    if (m >= windowFactor * tau) return { tau, window: m, converged: true };
  }
  return { tau, window: n - 1, converged: false };
}
