import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { validateCosmology } from '../../../../src/cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology } from '../../../../src/cosmology/linear-power-from-cosmology.js';
import { writeMeasurementBundle } from '../../../../src/data/write-measurement-bundle.js';
import { syntheticBundle } from '../../../../src/workflows/synthetic/synthetic-bundle.js';

/**
 * A small joint-fit problem for tests (synthetic data on a few P and B bins,
 * two sampled parameters, a short in-thread run): writes the bundle and the
 * run config into `dir` and returns the config path.
 */
export function writeSmallFitProblem(dir: string): string {
  const cosmology = { h: 0.68, omegaB: 0.0224, omegaCdm: 0.12, ns: 0.965, sigma8: 0.81 };
  const spectrum = linearPowerFromCosmology(validateCosmology(cosmology, {}), 0.5);
  const spec = { redshift: 0.5, numberDensity: 5e-4, surveyVolume: 2e9, fiducialCosmology: cosmology, power: { kMin: 0.02, dk: 0.02, count: 6, multipoles: [0, 2] }, bispectrum: { kMin: 0.02, kMax: 0.08, dk: 0.02 } };
  const s = syntheticBundle(spec, { spectrum, parameters: { b1: 1.7, b2: 0.2, bG2: -0.2 }, noiseSeed: 3 });
  writeMeasurementBundle(join(dir, 'bundle'), { ...spec, lineOfSight: 'midpoint', power: s.bundle.power, bispectrum: s.bundle.bispectrum, covariance: { matrix: s.covariance!, size: s.truth.length } });
  const config = {
    title: 'small test fit',
    measurement: 'bundle',
    covariance: { source: 'matrix' },
    cosmology: { mode: 'fixed-template' },
    parameters: {
      alphaPar: { value: 1 },
      alphaPerp: { value: 1 },
      templateAmplitude: { value: 1 },
      fsigma8: { value: 0.5 },
      b1: { prior: { kind: 'uniform', min: 1, max: 3 }, start: 1.7 },
      b2: { prior: { kind: 'uniform', min: -3, max: 3 }, start: 0 },
      bG2: { value: -0.2 },
      pStochConst: { prior: { kind: 'gaussian', mean: 1, sigma: 1 }, marginalise: true },
    },
    sampler: { seed: 5, walkers: 8, maxSteps: 40, checkEvery: 20, workers: 0 },
    peak: { starts: 1 },
    output: 'run',
  };
  const file = join(dir, 'fit.json');
  writeFileSync(file, JSON.stringify(config));
  return file;
}

export const QUIET = { fresh: true, progress: 'off' as const, log: () => undefined };
