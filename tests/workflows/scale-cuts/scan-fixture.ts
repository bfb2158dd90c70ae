import { linearPowerFromCosmology } from '../../../src/cosmology/linear-power-from-cosmology.js';
import { validateCosmology } from '../../../src/cosmology/cosmology-parameters.js';
import { bundleModels } from '../../../src/inference/likelihood/bundle-models.js';
import { fixedModelSource } from '../../../src/inference/likelihood/model-source.js';
import { syntheticBundle, withDataValues } from '../../../src/workflows/synthetic/synthetic-bundle.js';

/**
 * Test support: noiseless synthetic data on small bins at a fixed linear
 * spectrum (Planck 2018 parameters, z = 0.5), data = model at `truth`, with an
 * optional per-entry distortion of the bispectrum (a deliberately
 * mis-specified data set).
 */
export const PLANCK = { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044, mNu: 0.06 };
export const TRUTH = { b1: 2, b2: -0.4, bG2: -0.29, bispShotPower: 1, bispShotConst: 1, pStochConst: 1 };

export function scanFixture(options: { volume?: number; nbar?: number; bKMax?: number; distort?: (k: readonly number[]) => number; truth?: Record<string, number> } = {}) {
  const spectrum = linearPowerFromCosmology(validateCosmology(PLANCK), 0.5);
  const synthetic = syntheticBundle(
    {
      description: 'scan fixture',
      redshift: 0.5,
      numberDensity: options.nbar ?? 4e-4,
      surveyVolume: options.volume ?? 2e9,
      fiducialCosmology: PLANCK,
      power: { kMin: 0.01, dk: 0.01, count: 10, multipoles: [0, 2] },
      bispectrum: { kMin: 0.02, kMax: options.bKMax ?? 0.16, dk: 0.02, multipoles: [0] },
    },
    { spectrum, parameters: { ...TRUTH, ...options.truth } },
  );
  const values = Float64Array.from(synthetic.truth);
  synthetic.bundle.dataVector.entries.forEach((e, i) => {
    if (e.statistic === 'B' && options.distort) values[i] *= options.distort(e.k);
  });
  return { bundle: withDataValues(synthetic.bundle, values), source: fixedModelSource(bundleModels(synthetic.bundle)(spectrum)), spectrum };
}
