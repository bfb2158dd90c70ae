import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { InputError } from '../contracts/input-error.js';
import { angleAveragedIrSpectrum } from '../perturbation/angle-averaged-ir-spectrum.js';

/**
 * Everything the tree-level bispectrum holds fixed while the bias, growth-rate
 * and stochastic parameters vary (docs/conventions.md, "Bispectrum").
 */
export interface TreeBispectrumSettings {
  readonly spectrum: LinearSpectrum;
  /** Damp the BAO wiggles of every P entering B (leading-order IR resummation). Default true. */
  readonly irResummation?: boolean;
  /**
   * With IR resummation, damp each P's wiggles by the line-of-sight average of
   * exp(-k^2 Sigma_tot^2(mu)) instead of its value at the P's own mu: an
   * approximation (docs/bispectrum-convergence.md) that makes the model a
   * polynomial in the cosines, so that precomputed angular averages apply.
   * Default false.
   */
  readonly irAngleAveraged?: boolean;
  /** Growth rate inside the BAO damping Sigma_tot^2(mu); default the spectrum's large-scale f. */
  readonly fForBaoDamping?: number;
  /** Velocity dispersion sigma_v of the fingers-of-god damping, Mpc/h; default 0 (off). */
  readonly velocityDispersion?: number;
  /** Alcock–Paczynski dilations; default 1. */
  readonly alphaPar?: number;
  readonly alphaPerp?: number;
  /** Number density (h/Mpc)^3 setting the stochastic terms; omitted means no stochastic terms. */
  readonly numberDensity?: number;
}

/** Settings with defaults filled in and checked. */
export interface ResolvedTreeSettings {
  readonly spectrum: LinearSpectrum;
  readonly irResummation: boolean;
  /** The spectrum carries the angle-averaged damping (angle-averaged-ir-spectrum.ts); irResummation is then false. */
  readonly irAngleAveraged: boolean;
  readonly fForBaoDamping: number;
  readonly velocityDispersion: number;
  readonly alphaPar: number;
  readonly alphaPerp: number;
  /** 1/nbar, zero when no number density is given. */
  readonly inverseDensity: number;
}

function positive(name: string, v: number | undefined, fallback: number): number {
  const x = v ?? fallback;
  if (!Number.isFinite(x) || !(x > 0)) throw new InputError(`bispectrum settings: ${name} must be a positive number, got ${x}`);
  return x;
}

export function resolveTreeSettings(s: TreeBispectrumSettings): ResolvedTreeSettings {
  const sigma = s.velocityDispersion ?? 0;
  if (!Number.isFinite(sigma) || sigma < 0) {
    throw new InputError(`bispectrum settings: velocityDispersion must be >= 0 (Mpc/h), got ${sigma}`);
  }
  let inverseDensity = 0;
  if (s.numberDensity !== undefined) {
    if (!Number.isFinite(s.numberDensity) || !(s.numberDensity > 0)) {
      throw new InputError(`bispectrum settings: numberDensity must be positive ((h/Mpc)^3), got ${s.numberDensity}`);
    }
    inverseDensity = 1 / s.numberDensity;
  }
  const fDamp = s.fForBaoDamping ?? s.spectrum.growthRateLargeScale;
  if (!Number.isFinite(fDamp) || fDamp < 0) throw new InputError(`bispectrum settings: fForBaoDamping must be >= 0, got ${fDamp}`);
  const ir = s.irResummation ?? true;
  const averaged = ir && s.irAngleAveraged === true;
  return {
    spectrum: averaged ? angleAveragedIrSpectrum(s.spectrum, fDamp) : s.spectrum,
    irResummation: ir && !averaged,
    irAngleAveraged: averaged,
    fForBaoDamping: fDamp,
    velocityDispersion: sigma,
    alphaPar: positive('alphaPar', s.alphaPar, 1),
    alphaPerp: positive('alphaPerp', s.alphaPerp, 1),
    inverseDensity,
  };
}

/** True when the model is a polynomial in the cosines (orientation quadrature can be exact). */
export function isOrientationPolynomial(s: ResolvedTreeSettings): boolean {
  return s.velocityDispersion === 0 && !s.irResummation && s.alphaPar === 1 && s.alphaPerp === 1;
}

/** Wavenumber range of the true (undistorted) k reached from observed k in [kLo, kHi]. */
export function trueWavenumberRange(s: ResolvedTreeSettings, kLo: number, kHi: number): [number, number] {
  const aMin = Math.min(s.alphaPar, s.alphaPerp);
  const aMax = Math.max(s.alphaPar, s.alphaPerp);
  return [kLo / aMax, kHi / aMin];
}

/** Refuse configurations whose true wavenumbers leave the trusted range of the linear spectrum. */
export function checkWavenumbersInTable(s: ResolvedTreeSettings, kLo: number, kHi: number, what: string): void {
  const [qLo, qHi] = trueWavenumberRange(s, kLo, kHi);
  const { kMin, kMax } = s.spectrum;
  if (qLo < kMin * (1 - 1e-12) || qHi > kMax * (1 + 1e-12)) {
    throw new InputError(
      `${what}: wavenumbers ${qLo.toPrecision(4)}–${qHi.toPrecision(4)} h/Mpc (after AP) lie outside the linear spectrum's range ${kMin}–${kMax} h/Mpc`,
    );
  }
}
