import { describe, expect, it } from 'vitest';
import { PowerMultipoleModel } from '../../src/power/index.js';
import { analyticSpectrum, analyticWiggle } from './support/analytic-spectrum.js';
import { scipyMultipoles, worstDeviationFromFixture } from './support/scipy-fixture.js';

const bins = { kMin: 0.01, dk: 0.01, count: 40 };
const kaiser = { b1: 2, f: 0.75, pStochConst: 0 };

describe('IR resummation in the multipoles', () => {
  it('changes nothing when the spectrum has no wiggles', () => {
    const smooth = analyticSpectrum({ wiggles: false });
    const damped = new PowerMultipoleModel({ spectrum: smooth, bins, nbar: 1e-3 }).evaluate(kaiser);
    const noScales = { ...smooth, sigma2BAO: 0, deltaSigma2BAO: 0 };
    const undamped = new PowerMultipoleModel({ spectrum: noScales, bins, nbar: 1e-3 }).evaluate(kaiser);
    // Kaiser 1987 (MNRAS 227, 1): P0 = (b^2 + 2bf/3 + f^2/5) P_lin, independent of any damping scale.
    const r0 = 4 + 1 + 0.75 ** 2 / 5;
    for (let i = 0; i < 40; i++) {
      expect(damped[i]).toBe(undamped[i]);
      expect(Math.abs(damped[i] / smooth.power(0.01 * (i + 1)) / r0 - 1)).toBeLessThan(1e-13);
    }
  });

  it('matches a direct quadrature of the published formula (scipy fixture, JCAP 07 (2018) 053)', () => {
    const model = new PowerMultipoleModel({ spectrum: analyticSpectrum(), bins, nbar: 1e-3 });
    const c = scipyMultipoles.cases['ir-kaiser'];
    const out = model.evaluate(c.params);
    expect(worstDeviationFromFixture(out, c)).toBeLessThan(1e-12);
  });

  it('damps the BAO in P0 more strongly with k, as exp(-k^2 Sigma_tot^2(mu)) averaged over mu says', () => {
    // Damping ratio D0(k) = [P0_IR - P0_nw] / [P0_lin - P0_nw]; reference from scipy quad of
    // int (b + f mu^2)^2 exp(-k^2 Sigma_tot^2(mu)) dmu / (b^2 + 2bf/3 + f^2/5) (fixture script).
    const { b1, f, values } = scipyMultipoles.baoDampingP0;
    const wiggly = new PowerMultipoleModel({ spectrum: analyticSpectrum(), bins, nbar: 1e-3, multipoles: [0] });
    const smooth = new PowerMultipoleModel({ spectrum: analyticSpectrum({ wiggles: false }), bins, nbar: 1e-3, multipoles: [0] });
    const pw = wiggly.evaluate({ b1, f, pStochConst: 0 });
    const pnw = smooth.evaluate({ b1, f, pStochConst: 0 });
    const kaiser0 = b1 * b1 + (2 * b1 * f) / 3 + (f * f) / 5;
    let previous = 1;
    let checked = 0;
    for (let i = 0; i < 40; i++) {
      const k = 0.01 * (i + 1);
      const wiggle = analyticWiggle(k);
      if (Math.abs(wiggle) < 1e-3 * smooth.setup.spectrum.power(k)) continue; // near a node of the wiggle
      const damping = (pw[i] - pnw[i]) / (kaiser0 * wiggle);
      expect(Math.abs(damping - values[i])).toBeLessThan(1e-11);
      expect(damping).toBeLessThan(previous);
      previous = damping;
      checked++;
    }
    expect(checked).toBeGreaterThan(25);
    expect(values[9]).toBeLessThan(0.8); // damping is substantial by k = 0.1 h/Mpc
  });
});
