import { describe, expect, it } from 'vitest';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { TreeDirectIntegrand } from '../../src/bispectrum/tree-direct-integrand.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { kernelF2, galileonToBs2, kernelG2 } from '../../src/perturbation/kernels.js';
import { gaussLegendre } from '../../src/numerics/gauss-legendre.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const spectrum = analyticSpectrum();
const params = { b1: 1.8, b2: 0.5, bG2: -0.25, f: 0.72, bispShotPower: 0.9, bispShotConst: 1.1 };
const triangles = [
  [0.1, 0.08, 0.05],
  [0.06, 0.06, 0.06],
  [0.11, 0.07, 0.045],
];

function cosine(a: number, b: number, c: number): number {
  return (c * c - a * a - b * b) / (2 * a * b);
}

describe('tree-level bispectrum limits and symmetries', () => {
  it('Q = B / (P1P2 + P2P3 + P3P1) = 4/7 for equilateral matter triangles, any P (Fry 1984, ApJ 279, 499)', () => {
    const d = new TreeDirectIntegrand({ spectrum, irResummation: false }, { b1: 1, b2: 0, bG2: 0, f: 0, bispShotPower: 0, bispShotConst: 0 });
    const out = new Float64Array(1);
    for (const k of [0.02, 0.07, 0.2]) {
      d.evaluate(k, k, k, 0.3, 0.2, -0.5, out, 0);
      expect(out[0] / (3 * spectrum.power(k) ** 2)).toBeCloseTo(4 / 7, 14);
    }
  });

  it('f = 0 gives the real-space biased bispectrum and B_2 = 0 (Scoccimarro et al. 1999 eq. 14 with Z1 = b1)', () => {
    const model = new TreeBispectrumModel({ spectrum, triangles, irResummation: false, numberDensity: 5e-4 });
    const b = model.evaluate({ ...params, f: 0 });
    const { b1, b2, bG2 } = params;
    triangles.forEach(([k1, k2, k3], t) => {
      const p = [spectrum.power(k1), spectrum.power(k2), spectrum.power(k3)];
      const ks = [k1, k2, k3];
      let expected = 0;
      for (const [a, c, o] of [[0, 1, 2], [1, 2, 0], [2, 0, 1]]) {
        const mu = cosine(ks[a], ks[c], ks[o]);
        expected += 2 * p[a] * p[c] * (b1 ** 3 * kernelF2(ks[a], ks[c], mu) + (b1 ** 2 * b2) / 2 + b1 ** 2 * bG2 * (mu * mu - 1));
      }
      expected += (params.bispShotPower * b1 * b1 * (p[0] + p[1] + p[2])) / 5e-4 + params.bispShotConst / 25e-8;
      expect(Math.abs(b[t] / expected - 1)).toBeLessThan(1e-13);
      expect(Math.abs(b[triangles.length + t] / b[t])).toBeLessThan(1e-13);
    });
  });

  it('B_0 is symmetric under permutations of the sides; B_2 is not (its weight sits on the first side)', () => {
    const perms = [[0, 1, 2], [0, 2, 1], [1, 0, 2], [1, 2, 0], [2, 0, 1], [2, 1, 0]];
    const tri = triangles[0];
    const listed = perms.map((p) => p.map((i) => tri[i]));
    // Polynomial model (no damping, no AP, no IR): the orientation quadrature is exact, so is the symmetry.
    const exact = new TreeBispectrumModel({ spectrum, triangles: listed, irResummation: false, numberDensity: 3e-4 }).evaluate(params);
    for (let i = 1; i < 6; i++) expect(Math.abs(exact[i] / exact[0] - 1)).toBeLessThan(1e-13);
    expect(Math.abs(exact[6 + 2] / exact[6] - 1)).toBeGreaterThan(1e-3);
    // With damping and AP the symmetry holds to the quadrature's accuracy.
    const damped = new TreeBispectrumModel({ spectrum, triangles: listed, velocityDispersion: 4, numberDensity: 3e-4 });
    const b = damped.evaluate({ ...params, alphaPar: 1.03, alphaPerp: 0.98 });
    for (let i = 1; i < 6; i++) expect(Math.abs(b[i] / b[0] - 1)).toBeLessThan(1e-7);
  });

  it('an isotropic dilation alpha_par = alpha_perp = a gives B_0(k) = B_0(k/a) / a^6 exactly (AP: B scales as 1/(apar aperp^2)^2)', () => {
    const a = 1.07;
    // Untabulated spectrum: the two models would otherwise interpolate on different grids.
    const settings = { spectrum, velocityDispersion: 4, numberDensity: 3e-4, tabulateSpectrum: false };
    const dilated = new TreeBispectrumModel({ ...settings, triangles }).evaluate({ ...params, alphaPar: a, alphaPerp: a });
    const plain = new TreeBispectrumModel({ ...settings, triangles: triangles.map((t) => t.map((k) => k / a)) }).evaluate(params);
    for (let i = 0; i < dilated.length; i++) expect(Math.abs((dilated[i] * a ** 6) / plain[i] - 1)).toBeLessThan(1e-13);
  });

  it('IR resummation changes nothing without wiggles and something with them (JCAP 07 (2018) 053)', () => {
    const bins = enumerateTriangleBins(shellGrid(0.02, 0.1, 0.02));
    const smooth = analyticSpectrum({ wiggle: 0 });
    const on = new TreeBispectrumModel({ spectrum: smooth, bins, averaging: 'effective', irResummation: true }).evaluate(params);
    const off = new TreeBispectrumModel({ spectrum: smooth, bins, averaging: 'effective', irResummation: false }).evaluate(params);
    for (let i = 0; i < on.length; i++) expect(Math.abs(on[i] / off[i] - 1)).toBeLessThan(1e-12);
    const wiggly = new TreeBispectrumModel({ spectrum, bins, averaging: 'effective', irResummation: true }).evaluate(params);
    const raw = new TreeBispectrumModel({ spectrum, bins, averaging: 'effective', irResummation: false }).evaluate(params);
    expect(Math.max(...wiggly.map((v, i) => Math.abs(v / raw[i] - 1)))).toBeGreaterThan(1e-3);
  });

  it('the b_s2 convention with converted parameters reproduces the same B (kernel b2\'/2 + (b_s2/2)(mu^2 - 1/3))', () => {
    const { b2: b2s, bs2 } = galileonToBs2(params.b2, params.bG2);
    const model = new TreeBispectrumModel({ spectrum, triangles, irResummation: false });
    const b = model.evaluate({ ...params, f: 0.6 });
    // The same bispectrum written with the b_s2 kernel, summed over a fine orientation grid in the test itself.
    const f = 0.6;
    const { b1 } = params;
    triangles.forEach(([k1, k2, k3], t) => {
      const ks = [k1, k2, k3];
      const c12 = cosine(k1, k2, k3);
      const s12 = Math.sqrt(1 - c12 * c12);
      let sum = 0;
      // Gauss–Legendre in mu1 over [-1, 1] and midpoints in phi: exact for this degree-8 polynomial.
      const gl = gaussLegendre(8);
      const nPhi = 10;
      for (let i = 0; i < gl.nodes.length; i++) {
        const mu1 = gl.nodes[i];
        for (let j = 0; j < nPhi; j++) {
          const phi = (Math.PI * (j + 0.5)) / nPhi;
          const mu2 = mu1 * c12 - Math.sqrt(1 - mu1 * mu1) * s12 * Math.cos(phi);
          const mu3 = -(k1 * mu1 + k2 * mu2) / k3;
          const mus = [mu1, mu2, mu3];
          for (const [a, c, o] of [[0, 1, 2], [1, 2, 0], [2, 0, 1]]) {
            const cab = cosine(ks[a], ks[c], ks[o]);
            const muK = mus[a] * ks[a] + mus[c] * ks[c];
            const z2 =
              b1 * kernelF2(ks[a], ks[c], cab) +
              f * mus[o] ** 2 * kernelG2(ks[a], ks[c], cab) +
              0.5 * f * muK * ((mus[a] / ks[a]) * (b1 + f * mus[c] ** 2) + (mus[c] / ks[c]) * (b1 + f * mus[a] ** 2)) +
              b2s / 2 +
              (bs2 / 2) * (cab * cab - 1 / 3);
            sum += (gl.weights[i] / 2 / nPhi) * 2 * (b1 + f * mus[a] ** 2) * (b1 + f * mus[c] ** 2) * z2 * spectrum.power(ks[a]) * spectrum.power(ks[c]);
          }
        }
      }
      expect(Math.abs(sum / b[t] - 1)).toBeLessThan(1e-12);
    });
  });
});
