import { describe, expect, it } from 'vitest';
import { angleAveragedBaoDamping, baoDampingSigma2, irResummedPower } from '../../src/perturbation/ir-resummed-power.js';
import { analyticSpectrum } from '../bispectrum/support/analytic-spectrum.js';

describe('IR-resummed power', () => {
  it('leaves a spectrum without wiggles unchanged (JCAP 07 (2018) 053: only P_w is damped)', () => {
    const s = analyticSpectrum({ wiggle: 0 });
    for (const k of [0.01, 0.1, 0.3]) for (const mu of [0, 0.6, 1]) expect(irResummedPower(s, k, mu, 0.8)).toBe(s.power(k));
  });

  it('damps the wiggle by exp(-k^2 Sigma_tot^2) with Sigma_tot^2 = Sigma^2 at mu = 0 and (1 + f)^2 Sigma^2 at mu = 1 (JCAP 07 (2018) 053)', () => {
    const s = analyticSpectrum({ wiggle: 0.05 });
    const f = 0.7;
    expect(baoDampingSigma2(s, f, 0)).toBeCloseTo(s.sigma2BAO, 13);
    expect(baoDampingSigma2(s, f, 1)).toBeCloseTo((1 + f) ** 2 * s.sigma2BAO, 12);
    const k = 0.135;
    const pw = s.power(k) - s.powerNoWiggle(k);
    expect((irResummedPower(s, k, 0, f) - s.powerNoWiggle(k)) / (Math.exp(-k * k * s.sigma2BAO) * pw)).toBeCloseTo(1, 12);
    expect(Math.abs(pw) / s.power(k)).toBeGreaterThan(1e-2);
  });

  it('averages the damping over the line of sight: 24-point rule = 4000-interval composite Simpson to 1e-13; 1 when Sigma = 0 (common practice: the mean of the factor)', () => {
    const s = analyticSpectrum({ wiggle: 0.05 });
    for (const f of [0, 0.8, 1.2]) {
      for (const k of [0.02, 0.15, 0.3]) {
        const n = 4000;
        let simpson = 0;
        for (let i = 0; i <= n; i++) {
          const w = i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2;
          simpson += w * Math.exp(-k * k * baoDampingSigma2(s, f, i / n));
        }
        simpson /= 3 * n;
        expect(k * k * baoDampingSigma2(s, f, 1)).toBeLessThan(20);
        expect(Math.abs(angleAveragedBaoDamping(s, f, k) / simpson - 1)).toBeLessThan(1e-13);
      }
    }
    const undamped = { ...s, sigma2BAO: 0, deltaSigma2BAO: 0 };
    expect(angleAveragedBaoDamping(undamped, 0.8, 0.2)).toBeCloseTo(1, 14);
  });
});
