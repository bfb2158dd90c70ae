import { describe, expect, it } from 'vitest';
import { Background } from '../../../src/cosmology/background.js';
import { defaultB2, resolveSurvey, shellVolume } from '../../../src/workflows/forecast/survey.js';

// Einstein–de Sitter without radiation: chi(z) = 2 (c/H0) (1 - 1/sqrt(1+z)), c/H0 = 2997.92458 Mpc/h
// (REFERENCES.md; Hogg 1999, astro-ph/9905116, eq. 16 with Omega_M = 1).
const eds = new Background({ h: 0.7, omegaRadiation: 0, omegaCold: 0.49, omegaNu: 0, w0: -1, wa: 0 });
const chi = (z: number) => 2 * 2997.92458 * (1 - 1 / Math.sqrt(1 + z));

describe('forecast survey description', () => {
  it('turns a sky area and a redshift range into the comoving shell volume (EdS analytic distance)', () => {
    const full = 4 * Math.PI * (180 / Math.PI) ** 2;
    const v = shellVolume(eds, full / 4, 0.5, 1);
    const exact = (Math.PI / 3) * (chi(1) ** 3 - chi(0.5) ** 3);
    expect(v / exact - 1).toBeCloseTo(0, 6);
  });

  it('fills documented bias defaults and keeps given values', () => {
    const bins = resolveSurvey({ skyArea: 1000, bins: [{ zMin: 0, zMax: 0.2, nbar: 1e-3 }, { zMin: 0.2, zMax: 0.4, nbar: 1e-3, b1: 2, volume: 1e9 }] }, eds);
    // EdS: D = a, so b1 = 0.84 (1 + z_eff) at z_eff = 0.1.
    expect(bins[0].bias.b1).toBeCloseTo(0.84 * 1.1, 6);
    expect(bins[0].defaulted).toEqual(['b1', 'b2', 'bG2']);
    expect(bins[1].bias.b1).toBe(2);
    expect(bins[1].bias.b2).toBeCloseTo(defaultB2(2), 12);
    expect(bins[1].bias.bG2).toBeCloseTo(-2 / 7, 12);
    expect(bins[1].volume).toBe(1e9);
  });

  it('lists every bad field at once', () => {
    expect(() => resolveSurvey({ bins: [{ zMin: 1, zMax: 0.5, nbar: -1, volume: 0 }, { zMin: 0, zMax: 1, nbar: 1e-4 }] }, eds)).toThrow(
      /bins\[0\]\.zMax[\s\S]*bins\[0\]\.nbar[\s\S]*bins\[0\]\.volume[\s\S]*bins\[1\]: give a volume/,
    );
  });
});
