import { beforeAll, describe, expect, it } from 'vitest';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { addGaussianBispectrumVariance, symmetryFactor } from '../../src/data/covariance/gaussian-bispectrum-variance.js';
import { addGaussianPowerCovariance } from '../../src/data/covariance/gaussian-power-covariance.js';
import type { MeasuredEntry } from '../../src/data/data-vector.js';
import { gaussianFieldSpectrum } from '../../src/mocks/gaussian-field.js';
import { measureBispectrumMultipoles, triangleGeometryByFft } from '../../src/mocks/bispectrum-multipoles.js';
import { measurePowerMultipoles } from '../../src/mocks/power-multipoles.js';
import { shellModesOf } from '../../src/mocks/shell-modes.js';
import { fundamentalFrequency } from '../../src/numerics/lattice-shell.js';

// The normalisation of the Gaussian P and B variances confirmed with Gaussian random
// fields, as docs/REFERENCES.md asks: Monte-Carlo variances of the FFT estimators of
// src/mocks over seeded white-noise fields (P(k) = const, so B = 0 on average).
const mesh = { n: 16, boxSize: 400 };
const kf = fundamentalFrequency(mesh.boxSize);
const grid = shellGrid(2 * kf, 6 * kf, kf);
const bins = enumerateTriangleBins(grid);
const P = 2500;
const R = 300;

describe('Gaussian covariance against Gaussian random fields', () => {
  const geometry = triangleGeometryByFft(mesh, bins);
  const modes = shellModesOf(mesh, grid);
  const keep = Array.from({ length: bins.size }, (_, b) => b).filter((b) => geometry.counts[b] > 0);
  const bSum = new Float64Array(bins.size);
  const bSq = new Float64Array(bins.size);
  const pSum = [new Float64Array(grid.count), new Float64Array(grid.count)];
  const pSq = [new Float64Array(grid.count), new Float64Array(grid.count)];
  // The R realisations, measured once for both tests.
  const simulate = () => {
    for (let r = 0; r < R; r++) {
      const spec = gaussianFieldSpectrum(mesh, () => P, 1000 + r);
      const b = measureBispectrumMultipoles(spec, mesh, bins, { geometry });
      for (const t of keep) {
        bSum[t] += b.b0[t];
        bSq[t] += b.b0[t] ** 2;
      }
      const pm = measurePowerMultipoles(spec, mesh, grid, { modes });
      [pm.p0, pm.p2].forEach((v, m) => v.forEach((x, s) => ((pSum[m][s] += x), (pSq[m][s] += x * x))));
    }
  };
  beforeAll(simulate);
  const variance = (sum: number, sq: number) => (sq - (sum * sum) / R) / (R - 1);

  it('B_0: Var = s123 V P^3 / N_tri with s123 = 6, 2, 1 (Scoccimarro 2004; Sefusatti et al. 2006)', () => {
    const entries: MeasuredEntry[] = keep.map((t) => {
      const k = [0, 1, 2].map((s) => bins.centres[3 * t + s]);
      return { block: 'B0', statistic: 'B', ell: 0, k, kEffective: k, shells: [0, 1, 2].map((s) => bins.indices[3 * t + s]), count: geometry.counts[t], bin: t };
    });
    const out = new Float64Array(entries.length ** 2);
    addGaussianBispectrumVariance({ entries, monopoleAt: () => P, shotNoise: 0, dk: kf, volume: mesh.boxSize ** 3, boxSize: mesh.boxSize, triangleCounts: 'measured' }, out);
    // Mean ratio measured / predicted per symmetry class; each bin's ratio scatters by sqrt(2/R) ~ 8%.
    for (const s of [6, 2, 1]) {
      const ratios = entries.flatMap((e, a) => (symmetryFactor(e.shells) === s ? [variance(bSum[e.bin], bSq[e.bin]) / out[a * entries.length + a]] : []));
      const mean = ratios.reduce((x, y) => x + y, 0) / ratios.length;
      const tolerance = 4 * Math.sqrt(2 / (R - 1) / ratios.length);
      expect(ratios.length).toBeGreaterThan(2);
      expect(Math.abs(mean - 1)).toBeLessThan(tolerance);
    }
  });

  it('P_0 and P_2: Cov = (2l+1)(2l+1) (2/N_k) <L_l^2> P^2 over the lattice modes (common practice)', () => {
    const entries: MeasuredEntry[] = [0, 2].flatMap((ell) =>
      Array.from({ length: grid.count }, (_, s) => ({ block: `P${ell}`, statistic: 'P' as const, ell, k: [grid.kMin + s * kf], kEffective: [grid.kMin + s * kf], shells: [s], count: modes[s].count, bin: s })),
    );
    const theory = Float64Array.from(entries, (e) => (e.ell === 0 ? P : 0));
    const n = entries.length;
    const out = new Float64Array(n * n);
    addGaussianPowerCovariance({ entries, theory, shotNoise: 0, dk: kf, volume: mesh.boxSize ** 3, boxSize: mesh.boxSize, modeCounts: 'lattice' }, out);
    for (const m of [0, 1]) {
      const ratios = Array.from({ length: grid.count }, (_, s) => variance(pSum[m][s], pSq[m][s]) / out[(m * grid.count + s) * (n + 1)]);
      const mean = ratios.reduce((x, y) => x + y, 0) / ratios.length;
      expect(Math.abs(mean - 1)).toBeLessThan(4 * Math.sqrt(2 / (R - 1) / ratios.length));
    }
  });
});
