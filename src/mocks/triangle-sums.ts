import { InputError } from '../contracts/input-error.js';
import { shellCentre, type TriangleBins } from '../bispectrum/triangle-bins.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import type { Mesh } from './mesh.js';

/**
 * Which triangle bins need the half-cell-shifted copy of the FFT sums
 * (docs/conventions.md, "Mocks"). A sum over grid points of a product of three
 * shell-filtered fields adds every triple with k1 + k2 + k3 = 0 modulo the
 * mesh, i.e. = n k_f G for an integer vector G. With |k1| + |k2| + |k3| < S
 * (S the sum of the three upper shell edges of the bin):
 *   S < n k_f             -> only G = 0 is possible: the plain sum is exact (0);
 *   sqrt(2) S < 2 n k_f   -> G has at most one non-zero component, +-1, and the
 *                            body-centre shift flips the sign of exactly those
 *                            terms, so the mean of both sums is exact (1);
 *   otherwise the mesh is too coarse for the bin (InputError).
 */
export function binsNeedingShift(mesh: Mesh, bins: TriangleBins): Uint8Array {
  const span = mesh.n * fundamentalFrequency(mesh.boxSize);
  const half = bins.shells.dk / 2;
  const out = new Uint8Array(bins.size);
  for (let b = 0; b < bins.size; b++) {
    let s = 0;
    for (let a = 0; a < 3; a++) s += shellCentre(bins.shells, bins.indices[3 * b + a]) + half;
    if (s < span) continue;
    if (Math.SQRT2 * s >= 2 * span) {
      const need = Math.ceil((Math.SQRT2 * s) / (2 * fundamentalFrequency(mesh.boxSize)));
      throw new InputError(`bispectrum: triangle bin ${b} (edges summing to ${s.toPrecision(6)} h/Mpc) needs a mesh with n > ${need}, mesh.n = ${mesh.n}`, {
        hint: 'lower the bispectrum kMax or use a finer mesh',
      });
    }
    out[b] = 1;
  }
  return out;
}

/** Block length of the grid-point loop (a multiple of 4): the blocks of all fields stay in cache together. */
const BLOCK = 2048;

/**
 * Adds sum_x first[t][i](x) second[j](x) third[l](x) to out[t][b] for every
 * triangle bin b = (i, j, l) selected by `include` (all when omitted) and every
 * kind t. The grid is walked in blocks; within a block the product of the
 * second and third fields is formed once per (j, l) and reused for every i.
 * Fields of shells no selected bin uses may be empty arrays.
 */
export function accumulateTriangleSums(
  bins: TriangleBins,
  first: readonly (readonly Float64Array[])[],
  second: readonly Float64Array[],
  third: readonly Float64Array[],
  out: readonly Float64Array[],
  include?: Uint8Array,
): void {
  // Group the selected bins by their (j, l) pair; bins come in (i, j, l) order.
  const groups = new Map<number, number[]>();
  const s = bins.shells.count;
  for (let b = 0; b < bins.size; b++) {
    if (include !== undefined && include[b] === 0) continue;
    const key = bins.indices[3 * b + 1] * s + bins.indices[3 * b + 2];
    const list = groups.get(key);
    if (list === undefined) groups.set(key, [b]);
    else list.push(b);
  }
  const size = Math.max(...second.map((p) => p.length));
  const product = new Float64Array(BLOCK);
  const pairSums = new Float64Array(2);
  for (let start = 0; start < size; start += BLOCK) {
    const end = Math.min(size, start + BLOCK);
    const len = end - start;
    for (const [key, list] of groups) {
      const pj = second[Math.floor(key / s)];
      const pl = third[key % s];
      for (let x = 0; x < len; x++) product[x] = pj[start + x] * pl[start + x];
      for (const b of list) {
        const i = bins.indices[3 * b];
        if (first.length === 2) {
          dotPair(first[0][i], first[1][i], product, start, len, pairSums);
          out[0][b] += pairSums[0];
          out[1][b] += pairSums[1];
        } else {
          for (let t = 0; t < first.length; t++) out[t][b] += dot(first[t][i], product, start, len);
        }
      }
    }
  }
}

/** sum_{x < len} f[start + x] p[x], len a multiple of 4 (four partial sums hide the add latency). */
function dot(f: Float64Array, p: Float64Array, start: number, len: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  for (let x = 0; x < len; x += 4) {
    const o = start + x;
    s0 += f[o] * p[x];
    s1 += f[o + 1] * p[x + 1];
    s2 += f[o + 2] * p[x + 2];
    s3 += f[o + 3] * p[x + 3];
  }
  return s0 + s1 + s2 + s3;
}

/** Two dots with the same p in one sweep, into out[0] and out[1]. */
function dotPair(f: Float64Array, g: Float64Array, p: Float64Array, start: number, len: number, out: Float64Array): void {
  let a0 = 0;
  let a1 = 0;
  let c0 = 0;
  let c1 = 0;
  for (let x = 0; x < len; x += 2) {
    const o = start + x;
    const p0 = p[x];
    const p1 = p[x + 1];
    a0 += f[o] * p0;
    a1 += f[o + 1] * p1;
    c0 += g[o] * p0;
    c1 += g[o + 1] * p1;
  }
  out[0] = a0 + a1;
  out[1] = c0 + c1;
}

/** Shells used by the selected bins. */
export function shellsUsed(bins: TriangleBins, include: Uint8Array): Uint8Array {
  const used = new Uint8Array(bins.shells.count);
  for (let b = 0; b < bins.size; b++) if (include[b]) for (let a = 0; a < 3; a++) used[bins.indices[3 * b + a]] = 1;
  return used;
}
