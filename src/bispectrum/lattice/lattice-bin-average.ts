import { InputError } from '../../contracts/input-error.js';
import type { TriangleBins } from '../triangle-bins.js';
import type { TriangleIntegrand } from '../triangle-integrand.js';
import { sumLatticeTriangles } from './lattice-triangle-sum.js';
import { latticeShellTable } from './shell-table.js';

/**
 * Exact average of a triangle integrand over the discrete wavevectors of a
 * periodic box of side L (k_f = 2 pi / L), line of sight along the box z axis:
 * every lattice triple q1 + q2 + q3 = 0 with q1, q2, q3 in the half-open shells
 * i, j, l of a bin, weighted by (2l + 1) L_l(mu1) on q1 (docs/conventions.md,
 * "Discrete-box bin average").
 */
export interface LatticeBinAverage {
  readonly boxSize: number;
  readonly multipoles: readonly number[];
  /** Values per configuration of the integrand. */
  readonly size: number;
  /** Number of ordered lattice triples (q1, q2, q3) of each bin. */
  readonly counts: Float64Array;
  /** [bin][multipole][value]; NaN for a bin without lattice triangles. */
  readonly values: Float64Array;
}

export interface LatticeAverageOptions {
  /**
   * The integrand is unchanged when every mu changes sign (true of any
   * bispectrum of a real, statistically parity-invariant field in the
   * plane-parallel limit, so of the tree model). Halves the work. Default true.
   */
  readonly evenInMu?: boolean;
}

export function checkLatticeInputs(bins: TriangleBins, boxSize: number, multipoles: readonly number[]): void {
  if (!(boxSize > 0) || !Number.isFinite(boxSize)) throw new InputError(`discrete-box average: boxSize must be a positive length in Mpc/h, got ${boxSize}`);
  if (bins.size === 0) throw new InputError('discrete-box average: the binning has no triangle bins');
  if (multipoles.length === 0) throw new InputError('discrete-box average: no multipoles requested');
  for (const l of multipoles) {
    if (!Number.isInteger(l) || l < 0 || l % 2 !== 0) throw new InputError(`discrete-box average: multipoles must be even non-negative integers, got ${l}`);
  }
  const kTop = bins.shells.kMin + (bins.shells.count - 0.5) * bins.shells.dk;
  const nTop = (kTop * boxSize) / (2 * Math.PI);
  // Int16 lattice components and an Int16 shell table bound the box size.
  if (nTop > 2000) throw new InputError(`discrete-box average: k = ${kTop} h/Mpc is ${Math.round(nTop)} k_f in a box of ${boxSize} Mpc/h; at most 2000 k_f is supported`);
}

/** Exact lattice triangle counts of every bin (ordered triples (q1, q2, q3)). */
export function latticeTriangleCounts(bins: TriangleBins, boxSize: number): Float64Array {
  checkLatticeInputs(bins, boxSize, [0]);
  return sumLatticeTriangles(latticeShellTable(boxSize, bins.shells), bins, [0], null, true).counts;
}

/** The discrete-box average, computed afresh (see discreteBoxBinAverage for the cached one). */
export function latticeBinAverage(
  bins: TriangleBins,
  boxSize: number,
  multipoles: readonly number[],
  integrand: TriangleIntegrand,
  options: LatticeAverageOptions = {},
): LatticeBinAverage {
  checkLatticeInputs(bins, boxSize, multipoles);
  if (!Number.isInteger(integrand.size) || integrand.size < 1) throw new InputError(`discrete-box average: integrand size must be a positive integer, got ${integrand.size}`);
  const table = latticeShellTable(boxSize, bins.shells);
  const { counts, sums } = sumLatticeTriangles(table, bins, multipoles, integrand, options.evenInMu ?? true);
  const values = sums as Float64Array;
  const perBin = multipoles.length * integrand.size;
  for (let b = 0; b < bins.size; b++) {
    for (let o = b * perBin; o < (b + 1) * perBin; o++) values[o] = counts[b] > 0 ? values[o] / counts[b] : Number.NaN;
  }
  return { boxSize, multipoles: [...multipoles], size: integrand.size, counts, values };
}
