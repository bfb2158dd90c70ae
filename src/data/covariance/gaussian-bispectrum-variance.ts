import type { MeasuredEntry } from '../data-vector.js';
import { volumeFundamentalFrequency } from './mode-counts.js';

/**
 * Diagonal Gaussian variance of the bispectrum multipoles with
 * <delta delta> = (2 pi)^3 delta_D P (docs/conventions.md):
 *   Var[B_l] = (2l+1) s123 V Ptot(k1) Ptot(k2) Ptot(k3) / N_tri,   Ptot = P_0 (+ 1/nbar unless the model holds the noise),
 * equivalently s123 (2 pi)^3 k_f^3 Ptot^3 / V123 with N_tri = V123 / k_f^6
 * (Scoccimarro 2004, PRD 70, 083007; Sefusatti et al. 2006, PRD 74, 023522, written
 * there without the (2 pi)^3 of this convention). s123 = 6, 2, 1 for equilateral,
 * isosceles and general bins (equal shells). The (2l+1) is <L_l^2> (2l+1)^2 of an
 * isotropic Ptot (the monopole approximation); different l of one triangle are
 * taken as uncorrelated.
 *   measured triangle counts: N_tri from the bundle table;
 *   bin-volume: N_tri = 8 pi^2 c1 c2 c3 dk^3 / k_f^6, halved on the closure edge
 *   c1 = c2 + c3 where only about half of the bin volume closes;
 *   lattice: the ordered triples of the periodic box (src/bispectrum/lattice), given in
 *   `latticeCounts` per table bin.
 */
export type TriangleCountSource = 'measured' | 'bin-volume' | 'lattice';

export function symmetryFactor(shells: readonly number[]): number {
  const [i, j, l] = shells;
  if (i === j && j === l) return 6;
  if (i === j || j === l) return 2;
  return 1;
}

export function binVolumeTriangleCount(k: readonly number[], dk: number, kf: number): number {
  const [c1, c2, c3] = k;
  const edge = Math.abs(c1 - c2 - c3) < 1e-9 * dk ? 0.5 : 1;
  return (edge * 8 * Math.PI ** 2 * c1 * c2 * c3 * dk ** 3) / kf ** 6;
}

export interface BispectrumVarianceInputs {
  readonly entries: readonly MeasuredEntry[];
  /** Galaxy power monopole without shot noise at any k. */
  readonly monopoleAt: (k: number) => number;
  /** Noise added to the model power: 1/nbar, or 0 when the model already holds it. */
  readonly shotNoise: number;
  readonly dk: number;
  readonly volume: number;
  readonly boxSize: number | undefined;
  readonly triangleCounts: TriangleCountSource;
  /** Lattice counts per bispectrum-table bin, for triangleCounts "lattice". */
  readonly latticeCounts?: Float64Array;
}

export function triangleCount(inp: BispectrumVarianceInputs, e: MeasuredEntry): number {
  if (inp.triangleCounts === 'measured') return e.count;
  if (inp.triangleCounts === 'lattice') return inp.latticeCounts?.[e.bin] ?? Number.NaN;
  return binVolumeTriangleCount(e.k, inp.dk, volumeFundamentalFrequency(inp.volume, inp.boxSize));
}

export function addGaussianBispectrumVariance(inp: BispectrumVarianceInputs, out: Float64Array): void {
  const n = inp.entries.length;
  inp.entries.forEach((e, i) => {
    if (e.statistic !== 'B') return;
    let p3 = 1;
    for (const k of e.kEffective) p3 *= inp.monopoleAt(k) + inp.shotNoise;
    out[i * n + i] += ((2 * e.ell + 1) * symmetryFactor(e.shells) * inp.volume * p3) / triangleCount(inp, e);
  });
}
