import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { validateCosmology } from '../../../src/cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology } from '../../../src/cosmology/linear-power-from-cosmology.js';
import { choleskyFactor, solveLower } from '../../../src/data/covariance/cholesky-factor.js';
import { loadMeasurementBundle } from '../../../src/data/measurement-bundle.js';
import { writeMeasurementBundle } from '../../../src/data/write-measurement-bundle.js';
import { syntheticBundle, type SyntheticBundleSpec } from '../../../src/workflows/synthetic/synthetic-bundle.js';

const cosmology = { h: 0.68, omegaB: 0.0224, omegaCdm: 0.12, ns: 0.965, sigma8: 0.81 };
const spectrum = linearPowerFromCosmology(validateCosmology(cosmology, {}), 0.8);
const spec: SyntheticBundleSpec = {
  description: 'test',
  redshift: 0.8,
  numberDensity: 5e-4,
  surveyVolume: 2e9,
  fiducialCosmology: cosmology,
  power: { kMin: 0.01, dk: 0.01, count: 15 },
  bispectrum: { kMin: 0.02, kMax: 0.1, dk: 0.02, multipoles: [0, 2] },
};
const truthParams = { b1: 1.8, b2: 0.3, bG2: -0.2, f: spectrum.growthRateLargeScale };
const dir = mkdtempSync(join(tmpdir(), 'treble-synth-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('synthetic measurement bundles', () => {
  it('holds the model itself when noiseless, and its bins survive the bundle reader', () => {
    const s = syntheticBundle(spec, { spectrum, parameters: truthParams });
    expect(Array.from(s.bundle.dataVector.values)).toEqual(Array.from(s.truth));
    const t = s.bundle.bispectrum!;
    writeMeasurementBundle(dir, {
      redshift: spec.redshift,
      numberDensity: spec.numberDensity,
      lineOfSight: 'midpoint',
      surveyVolume: spec.surveyVolume,
      fiducialCosmology: cosmology,
      power: { ...s.bundle.power!, values: s.bundle.power!.values },
      bispectrum: { ...t, values: t.values },
    });
    const back = loadMeasurementBundle(dir);
    expect(back.dataVector.entries.map((e) => e.block)).toEqual(s.bundle.dataVector.entries.map((e) => e.block));
    expect(Array.from(back.dataVector.values)).toEqual(Array.from(s.truth));
    // Kaiser sanity check of the stored P0 at the largest scale (Kaiser 1987): within 5% of (b1^2 + 2 b1 f/3 + f^2/5) P_lin + 1/nbar.
    const f = truthParams.f;
    const kaiser = (1.8 ** 2 + (2 * 1.8 * f) / 3 + f * f / 5) * spectrum.power(s.bundle.power!.effective[0]) + 1 / spec.numberDensity;
    expect(Math.abs(s.truth[0] / kaiser - 1)).toBeLessThan(0.05);
  });

  it('draws noise with the analytic covariance: whitened residuals have chi2/n = 1 within 4 sqrt(2/n)', () => {
    const s = syntheticBundle(spec, { spectrum, parameters: truthParams, noiseSeed: 11 });
    const n = s.truth.length;
    const r = Float64Array.from(s.bundle.dataVector.values, (v, i) => v - s.truth[i]);
    const w = solveLower(choleskyFactor(s.covariance!, n), r);
    const chi2 = w.reduce((a, x) => a + x * x, 0);
    expect(Math.abs(chi2 / n - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    const again = syntheticBundle(spec, { spectrum, parameters: truthParams, noiseSeed: 11 });
    expect(Array.from(again.bundle.dataVector.values)).toEqual(Array.from(s.bundle.dataVector.values));
  });
});
