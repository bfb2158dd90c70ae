import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { angleAveragedBaoDamping } from './ir-resummed-power.js';

/**
 * A linear spectrum whose wiggles carry the line-of-sight average of the
 * leading-order IR damping, P_nw(k) + D(k) P_w(k) with
 * D(k) = int_0^1 exp(-k^2 Sigma_tot^2(mu)) dmu (ir-resummed-power.ts). Used
 * without further resummation it gives the bispectrum with angle-averaged BAO
 * damping: every P is then independent of its angle to the line of sight, so
 * the model is a polynomial in the cosines. This is an approximation to the
 * per-leg damping exp(-k^2 Sigma_tot^2(mu_i)) (docs/bispectrum-convergence.md
 * gives its size); the wiggle-free part is untouched.
 */
export class AngleAveragedIrSpectrum implements LinearSpectrum {
  readonly redshift: number;
  readonly kMin: number;
  readonly kMax: number;
  readonly growthRateLargeScale: number;
  readonly sigma2BAO: number;
  readonly deltaSigma2BAO: number;
  readonly sigma8: number;
  private readonly source: LinearSpectrum;
  private readonly f: number;

  /** `f` is the growth rate inside Sigma_tot^2. */
  constructor(source: LinearSpectrum, f: number) {
    this.source = source;
    this.f = f;
    this.redshift = source.redshift;
    this.kMin = source.kMin;
    this.kMax = source.kMax;
    this.growthRateLargeScale = source.growthRateLargeScale;
    this.sigma2BAO = source.sigma2BAO;
    this.deltaSigma2BAO = source.deltaSigma2BAO;
    this.sigma8 = source.sigma8;
  }

  power(k: number): number {
    const nw = this.source.powerNoWiggle(k);
    return nw + angleAveragedBaoDamping(this.source, this.f, k) * (this.source.power(k) - nw);
  }

  powerNoWiggle(k: number): number {
    return this.source.powerNoWiggle(k);
  }

  growthRate(k: number): number {
    return this.source.growthRate(k);
  }
}
