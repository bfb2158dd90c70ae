import { legendre } from '../../numerics/legendre.js';
import type { TriangleBins } from '../triangle-bins.js';
import type { TriangleIntegrand } from '../triangle-integrand.js';
import { axialRepresentatives } from './axial-orbits.js';
import type { LatticeShellTable } from './shell-table.js';

/**
 * Sums over every lattice triangle q1 + q2 + q3 = 0 of a periodic box with
 * q1 in shell i, q2 in shell j, q3 in shell l of a bin (i, j, l):
 *   counts[b] = number of ordered triples (q1, q2, q3) of bin b,
 *   sums[(b nM + m) size + t] = sum (2 l_m + 1) L_{l_m}(mu1) I_t(k1, k2, k3, mu1, mu2, mu3).
 *
 * q1 runs over one representative per orbit of the axial symmetry group
 * (axial-orbits.ts), weighted by the orbit size; q2 runs over all lattice
 * vectors in the lens |q2| <= K, |q1 + q2| <= K, with K the top of shell i.
 * This is exact: for a group element g, the sum over q2 at g q1 equals the sum
 * at q1 with q2 relabelled g^-1 q2, and g leaves the lengths and the mu's
 * unchanged — or, for z -> -z, flips every mu, which leaves the summand
 * unchanged only when the integrand is even under mu -> -mu (`evenInMu`).
 */
export interface LatticeTriangleSums {
  readonly counts: Float64Array;
  /** Null when no integrand was given. */
  readonly sums: Float64Array | null;
}

export function sumLatticeTriangles(
  table: LatticeShellTable,
  bins: TriangleBins,
  multipoles: readonly number[],
  integrand: TriangleIntegrand | null,
  evenInMu: boolean,
): LatticeTriangleSums {
  const nShell = bins.shells.count;
  const binOf = new Int32Array(nShell * nShell * nShell).fill(-1);
  const firstShells = new Set<number>();
  for (let b = 0; b < bins.size; b++) {
    const [i, j, l] = [bins.indices[3 * b], bins.indices[3 * b + 1], bins.indices[3 * b + 2]];
    binOf[(i * nShell + j) * nShell + l] = b;
    firstShells.add(i);
  }
  const { kf, shellOfNorm } = table;
  const root = new Float64Array(shellOfNorm.length);
  for (let a = 0; a < root.length; a++) root[a] = Math.sqrt(a);
  const counts = new Float64Array(bins.size);
  const nM = multipoles.length;
  const size = integrand ? integrand.size : 0;
  const sums = integrand ? new Float64Array(bins.size * nM * size) : null;
  const scratch = new Float64Array(size);
  const weights = new Float64Array(nM);
  // Bins whose first shell is i span [binLo[i], binHi[i]]; for one q1 the
  // integrand is summed there unweighted, then the Legendre weights of q1 applied.
  const binLo = new Int32Array(nShell).fill(bins.size);
  const binHi = new Int32Array(nShell).fill(-1);
  for (let b = 0; b < bins.size; b++) {
    const i = bins.indices[3 * b];
    binLo[i] = Math.min(binLo[i], b);
    binHi[i] = Math.max(binHi[i], b);
  }
  let span = 0;
  for (let i = 0; i < nShell; i++) span = Math.max(span, binHi[i] - binLo[i] + 1);
  const perQ1 = new Float64Array(span * size);
  const withZFlip = integrand === null || evenInMu;

  for (const i of [...firstShells].sort((a, b) => a - b)) {
    const top = table.maxNorm[i];
    const reach = Math.floor(Math.sqrt(top));
    const reps = axialRepresentatives(table.vectors[i], withZFlip);
    const base = i * nShell * nShell;
    for (let r = 0; r < reps.count; r++) {
      const x1 = reps.vectors[3 * r];
      const y1 = reps.vectors[3 * r + 1];
      const z1 = reps.vectors[3 * r + 2];
      const orbit = reps.orbitSize[r];
      const a1 = x1 * x1 + y1 * y1 + z1 * z1;
      if (a1 === 0) continue; // the k = 0 mode is never a side
      const k1 = kf * root[a1];
      const mu1 = z1 / root[a1];
      for (let m = 0; m < nM; m++) weights[m] = orbit * (2 * multipoles[m] + 1) * legendre(multipoles[m], mu1);
      const first = binLo[i];
      if (sums !== null) perQ1.fill(0, 0, (binHi[i] - first + 1) * size);
      const xLo = Math.max(-reach, -x1 - reach);
      const xHi = Math.min(reach, -x1 + reach);
      for (let x2 = xLo; x2 <= xHi; x2++) {
        const u = x1 + x2;
        const yReach2 = Math.floor(Math.sqrt(top - x2 * x2));
        const yReach3 = Math.floor(Math.sqrt(top - u * u));
        const yLo = Math.max(-yReach2, -y1 - yReach3);
        const yHi = Math.min(yReach2, -y1 + yReach3);
        for (let y2 = yLo; y2 <= yHi; y2++) {
          const v = y1 + y2;
          const t2 = x2 * x2 + y2 * y2;
          const t3 = u * u + v * v;
          const zReach2 = Math.floor(Math.sqrt(top - t2));
          const zReach3 = Math.floor(Math.sqrt(top - t3));
          const zLo = Math.max(-zReach2, -z1 - zReach3);
          const zHi = Math.min(zReach2, -z1 + zReach3);
          for (let z2 = zLo; z2 <= zHi; z2++) {
            const a2 = t2 + z2 * z2;
            const j = shellOfNorm[a2];
            if (j < 0) continue;
            const w = z1 + z2;
            const a3 = t3 + w * w;
            const l = shellOfNorm[a3];
            if (l < 0 || l > j) continue;
            const b = binOf[base + j * nShell + l];
            if (b < 0) continue;
            counts[b] += orbit;
            if (sums === null || integrand === null) continue;
            integrand.evaluate(k1, kf * root[a2], kf * root[a3], mu1, z2 / root[a2], -w / root[a3], scratch, 0);
            const o = (b - first) * size;
            for (let t = 0; t < size; t++) perQ1[o + t] += scratch[t];
          }
        }
      }
      if (sums === null) continue;
      for (let b = first; b <= binHi[i]; b++) {
        for (let m = 0; m < nM; m++) {
          const wm = weights[m];
          const o = (b * nM + m) * size;
          const p = (b - first) * size;
          for (let t = 0; t < size; t++) sums[o + t] += wm * perQ1[p + t];
        }
      }
    }
  }
  return { counts, sums };
}
