import { describe, expect, it } from 'vitest';
import { validateCosmology } from '../../src/cosmology/cosmology-parameters.js';
import { eisensteinHu98, soundHorizonFitEH98 } from '../../src/cosmology/eisenstein-hu-1998.js';
import { linearPowerFromCosmology } from '../../src/cosmology/linear-power-from-cosmology.js';
import { NEUTRINO_EV_PER_OMEGA } from '../../src/cosmology/physical-constants.js';

// Planck 2018 best fit (A&A 641, A6, Table 2, from memory).
const planck = { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044 };

describe('Eisenstein & Hu 1998 sound horizon', () => {
  it('eq. 26 fit agrees with the eq. 6 sound horizon to 2% over 0.05 <= omega_m <= 0.25 (EH98, text after eq. 26, from memory)', () => {
    let worst = 0;
    for (let om = 0.05; om <= 0.2501; om += 0.01) {
      for (let ob = 0.0125; ob <= 0.05; ob += 0.0025) {
        const p = eisensteinHu98(0.7, om, ob, 2.7255);
        worst = Math.max(worst, Math.abs(p.soundHorizonFit / p.soundHorizon - 1));
      }
    }
    expect(worst).toBeLessThan(0.02);
  });
  it('eq. 26 at the Planck 2018 densities is within 2% of the Planck r_drag = 147.09 Mpc (A&A 641, A6, Table 2, from memory)', () => {
    const s = soundHorizonFitEH98(planck.omegaB + planck.omegaCdm + 0.06 / NEUTRINO_EV_PER_OMEGA, planck.omegaB);
    expect(Math.abs(s / 147.09 - 1)).toBeLessThan(0.02);
  });
  it('eq. 26 evaluates the printed formula 44.5 ln(9.83/omega_m) / sqrt(1 + 10 omega_b^0.75)', () => {
    expect(soundHorizonFitEH98(0.15, 0.02)).toBeCloseTo((44.5 * Math.log(9.83 / 0.15)) / Math.sqrt(1 + 10 * 0.02 ** 0.75), 12);
  });
});

describe('normalisation', () => {
  it('sigma8 from the Planck 2018 A_s is within 3% of the Planck sigma8 = 0.811 (A&A 641, A6, Table 2, from memory)', () => {
    const lp = linearPowerFromCosmology(validateCosmology({ ...planck, mNu: 0.06, massiveNuCount: 1 }), 0);
    expect(Math.abs(lp.sigma8MatterToday / 0.811 - 1)).toBeLessThan(0.03);
  });
  it('sigma8 normalisation reproduces the requested sigma8 and the A_s it implies gives it back', () => {
    const bySigma8 = linearPowerFromCosmology(validateCosmology({ ...planck, lnAs: undefined, sigma8: 0.79, mNu: 0.15 }), 0.8);
    expect(bySigma8.sigma8MatterToday).toBeCloseTo(0.79, 12);
    const byAs = linearPowerFromCosmology(validateCosmology({ ...planck, lnAs: bySigma8.lnAs, mNu: 0.15 }), 0.8);
    expect(byAs.power(0.1) / bySigma8.power(0.1) - 1).toBeCloseTo(0, 10);
  });
  it('sigma8 from the grid agrees with an independent Gauss–Legendre integral of the same spectrum to 1e-5', () => {
    const lp = linearPowerFromCosmology(validateCosmology(planck), 0);
    // 40 panels x 24 nodes in ln k over [1e-5, 100] h/Mpc; top-hat W(x) = 3 (sin x - x cos x)/x^3 (Peebles 1980, sec. 26).
    const nodes = [-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498, 0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363];
    const weights = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620, 0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];
    const lo = Math.log(1e-5);
    const hi = Math.log(100);
    const panels = 400;
    let sum = 0;
    for (let p = 0; p < panels; p++) {
      const a = lo + ((hi - lo) * p) / panels;
      const half = (hi - lo) / panels / 2;
      nodes.forEach((t, i) => {
        const k = Math.exp(a + half * (1 + t));
        const x = 8 * k;
        const w = (3 * (Math.sin(x) - x * Math.cos(x))) / x ** 3;
        sum += half * weights[i] * k ** 3 * lp.power(k) * w * w;
      });
    }
    expect(Math.abs(Math.sqrt(sum / (2 * Math.PI ** 2)) / lp.sigma8 - 1)).toBeLessThan(1e-5);
  });
  it('P scales as D(z)^2 without neutrinos, and the no-wiggle part joins P outside the BAO range', () => {
    const p = validateCosmology(planck);
    const z0 = linearPowerFromCosmology(p, 0);
    const z1 = linearPowerFromCosmology(p, 1);
    expect(z1.power(0.2) / z0.power(0.2)).toBeCloseTo((z1.growthFactor / z0.growthFactor) ** 2, 12);
    expect(Math.abs(z0.powerNoWiggle(1e-4) / z0.power(1e-4) - 1)).toBeLessThan(1e-3);
  });
});

