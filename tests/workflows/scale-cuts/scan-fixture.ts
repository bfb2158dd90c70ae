import { linearPowerFromCosmology } from '../../../src/cosmology/linear-power-from-cosmology.js';
import { validateCosmology } from '../../../src/cosmology/cosmology-parameters.js';
import type { MeasurementBundle } from '../../../src/data/measurement-bundle.js';
import { bundleModels } from '../../../src/inference/likelihood/bundle-models.js';
import { CompositeModel } from '../../../src/inference/likelihood/composite-model.js';
import { fixedModelSource } from '../../../src/inference/likelihood/model-source.js';
import { binningBundle } from '../../../src/workflows/forecast/binning-bundle.js';

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
  const skeleton = binningBundle({
    redshift: 0.5,
    numberDensity: options.nbar ?? 4e-4,
    volume: options.volume ?? 2e9,
    fiducialCosmology: PLANCK,
    power: { kMin: 0.01, kMax: 0.1, dk: 0.01, multipoles: [0, 2] },
    bispectrum: { kMin: 0.02, kMax: options.bKMax ?? 0.16, dk: 0.02, multipoles: [0] },
    label: 'scan fixture',
  });
  const models = bundleModels(skeleton)(spectrum);
  const composite = new CompositeModel(models, skeleton.dataVector.entries, { P: 0.01, B: 0.02 });
  const values = composite.evaluate({ ...TRUTH, ...options.truth });
  skeleton.dataVector.entries.forEach((e, i) => {
    if (e.statistic === 'B' && options.distort) values[i] *= options.distort(e.k);
  });
  const bundle: MeasurementBundle = { ...skeleton, dataVector: { entries: skeleton.dataVector.entries, values } };
  return { bundle, source: fixedModelSource(models), spectrum };
}
