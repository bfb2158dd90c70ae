import { fundamentalFrequency, latticeShell } from '../../numerics/lattice-shell.js';
import { gaussLegendreOn } from '../../numerics/gauss-legendre.js';

/**
 * Where the number of independent modes in a k shell (and their line-of-sight
 * cosines) comes from, for the Gaussian covariance:
 *   measured:   the count in the bundle table, with mu uniform on [-1, 1];
 *   continuous: N_k = 4 pi k^2 dk V / (2 pi)^3 at the shell centre, mu uniform;
 *   lattice:    the vectors of the periodic box in [k - dk/2, k + dk/2)
 *               (src/numerics/lattice-shell.ts), their own mu values.
 * Counts include both k and -k, as an FFT estimator sums over them.
 */
export type ModeCountSource = 'measured' | 'continuous' | 'lattice';

export interface ShellModeAverage {
  readonly count: number;
  /** Cosines to average over, with weights summing to 1. */
  readonly mu: Float64Array;
  readonly weight: Float64Array;
}

// 12 points integrate the degree-16 integrand L_l L_l' P(mu)^2 for l, l' <= 4 exactly (A&S 25.4.29).
const UNIFORM_MU = (() => {
  const r = gaussLegendreOn(12, -1, 1);
  return { mu: Float64Array.from(r.nodes), weight: Float64Array.from(r.weights, (w) => w / 2) };
})();

export function continuousModeCount(k: number, dk: number, volume: number): number {
  return (4 * Math.PI * k * k * dk * volume) / (2 * Math.PI) ** 3;
}

export function shellModeAverage(source: ModeCountSource, centre: number, dk: number, measured: number, volume: number, boxSize: number | undefined): ShellModeAverage {
  if (source === 'measured') return { count: measured, ...UNIFORM_MU };
  if (source === 'continuous') return { count: continuousModeCount(centre, dk, volume), ...UNIFORM_MU };
  if (boxSize === undefined) throw new Error('lattice mode counts need a periodic box (checked before)');
  const shell = latticeShell(boxSize, centre - dk / 2, centre + dk / 2);
  const mu = new Float64Array(shell.count);
  for (let v = 0; v < shell.count; v++) mu[v] = shell.vectors[3 * v + 2] / Math.sqrt(shell.normSquared[v]);
  return { count: shell.count, mu, weight: new Float64Array(shell.count).fill(1 / Math.max(shell.count, 1)) };
}

/** Fundamental frequency of the volume: 2 pi / L for a box, 2 pi / V^(1/3) for a survey. */
export function volumeFundamentalFrequency(volume: number, boxSize: number | undefined): number {
  return fundamentalFrequency(boxSize ?? Math.cbrt(volume));
}
