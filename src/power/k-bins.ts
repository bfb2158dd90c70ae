import { InputError } from '../contracts/input-error.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';

/**
 * Power-spectrum k bins of docs/conventions.md: centres kMin, kMin + dk, ...,
 * shell i is the half-open [c_i - dk/2, c_i + dk/2). Units h/Mpc.
 */
export interface PowerKBins {
  /** Centre of the first bin. */
  readonly kMin: number;
  readonly dk: number;
  readonly count: number;
}

export function validatePowerKBins(bins: PowerKBins): void {
  if (!Number.isFinite(bins.dk) || bins.dk <= 0) throw new InputError(`bins.dk must be a positive number, got ${bins.dk}`);
  if (!Number.isInteger(bins.count) || bins.count < 1) {
    throw new InputError(`bins.count must be a positive integer, got ${bins.count}`);
  }
  if (!Number.isFinite(bins.kMin) || bins.kMin - bins.dk / 2 < 0) {
    throw new InputError(`bins.kMin must be at least dk/2 = ${bins.dk / 2} so that the first shell starts at k >= 0, got ${bins.kMin}`);
  }
}

export function powerBinCentre(bins: PowerKBins, i: number): number {
  return bins.kMin + i * bins.dk;
}

/** Edges [lo, hi) of shell i. */
export function powerBinEdges(bins: PowerKBins, i: number): [number, number] {
  const c = powerBinCentre(bins, i);
  return [c - bins.dk / 2, c + bins.dk / 2];
}

/**
 * Mode-weighted mean wavenumber of a continuous shell [lo, hi): weight 4 pi k^2 dk,
 * <k> = (3/4) (hi^4 - lo^4) / (hi^3 - lo^3) (common practice).
 */
export function continuumMeanK(lo: number, hi: number): number {
  return (0.75 * (hi ** 4 - lo ** 4)) / (hi ** 3 - lo ** 3);
}

/**
 * Wavevectors of a continuous shell [lo, hi) in a box of side L, counted like
 * latticeBinModes (n and -n both): (4 pi / 3)(hi^3 - lo^3) / k_f^3 with
 * k_f = 2 pi / L (common practice).
 */
export function continuumModeCount(boxSize: number, lo: number, hi: number): number {
  const kf = fundamentalFrequency(boxSize);
  return ((4 * Math.PI) / 3) * (hi ** 3 - lo ** 3) / kf ** 3;
}