describe('massive neutrinos (Eisenstein & Hu 1999)', () => {
  // Rule of thumb Delta P / P ~ -8 f_nu for the total matter on small scales at fixed Omega_m
  // (Hu, Eisenstein & Tegmark 1998, PRL 80, 5255), good to tens of percent.
  const omegaM = planck.omegaB + planck.omegaCdm;
  const suppression = (mNu: number, species: number, k: number) => {
    const fNu = mNu / NEUTRINO_EV_PER_OMEGA / omegaM;
    const massless = linearPowerFromCosmology(validateCosmology({ ...planck, mNu: 0 }), 0);
    const massive = linearPowerFromCosmology(
      validateCosmology({ ...planck, omegaCdm: planck.omegaCdm - mNu / NEUTRINO_EV_PER_OMEGA, mNu, massiveNuCount: species }),
      0,
    );
    return (massive.powerMatter(k) / massless.powerMatter(k) - 1) / (-8 * fNu);
  };
  for (const mNu of [0.1, 0.2, 0.3]) {
    it(`one massive species of ${mNu} eV: small-scale suppression at z = 0 within 25% of -8 f_nu`, () => {
      for (const k of [1, 3]) expect(Math.abs(suppression(mNu, 1, k) - 1)).toBeLessThan(0.25);
    });
  }
  for (const mNu of [0.2, 0.3]) {
    it(`three degenerate species summing to ${mNu} eV: within 25% of -8 f_nu`, () => {
      for (const k of [1, 3]) expect(Math.abs(suppression(mNu, 3, k) - 1)).toBeLessThan(0.25);
    });
  }
  it('the cold field is suppressed less than the total matter, and both join the massless case on large scales', () => {
    const lp = linearPowerFromCosmology(validateCosmology({ ...planck, mNu: 0.2 }), 0.5);
    expect(lp.power(1)).toBeGreaterThan(lp.powerMatter(1));
    expect(Math.abs(lp.power(1e-4) / lp.powerMatter(1e-4) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(lp.growthRate(1e-4) / lp.growthRateLargeScale - 1)).toBeLessThan(1e-3);
    // Small scales: f_cb -> f (1 - p_cb), p_cb = (5 - sqrt(1 + 24 f_cb)) / 4 (EH99 eq. 11).
    const fNu = 0.2 / NEUTRINO_EV_PER_OMEGA / (omegaM + 0.2 / NEUTRINO_EV_PER_OMEGA);
    const pCb = (5 - Math.sqrt(1 + 24 * (1 - fNu))) / 4;
    expect(lp.growthRate(50) / lp.growthRateLargeScale).toBeCloseTo(1 - pCb, 3);
    // Far below the free-streaming length the neutrinos do not cluster, delta_m = f_cb delta_cb: equal rates.
    expect(lp.growthRateMatter(50) / lp.growthRate(50)).toBeCloseTo(1, 6);
  });
});

describe('scale-dependent growth with massive neutrinos', () => {
  const p = validateCosmology({ ...planck, mNu: 0.15 });
  const z0 = linearPowerFromCosmology(p, 0);
  const z1 = linearPowerFromCosmology(p, 1);
  it('P_cb and P_m evolve with the EH99 growth of the cold and total fields', () => {
    for (const k of [1e-3, 0.05, 0.5, 3]) {
      expect(z1.power(k) / z0.power(k)).toBeCloseTo((z1.growthFactorCold(k) / z0.growthFactorCold(k)) ** 2, 6);
      expect(z1.powerMatter(k) / z0.powerMatter(k)).toBeCloseTo((z1.growthFactorMatter(k) / z0.growthFactorMatter(k)) ** 2, 6);
    }
  });
  it('f(k) is the logarithmic derivative of D_cb(k, a): finite difference in a at k = 0.5 h/Mpc to 1e-4', () => {
    const dz = 1e-3;
    const lo = linearPowerFromCosmology(p, 1 - dz);
    const hi = linearPowerFromCosmology(p, 1 + dz);
    const dlnD = Math.log(lo.growthFactorCold(0.5) / hi.growthFactorCold(0.5));
    const dlna = Math.log((2 + dz) / (2 - dz));
    expect(Math.abs(dlnD / dlna / z1.growthRate(0.5) - 1)).toBeLessThan(1e-4);
  });
});
