import { legendre } from '../../numerics/legendre.js';
import type { MeasuredEntry } from '../data-vector.js';
import { shellModeAverage, type ModeCountSource } from './mode-counts.js';

/**
 * Gaussian covariance of the power multipoles, diagonal in k bins:
 *   Cov[P_l(k), P_l'(k)] = (2l+1)(2l'+1) (2 / N_k) < L_l(mu) L_l'(mu) Ptot(k, mu)^2 >_shell,
 *   Ptot(k, mu) = sum_a P_a(k) L_a(mu) (+ 1/nbar unless the model holds the noise),
 * the shell average being (1/2) int dmu in the continuum (so that for l = l' = 0
 * and no anisotropy it is the familiar 2 Ptot^2 / N_k; common practice, e.g.
 * Grieb et al. 2016, MNRAS 457, 1577, in the thin-shell limit). P_a are the model
 * multipoles of the data vector's own P blocks at the fiducial point.
 * Writes into the row-major n x n matrix `out`.
 */
export interface PowerCovarianceInputs {
  readonly entries: readonly MeasuredEntry[];
  /** Model vector over all entries at the fiducial parameters. */
  readonly theory: Float64Array;
  /** Noise added to the model power: 1/nbar, or 0 when the model already holds it. */
  readonly shotNoise: number;
  readonly dk: number;
  readonly volume: number;
  readonly boxSize: number | undefined;
  readonly modeCounts: ModeCountSource;
}

export function addGaussianPowerCovariance(inp: PowerCovarianceInputs, out: Float64Array): void {
  const n = inp.entries.length;
  // Entries of each k bin: bin -> list of data-vector indices (one per multipole).
  const byBin = new Map<number, number[]>();
  inp.entries.forEach((e, i) => {
    if (e.statistic !== 'P') return;
    const list = byBin.get(e.bin) ?? [];
    list.push(i);
    byBin.set(e.bin, list);
  });
  for (const idx of byBin.values()) {
    const first = inp.entries[idx[0]];
    const modes = shellModeAverage(inp.modeCounts, first.k[0], inp.dk, first.count, inp.volume, inp.boxSize);
    for (let q = 0; q < modes.mu.length; q++) {
      const mu = modes.mu[q];
      let ptot = inp.shotNoise;
      for (const i of idx) ptot += inp.theory[i] * legendre(inp.entries[i].ell, mu);
      const w = (2 * modes.weight[q] * ptot * ptot) / modes.count;
      for (const a of idx) {
        const la = (2 * inp.entries[a].ell + 1) * legendre(inp.entries[a].ell, mu);
        for (const b of idx) out[a * n + b] += w * la * (2 * inp.entries[b].ell + 1) * legendre(inp.entries[b].ell, mu);
      }
    }
  }
}
