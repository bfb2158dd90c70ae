import { describe, expect, it } from 'vitest';
import { enumerateTriangleBins, shellCentre, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { legendre } from '../../src/numerics/legendre.js';
import { fundamentalFrequency, latticeShell } from '../../src/numerics/lattice-shell.js';
import { measureBispectrumMultipoles } from '../../src/mocks/bispectrum-multipoles.js';
import { gaussianFieldSpectrum } from '../../src/mocks/gaussian-field.js';
import { linearGalaxySpectrum } from '../../src/mocks/linear-galaxy-field.js';
import { measurePowerMultipoles } from '../../src/mocks/power-multipoles.js';
import { secondOrderGalaxySpectrum } from '../../src/mocks/second-order-field.js';

const mesh = { n: 32, boxSize: 800 };
const kf = fundamentalFrequency(mesh.boxSize);
/** Smooth analytic test spectrum (invented shape; it is only the input of the mock). */
const power = (k: number) => 2e4 * (k / 0.02) / (1 + (k / 0.02) ** 2) ** 1.2;
const shells = shellGrid(2 * kf, 14 * kf, 2 * kf);

/**
 * Expectation and standard deviation of the FFT estimator of P_l for a Gaussian
 * field with P(k, mu) = Z1(mu)^2 P(k), summed over the same lattice modes
 * (src/numerics/lattice-shell.ts). With N_k modes (k and -k both counted,
 * N_k/2 independent), Var P_l = 2 (2l+1)^2 / N_k^2 sum_k [P(k, mu) L_l(mu)]^2
 * (common practice: |delta_k|^2 is exponentially distributed for a Gaussian field).
 */
function latticeExpectation(s: number, l: number, b1: number, f: number): { mean: number; sd: number } {
  const c = shellCentre(shells, s);
  const lat = latticeShell(mesh.boxSize, c - shells.dk / 2, c + shells.dk / 2);
  let sum = 0;
  let sum2 = 0;
  for (let m = 0; m < lat.count; m++) {
    const k = kf * Math.sqrt(lat.normSquared[m]);
    const mu = (kf * lat.vectors[3 * m + 2]) / k;
    const pkmu = (b1 + f * mu * mu) ** 2 * power(k) * legendre(l, mu);
    sum += pkmu;
    sum2 += pkmu * pkmu;
  }
  return { mean: ((2 * l + 1) * sum) / lat.count, sd: ((2 * l + 1) * Math.sqrt(2 * sum2)) / lat.count };
}

describe('Gaussian random fields', () => {
  it('is reproducible from its seed', () => {
    const a = gaussianFieldSpectrum(mesh, power, 11);
    const b = gaussianFieldSpectrum(mesh, power, 11);
    const c = gaussianFieldSpectrum(mesh, power, 12);
    expect(a).toEqual(b);
    expect(a[40]).not.toBe(c[40]);
  });

  it('measured P_0, P_2, P_4 of a Kaiser field match the input within the mode-count errors', () => {
    const [b1, f] = [1.5, 0.7];
    const realisations = 6;
    let chi2 = 0;
    let dof = 0;
    const sums = { p0: new Float64Array(shells.count), p2: new Float64Array(shells.count), p4: new Float64Array(shells.count) };
    for (let r = 0; r < realisations; r++) {
      const spec = linearGalaxySpectrum(gaussianFieldSpectrum(mesh, power, 100 + r), mesh, b1, f);
      const p = measurePowerMultipoles(spec, mesh, shells);
      for (const key of ['p0', 'p2', 'p4'] as const) for (let s = 0; s < shells.count; s++) sums[key][s] += p[key][s] / realisations;
    }
    for (const [key, l] of [['p0', 0], ['p2', 2], ['p4', 4]] as const) {
      for (let s = 0; s < shells.count; s++) {
        const { mean, sd } = latticeExpectation(s, l, b1, f);
        chi2 += ((sums[key][s] - mean) / (sd / Math.sqrt(realisations))) ** 2;
        dof++;
      }
    }
    // P_0, P_2, P_4 of one shell are correlated, so chi2/dof scatters more than sqrt(2/dof).
    expect(chi2 / dof).toBeGreaterThan(0.3);
    expect(chi2 / dof).toBeLessThan(2.2);
  });

  it('measured B_0 of a Gaussian field is consistent with zero; a second-order field is not', () => {
    const bins = enumerateTriangleBins(shellGrid(2 * kf, 8 * kf, 2 * kf));
    const spec = gaussianFieldSpectrum(mesh, power, 7);
    const p = measurePowerMultipoles(spec, mesh, bins.shells);
    const g = measureBispectrumMultipoles(spec, mesh, bins);
    const nl = measureBispectrumMultipoles(secondOrderGalaxySpectrum(spec, mesh, { b1: 1, b2: 2, bG2: 0, f: 0 }), mesh, bins, { geometry: g });
    // Gaussian variance V s123 P1 P2 P3 / N_tri (Sefusatti et al. 2006, PRD 74, 023522,
    // in the (2 pi)^3 delta_D convention of docs/conventions.md).
    let chi2 = 0;
    let signal = 0;
    for (let b = 0; b < bins.size; b++) {
      const [i, j, l] = bins.indices.subarray(3 * b, 3 * b + 3);
      const sym = i === j && j === l ? 6 : i === j || j === l ? 2 : 1;
      const sd = Math.sqrt((mesh.boxSize ** 3 * sym * p.p0[i] * p.p0[j] * p.p0[l]) / g.counts[b]);
      chi2 += (g.b0[b] / sd) ** 2;
      signal += nl.b0[b] / sd;
    }
    expect(chi2 / bins.size).toBeGreaterThan(0.3);
    expect(chi2 / bins.size).toBeLessThan(2.5);
    expect(signal / bins.size).toBeGreaterThan(3);
  });
});
