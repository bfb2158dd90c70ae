import type { PowerCovarianceInputs } from './gaussian-power-covariance.js';
import { shellModeAverage } from './mode-counts.js';

/**
 * Leading non-Gaussian cross-covariance of the power monopole and the
 * bispectrum monopole (Sefusatti et al. 2006, PRD 74, 023522; from memory):
 *   Cov[P_0(k), B_0(k1, k2, k3)] = (2 Ptot(k) B_0(k1, k2, k3) / N_k) n(k; k1, k2, k3),
 * n = how many sides of the triangle bin have their centre in the k shell
 * [k - dk/2, k + dk/2). It follows from pairing one |delta_k|^2 of P with one
 * side of B (both k and -k give one pairing each). Other multipoles: zero.
 */
/** The same inputs as the Gaussian power covariance (the model vector holds P0 and B0). */
export type CrossCovarianceInputs = PowerCovarianceInputs;

export function addPowerBispectrumCross(inp: CrossCovarianceInputs, out: Float64Array): void {
  const n = inp.entries.length;
  const triangles = inp.entries.map((e, i) => i).filter((i) => inp.entries[i].block === 'B0');
  inp.entries.forEach((p, a) => {
    if (p.block !== 'P0') return;
    const c = p.k[0];
    const modes = shellModeAverage(inp.modeCounts, c, inp.dk, p.count, inp.volume, inp.boxSize).count;
    const ptot = inp.theory[a] + inp.shotNoise;
    for (const b of triangles) {
      let sides = 0;
      for (const k of inp.entries[b].k) if (k >= c - inp.dk / 2 && k < c + inp.dk / 2) sides++;
      if (sides === 0) continue;
      const v = (2 * ptot * inp.theory[b] * sides) / modes;
      out[a * n + b] += v;
      out[b * n + a] += v;
    }
  });
}
