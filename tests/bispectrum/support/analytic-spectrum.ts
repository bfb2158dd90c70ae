import type { LinearSpectrum } from '../../../src/contracts/linear-spectrum.js';

/**
 * A smooth analytic spectrum with an optional damped BAO-like wiggle, for checks
 * that hold for any P (identities, symmetries, scalings). Not physical data:
 *   P_nw(k) = A k / (1 + (k/k0)^2)^1.4,  P_w = P_nw a sin(k r) exp(-(k/kd)^2).
 * The same formula is coded in tests/fixtures/scipy/tree_bispectrum_orientation.py.
 */
export function analyticSpectrum(options: { wiggle?: number; f?: number; kMin?: number; kMax?: number } = {}): LinearSpectrum {
  const a = options.wiggle ?? 0.05;
  const f = options.f ?? 0.75;
  const nw = (k: number) => (2.6e6 * k) / (1 + (k / 0.02) ** 2) ** 1.4;
  return {
    redshift: 0.5,
    kMin: options.kMin ?? 1e-4,
    kMax: options.kMax ?? 1,
    power: (k) => nw(k) * (1 + a * Math.sin(k * 105) * Math.exp(-((k / 0.25) ** 2))),
    powerNoWiggle: nw,
    growthRate: () => f,
    growthRateLargeScale: f,
    sigma2BAO: 30,
    deltaSigma2BAO: 12,
    sigma8: 0.8,
  };
}
