import { describe, expect, it } from 'vitest';
import { PowerMultipoleModel } from '../../src/power/index.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const linearOnly = { pStochConst: 0, pCt0: 0, pCt2: 0, pCt4: 0, pCtFog: 0 };

describe('linear redshift-space multipoles', () => {
  // Kaiser 1987 (MNRAS 227, 1) and Hamilton 1992 (ApJ 385, L5):
  // P0 = (b^2 + 2bf/3 + f^2/5) P, P2 = (4bf/3 + 4f^2/7) P, P4 = 8f^2/35 P.
  it('reproduce the Kaiser and Hamilton ratios exactly without wiggles and counterterms', () => {
    const spectrum = analyticSpectrum({ wiggles: false });
    const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.01, dk: 0.01, count: 30 }, nbar: 1e-3 });
    for (const [b, f] of [
      [1, 0.75],
      [2.1, 0.6],
      [1.4, 0.9],
    ]) {
      const out = model.evaluate({ ...linearOnly, b1: b, f });
      const ratios = [b * b + (2 * b * f) / 3 + (f * f) / 5, (4 * b * f) / 3 + (4 * f * f) / 7, (8 * f * f) / 35];
      for (let m = 0; m < 3; m++) {
        for (let i = 0; i < 30; i++) {
          const k = model.entries[m * 30 + i].k[0];
          expect(Math.abs(out[m * 30 + i] / spectrum.power(k) / ratios[m] - 1)).toBeLessThan(1e-13);
        }
      }
    }
  });

  it('use the scale-dependent growth rate f(k) = f growthRate(k) / growthRateLargeScale in Z1', () => {
    const spectrum = analyticSpectrum({ wiggles: false, growthTilt: -0.05 });
    const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.05, dk: 0.05, count: 6 }, nbar: 1e-3, multipoles: [2] });
    const b = 1.7;
    const f0 = 0.6;
    const out = model.evaluate({ ...linearOnly, b1: b, f: f0 });
    for (let i = 0; i < 6; i++) {
      const k = model.entries[i].k[0];
      const f = (f0 * spectrum.growthRate(k)) / spectrum.growthRateLargeScale;
      // Hamilton 1992 (ApJ 385, L5) quadrupole with the local growth rate.
      expect(Math.abs(out[i] / spectrum.power(k) / ((4 * b * f) / 3 + (4 * f * f) / 7) - 1)).toBeLessThan(1e-13);
    }
  });

  it('add the Poisson shot noise 1/nbar to the monopole only', () => {
    const spectrum = analyticSpectrum({ wiggles: false });
    const bins = { kMin: 0.02, dk: 0.02, count: 5 };
    const noisy = new PowerMultipoleModel({ spectrum, bins, nbar: 2e-4 }).evaluate({ b1: 2 });
    const clean = new PowerMultipoleModel({ spectrum, bins, nbar: 2e-4 }).evaluate({ b1: 2, pStochConst: 0 });
    for (let e = 0; e < 15; e++) expect(noisy[e] - clean[e]).toBeCloseTo(e < 5 ? 1 / 2e-4 : 0, 6);
  });
});
