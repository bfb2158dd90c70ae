import { describe, expect, it } from 'vitest';
import { bispectrumSensitivity, renderSensitivityMapsSvg } from '../../../src/workflows/forecast/bispectrum-sensitivity.js';
import { PLANCK } from '../scale-cuts/scan-fixture.js';

const bin = { zMin: 0.4, zMax: 0.6, zEff: 0.5, volume: 2e9, nbar: 3e-4, bias: { b1: 2, b2: -0.4, bG2: -0.29 }, defaulted: [] };
const bispectrum = { kMin: 0.02, kMax: 0.12, dk: 0.02, multipoles: [0] };

describe('bispectrum sensitivity maps', () => {
  const s = bispectrumSensitivity({ bin, cosmology: PLANCK, names: ['mNu', 'b1', 'b2', 'bG2'], steps: { mNu: 0.01 }, bispectrum, models: { bispectrum: { averaging: 'centres' } } });
  const [, , b2, bG2] = s.maps;

  it('dB0/dbG2 over dB0/db2 is 2 sigma^2 = -3/2 for equilateral and 0 for collinear triangles (tidal kernel sigma^2 = mu_12^2 - 1, docs/conventions.md)', () => {
    let equilateral = 0;
    let collinear = 0;
    for (let i = 0; i < s.k1.length; i++) {
      const ratio = bG2.derivative[i] / b2.derivative[i];
      if (s.k1[i] === s.k2[i] && s.k2[i] === s.k3[i]) {
        expect(ratio).toBeCloseTo(-1.5, 9);
        equilateral++;
      } else if (Math.abs(s.k1[i] - s.k2[i] - s.k3[i]) < 1e-9) {
        expect(Math.abs(ratio)).toBeLessThan(1e-9);
        collinear++;
      }
    }
    expect(equilateral).toBeGreaterThan(3);
    expect(collinear).toBeGreaterThan(3);
  });

  it('information shares per shape class add up to one; the tidal bias draws less of its information from flattened triangles than b2', () => {
    for (const m of s.maps) expect(Object.values(m.informationByClass).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    expect(bG2.informationByClass.flattened).toBeLessThan(b2.informationByClass.flattened);
    expect(s.maps[0].derivative.every(Number.isFinite)).toBe(true);
  });

  it('renders one shape map per parameter and refuses a binning without the monopole', () => {
    const svgs = renderSensitivityMapsSvg(s);
    expect(Object.keys(svgs)).toEqual(['mNu', 'b1', 'b2', 'bG2']);
    expect(svgs.mNu).toMatch(/^<svg[\s\S]*dB0\/dmNu/);
    expect(() => bispectrumSensitivity({ bin, cosmology: PLANCK, names: ['b1'], bispectrum: { ...bispectrum, multipoles: [2] } })).toThrow(/monopole/);
  });
});
