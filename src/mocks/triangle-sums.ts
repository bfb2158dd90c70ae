import { InputError } from '../contracts/input-error.js';
import type { TriangleBins } from '../bispectrum/triangle-bins.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import type { Mesh } from './mesh.js';
import { shellsUpperEdge } from './shell-modes.js';

/**
 * Whether the FFT triangle sums of a mesh need the half-cell-shifted copy
 * (docs/conventions.md, "Mocks"). Sums over grid points of products of three
 * shell-filtered fields add every triple with k1 + k2 + k3 = 0 modulo the
 * mesh, n k_f G for an integer vector G. With every |k_i| < K:
 *   3K < n k_f           -> only G = 0 is possible: one pass;
 *   3 sqrt(2) K < 2 n k_f -> G has at most one non-zero component, +-1; the
 *                           body-centre shift flips the sign of exactly
 *                           those terms, so the mean of both passes is exact;
 *   otherwise the mesh is too coarse for these bins.
 */
export function triangleSumPasses(mesh: Mesh, bins: TriangleBins): boolean[] {
  const k = shellsUpperEdge(bins.shells);
  const span = mesh.n * fundamentalFrequency(mesh.boxSize);
  if (3 * k < span) return [false];
  if (3 * Math.SQRT2 * k < 2 * span) return [false, true];
  throw new InputError(
    `bispectrum bins up to ${k.toPrecision(6)} h/Mpc need a mesh with n > ${Math.ceil((3 * Math.SQRT2 * k) / (2 * fundamentalFrequency(mesh.boxSize)))} (mesh.n = ${mesh.n})`,
    { hint: 'lower the bispectrum kMax or use a finer mesh' },
  );
}

/**
 * Adds sum_x first[t][i](x) pair[j](x) pair[l](x) to out[t][b] for every
 * triangle bin b = (i, j, l) and every kind t, reusing the product of the
 * pair fields for all i of one (j, l).
 */
export function accumulateTriangleSums(
  bins: TriangleBins,
  first: readonly (readonly Float64Array[])[],
  pair: readonly Float64Array[],
  out: readonly Float64Array[],
): void {
  const s = bins.shells.count;
  const lookup = new Int32Array(s * s * s).fill(-1);
  for (let b = 0; b < bins.size; b++) {
    lookup[(bins.indices[3 * b] * s + bins.indices[3 * b + 1]) * s + bins.indices[3 * b + 2]] = b;
  }
  const size = pair[0].length;
  const product = new Float64Array(size);
  for (let j = 0; j < s; j++) {
    for (let l = 0; l <= j; l++) {
      let any = false;
      for (let i = j; i < s && !any; i++) any = lookup[(i * s + j) * s + l] >= 0;
      if (!any) continue;
      const pj = pair[j];
      const pl = pair[l];
      for (let x = 0; x < size; x++) product[x] = pj[x] * pl[x];
      for (let i = j; i < s; i++) {
        const b = lookup[(i * s + j) * s + l];
        if (b < 0) continue;
        for (let t = 0; t < first.length; t++) {
          const f = first[t][i];
          let sum = 0;
          for (let x = 0; x < size; x++) sum += f[x] * product[x];
          out[t][b] += sum;
        }
      }
    }
  }
}
