import { describe, expect, it } from 'vitest';
import { validateCosmology } from '../../src/cosmology/cosmology-parameters.js';
import { eisensteinHu98, transferEH98, transferNoWiggleEH98 } from '../../src/cosmology/eisenstein-hu-1998.js';
import { parsePowerTable } from '../../src/cosmology/power-table.js';
import { linearSpectrumFromTable } from '../../src/cosmology/table-linear-spectrum.js';

// A table made from the EH98 formulae (ApJ 496, 605, eqs. 16–24 and 28–31) evaluated directly.
const params = validateCosmology({ h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044 });
const eh = eisensteinHu98(params.h, params.omegaB + params.omegaCdm, params.omegaB, params.tCmb);
const shape = (k: number) => 2e4 * (k / 0.01) ** params.ns;
const exact = (k: number) => shape(k) * transferEH98(eh, k) ** 2;
const exactNoWiggle = (k: number) => shape(k) * transferNoWiggleEH98(eh, k) ** 2;

function tableText(kMin: number, kMax: number, n: number): string {
  const rows: string[] = ['# EH98 with wiggles, k [h/Mpc]  P [(Mpc/h)^3]'];
  for (let i = 0; i < n; i++) {
    const k = kMin * (kMax / kMin) ** (i / (n - 1));
    rows.push(`${k} ${exact(k)}`);
  }
  return rows.join('\n');
}

/** Sign changes of f on a fine grid in [a, b]. */
function zeroCrossings(f: (k: number) => number, a: number, b: number): number[] {
  const out: number[] = [];
  let prev = f(a);
  for (let k = a + 2.5e-4; k <= b; k += 2.5e-4) {
    const v = f(k);
    if (v * prev < 0) out.push(k);
    prev = v;
  }
  return out;
}

describe('user power-spectrum table', () => {
  const warnings: string[] = [];
  const spectrum = linearSpectrumFromTable(parsePowerTable(tableText(1e-3, 1, 400), 'eh98.txt'), params, 0, {
    onWarning: (m) => warnings.push(m),
  });

  it('log-log interpolation of 400 log-spaced EH98 points reproduces EH98 to 1e-4 for 1e-3 <= k <= 1 h/Mpc', () => {
    let worst = 0;
    for (let x = Math.log(1e-3); x <= 0; x += 1e-3) worst = Math.max(worst, Math.abs(spectrum.power(Math.exp(x)) / exact(Math.exp(x)) - 1));
    expect(worst).toBeLessThan(1e-4);
    expect(warnings).toEqual([]);
  });

  it('extrapolates as a power law and warns once per end when asked far outside', () => {
    const slopeHigh = Math.log(spectrum.power(1) / spectrum.power(0.999)) / Math.log(1 / 0.999);
    expect(spectrum.power(1.2)).toBeCloseTo(spectrum.power(1) * 1.2 ** slopeHigh, 3);
    expect(warnings).toEqual([]);
    spectrum.power(5);
    spectrum.power(6);
    spectrum.power(1e-4);
    expect(warnings.length).toBe(2);
    expect(warnings[0]).toMatch(/eh98\.txt: k = 5 h\/Mpc is far above the table \(kMax = 1\)/);
    expect(warnings[1]).toMatch(/far below the table/);
  });
});

describe('wiggle / no-wiggle split of a table (log-Gaussian filter, Vlah et al. 2016, JCAP 03 (2016) 057)', () => {
  // The reference shape comes from a different h, so the split cannot simply return the EH98 no-wiggle form.
  const other = validateCosmology({ ...params, h: 0.7 });
  const spectrum = linearSpectrumFromTable(parsePowerTable(tableText(1e-4, 10, 400), 'eh98.txt'), other, 0);

  // Above k ~ 0.25 h/Mpc the EH98 no-wiggle form is offset from the middle of the (Silk-damped) wiggles by
  // more than their amplitude, so P_EH98 - P_EH98,nw stops marking the wiggle zeros there.
  it('the wiggle part crosses zero within 0.01 h/Mpc of each zero of the EH98 wiggles, 0.05 < k < 0.24 h/Mpc', () => {
    const truth = zeroCrossings((k) => exact(k) - exactNoWiggle(k), 0.05, 0.24);
    const split = zeroCrossings((k) => spectrum.power(k) - spectrum.powerNoWiggle(k), 0.05, 0.24);
    expect(truth.length).toBeGreaterThanOrEqual(6);
    expect(split.length).toBe(truth.length);
    truth.forEach((k, i) => expect(Math.abs(split[i] - k)).toBeLessThan(0.01));
  });

  it('the no-wiggle part is smooth: no oscillation left against the EH98 no-wiggle form', () => {
    // Local extrema of P_nw / P_EH98,nw over the BAO range: the wiggly P has one per half period.
    const extrema = (f: (k: number) => number) => {
      let count = 0;
      for (let k = 0.03; k < 0.4; k += 0.002) {
        const [a, b, c] = [f(k - 0.002), f(k), f(k + 0.002)];
        if ((b - a) * (c - b) < 0) count++;
      }
      return count;
    };
    expect(extrema((k) => exact(k) / exactNoWiggle(k))).toBeGreaterThanOrEqual(8);
    expect(extrema((k) => spectrum.powerNoWiggle(k) / exactNoWiggle(k))).toBeLessThanOrEqual(2);
    for (let k = 0.01; k < 0.5; k *= 1.05) expect(Math.abs(spectrum.powerNoWiggle(k) / exactNoWiggle(k) - 1)).toBeLessThan(0.03);
  });

  it('the BAO damping scales of the split agree with those of the EH98 producer to 2%', () => {
    // Both integrate a no-wiggle spectrum of the same shape; the table carries an arbitrary amplitude, so compare ratios.
    const ref = linearSpectrumFromTable(parsePowerTable(tableText(1e-4, 10, 400), 'eh98.txt'), params, 0);
    const amplitude = ref.reference.powerNoWiggle(0.05) / ref.powerNoWiggle(0.05);
    expect(Math.abs((ref.sigma2BAO * amplitude) / ref.reference.sigma2BAO - 1)).toBeLessThan(0.02);
    expect(Math.abs((ref.deltaSigma2BAO * amplitude) / ref.reference.deltaSigma2BAO - 1)).toBeLessThan(0.02);
  });
});
