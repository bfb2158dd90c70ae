import { describe, expect, it } from 'vitest';
import { baoDampingSigma2, irResummedPower } from '../../src/perturbation/ir-resummed-power.js';
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
});
