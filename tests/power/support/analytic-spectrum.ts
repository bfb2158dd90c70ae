import type { LinearSpectrum } from '../../../src/contracts/linear-spectrum.js';

/**
 * A LinearSpectrum for tests, until and besides the cosmology producer: an
 * analytic smooth spectrum plus an optional damped sinusoidal wiggle. The same
 * formulas are typed into tests/fixtures/scipy-power/redshift_multipoles.py;
 * change both together.
 */
export interface AnalyticSpectrumOptions {
  readonly wiggles?: boolean;
  readonly kMin?: number;
  readonly kMax?: number;
  /** f(k) / f(0) - 1 = growthTilt * k / (k + 0.1): a stand-in for neutrino scale dependence. */
  readonly growthTilt?: number;
}

const AMP = 3.0e6;
const K_TURN = 0.02;
const WIGGLE_AMP = 0.06;
const WIGGLE_R = 105;
const WIGGLE_KD = 0.2;
export const ANALYTIC_GROWTH_RATE = 0.75;

export function analyticNoWiggle(k: number): number {
  return (AMP * k) / (1 + (k / K_TURN) ** 2) ** 1.25;
}

export function analyticWiggle(k: number): number {
  return analyticNoWiggle(k) * WIGGLE_AMP * Math.sin(k * WIGGLE_R) * Math.exp(-((k / WIGGLE_KD) ** 2));
}

export function analyticSpectrum(options: AnalyticSpectrumOptions = {}): LinearSpectrum {
  const wiggles = options.wiggles ?? true;
  const tilt = options.growthTilt ?? 0;
  return {
    redshift: 0.5,
    kMin: options.kMin ?? 1e-4,
    kMax: options.kMax ?? 1,
    power: (k) => analyticNoWiggle(k) + (wiggles ? analyticWiggle(k) : 0),
    powerNoWiggle: analyticNoWiggle,
    growthRate: (k) => ANALYTIC_GROWTH_RATE * (1 + (tilt * k) / (k + 0.1)),
    growthRateLargeScale: ANALYTIC_GROWTH_RATE,
    sigma2BAO: 40,
    deltaSigma2BAO: 20,
    sigma8: 0.8,
  };
}
