import { describe, expect, it } from 'vitest';
import { PowerMultipoleModel, mapObservedToTrue } from '../../src/power/index.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';
import { scipyMultipoles, worstDeviationFromFixture } from './support/scipy-fixture.js';

const spectrum = analyticSpectrum();
const cosmological = { b1: 1.9, f: 0.7, pCt0: 2, pCt2: -1, pCt4: 0.5, pCtFog: 3, pStochConst: 0, pStochK2Mu2: 0 };

describe('Alcock–Paczynski distortion', () => {
  it('is the identity at alphaPar = alphaPerp = 1, bit for bit', () => {
    const k = Float64Array.of(0.013, 0.1, 0.377);
    const mu = Float64Array.of(0, 0.3141, 0.99);
    const q = new Float64Array(3);
    const nu = new Float64Array(3);
    mapObservedToTrue(k, mu, 1, 1, q, nu);
    expect(Array.from(q)).toEqual(Array.from(k));
    expect(Array.from(nu)).toEqual(Array.from(mu));
  });

  it('gives P_l(k) = P_l(k/a) / a^3 for an isotropic dilation (Ballinger, Peacock & Heavens 1996, MNRAS 282, 877)', () => {
    for (const a of [0.95, 1.07]) {
      const dilated = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.02, dk: 0.01, count: 30 }, nbar: 1e-3 });
      const reference = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.02 / a, dk: 0.01 / a, count: 30 }, nbar: 1e-3 });
      const got = dilated.evaluate({ ...cosmological, alphaPar: a, alphaPerp: a });
      const want = reference.evaluate(cosmological);
      for (let e = 0; e < got.length; e++) {
        const scale = Math.abs(want[e % 30]); // the monopole of the same bin
        expect(Math.abs(got[e] - want[e] / a ** 3) / scale).toBeLessThan(1e-12);
      }
    }
  });

  it('leaves the stochastic terms, defined in observed coordinates, unchanged', () => {
    const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.05, dk: 0.05, count: 5 }, nbar: 4e-4 });
    const shotOnly = { b1: 0, f: 0, pStochConst: 1.2, pStochK2Mu2: 30 };
    const at1 = model.evaluate(shotOnly);
    const moved = model.evaluate({ ...shotOnly, alphaPar: 1.1, alphaPerp: 0.9 });
    for (let e = 0; e < at1.length; e++) expect(moved[e]).toBeCloseTo(at1[e], 8);
    expect(at1[0]).toBeCloseTo((1.2 + (30 * 0.05 ** 2) / 3) / 4e-4, 8); // <mu^2> = 1/3 in the monopole
  });

  it('matches a scipy quadrature of the full anisotropic model (counterterms, stochastic terms, IR damping)', () => {
    const c = scipyMultipoles.cases['full-ap'];
    const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.01, dk: 0.01, count: 40 }, nbar: c.params.nbar });
    const out = model.evaluate(c.params);
    expect(worstDeviationFromFixture(out, c)).toBeLessThan(1e-12);
  });
});
