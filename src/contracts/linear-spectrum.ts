/**
 * The contract between linear theory (src/cosmology) and every model built on
 * it (src/power, src/bispectrum, src/mocks). A LinearSpectrum is the linear
 * power spectrum of the field the galaxies trace at one redshift: with massive
 * neutrinos that is the cold (cdm + baryon) field, see docs/conventions.md.
 *
 * Units: k in h/Mpc, P in (Mpc/h)^3, Sigma^2 in (Mpc/h)^2.
 */
export interface LinearSpectrum {
  readonly redshift: number;
  /** Range over which the spectrum is trusted (table range or build range). */
  readonly kMin: number;
  readonly kMax: number;
  /** Linear power P_lin(k) of the traced field. */
  power(k: number): number;
  /** Smooth (no-wiggle) part P_nw(k); P_w = P_lin - P_nw. */
  powerNoWiggle(k: number): number;
  /** Linear growth rate f(k) = dln D / dln a of the traced field. */
  growthRate(k: number): number;
  /** Scale-independent (large-scale, k -> 0) growth rate. */
  readonly growthRateLargeScale: number;
  /**
   * BAO damping scales from the no-wiggle spectrum (JCAP 07 (2018) 053; PRD 92
   * (2015) 043514): Sigma^2 and delta Sigma^2 entering
   * Sigma_tot^2(mu) = [1 + f mu^2 (2 + f)] Sigma^2 + f^2 mu^2 (mu^2 - 1) delta Sigma^2.
   */
  readonly sigma2BAO: number;
  readonly deltaSigma2BAO: number;
  /** sigma8 of the traced field at this redshift. */
  readonly sigma8: number;
}

/** A spectrum with the redshift, range, growth, BAO scales and sigma8 of `source` and new power functions. */
export function withPowerOf(source: LinearSpectrum, power: (k: number) => number, powerNoWiggle: (k: number) => number): LinearSpectrum {
  return {
    redshift: source.redshift,
    kMin: source.kMin,
    kMax: source.kMax,
    power,
    powerNoWiggle,
    growthRate: (k) => source.growthRate(k),
    growthRateLargeScale: source.growthRateLargeScale,
    sigma2BAO: source.sigma2BAO,
    deltaSigma2BAO: source.deltaSigma2BAO,
    sigma8: source.sigma8,
  };
}
