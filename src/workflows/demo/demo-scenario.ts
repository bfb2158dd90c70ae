import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology } from '../../cosmology/linear-power-from-cosmology.js';
import { writeMeasurementBundle } from '../../data/write-measurement-bundle.js';
import { defaultB2, defaultBG2 } from '../forecast/survey.js';
import { syntheticBundle, type SyntheticBundleSpec } from '../synthetic/synthetic-bundle.js';

/**
 * The bundled demo: an INVENTED scenario, not a survey. "Tern Lake" is a
 * made-up sample of luminous galaxies at z = 0.61 in an effective volume of
 * 3 (Gpc/h)^3 with nbar = 3e-4 (h/Mpc)^3, in a Planck-2018-like cosmology
 * with one 0.06 eV neutrino. Its true distances differ from the fiducial ones
 * by alphaPar = 1.02 and alphaPerp = 0.99. The data are the treble model at
 * the true parameters plus one Gaussian noise draw from the analytic Gaussian
 * covariance of that model (seed below); the truth is written beside them.
 */
export const DEMO_SCENARIO =
  'Invented demo scenario "Tern Lake": a made-up luminous-galaxy sample at z = 0.61, effective volume 3 (Gpc/h)^3, ' +
  'nbar = 3e-4 (h/Mpc)^3, in a Planck-2018-like cosmology with one 0.06 eV neutrino. Not a real survey: the data are the ' +
  'treble model at known parameters plus one Gaussian noise draw from its analytic covariance.';

export const DEMO_COSMOLOGY = { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044, mNu: 0.06, massiveNuCount: 1 } as const;
export const DEMO_REDSHIFT = 0.61;
export const DEMO_NOISE_SEED = 20261202;

const B1 = 2.0;

export const DEMO_SPEC: SyntheticBundleSpec = {
  description: DEMO_SCENARIO,
  redshift: DEMO_REDSHIFT,
  numberDensity: 3e-4,
  surveyVolume: 3e9,
  fiducialCosmology: DEMO_COSMOLOGY,
  power: { kMin: 0.01, dk: 0.01, count: 20, multipoles: [0, 2, 4] },
  bispectrum: { kMin: 0.01, kMax: 0.1, dk: 0.01, multipoles: [0] },
};

/** True values of every model parameter of the demo (bias defaults of src/workflows/forecast/survey.ts). */
export function demoTruth(f: number, sigma8: number): Record<string, number> {
  return {
    alphaPar: 1.02,
    alphaPerp: 0.99,
    fsigma8: f * sigma8,
    templateAmplitude: 1,
    b1: B1,
    b2: defaultB2(B1),
    bG2: defaultBG2(B1),
    pCt0: 3,
    pCt2: 8,
    pCt4: 0,
    pCtFog: 0,
    pStochConst: 1.1,
    pStochK2Mu2: 0,
    bispShotPower: 1,
    bispShotConst: 1,
  };
}

/** The run config of the demo fit (written as data-demo/fit.json). */
export function demoRunConfig(): Record<string, unknown> {
  const flat = (min: number, max: number, start: number) => ({ prior: { kind: 'uniform', min, max }, start });
  const marg = (mean: number, sigma: number) => ({ prior: { kind: 'gaussian', mean, sigma }, marginalise: true });
  return {
    title: 'Tern Lake (invented demo): joint P_l + B_0 fit',
    note: DEMO_SCENARIO,
    measurement: '.',
    covariance: { source: 'matrix' },
    cuts: { limits: { P: { kMax: 0.2 }, B: { kMax: 0.1 } } },
    cosmology: { mode: 'fixed-template' },
    models: { power: { averaging: { kind: 'mean-k' } }, bispectrum: { averaging: 'effective' } },
    parameters: {
      alphaPar: flat(0.85, 1.15, 1),
      alphaPerp: flat(0.85, 1.15, 1),
      fsigma8: flat(0.1, 1, 0.45),
      templateAmplitude: { value: 1 },
      b1: flat(0.5, 4, 1.8),
      b2: flat(-5, 5, 0),
      bG2: flat(-3, 3, 0),
      pCt0: marg(0, 30),
      pCt2: marg(0, 30),
      pCt4: { value: 0 },
      pCtFog: { value: 0 },
      pStochConst: marg(1, 1),
      pStochK2Mu2: { value: 0 },
      bispShotPower: marg(1, 2),
      bispShotConst: marg(1, 2),
    },
    sampler: { method: 'ensemble', seed: 7, walkers: 24, maxSteps: 4000, checkEvery: 100, tauMultiple: 40, tauDrift: 0.02 },
    peak: { starts: 0 },
    output: '../treble-demo-run',
    truth: 'truth.json',
  };
}

/** Write the demo bundle, its covariance, the truth and the run config into `folder`. */
export function writeDemoData(folder: string): { entries: number; truth: Record<string, number> } {
  const cosmology = validateCosmology(DEMO_COSMOLOGY, { path: 'demo cosmology' });
  const spectrum = linearPowerFromCosmology(cosmology, DEMO_REDSHIFT);
  const truth = { ...demoTruth(spectrum.growthRateLargeScale, spectrum.sigma8), f: spectrum.growthRateLargeScale };
  const synthetic = syntheticBundle(DEMO_SPEC, {
    spectrum,
    parameters: truth,
    models: { power: { averaging: { kind: 'mean-k' } }, bispectrum: { averaging: 'effective' } },
    noiseSeed: DEMO_NOISE_SEED,
  });
  const { bundle, covariance } = synthetic;
  const n = bundle.dataVector.values.length;
  writeMeasurementBundle(folder, {
    description: DEMO_SCENARIO,
    redshift: DEMO_SPEC.redshift,
    numberDensity: DEMO_SPEC.numberDensity,
    lineOfSight: 'midpoint',
    surveyVolume: DEMO_SPEC.surveyVolume,
    fiducialCosmology: DEMO_COSMOLOGY,
    power: bundle.power,
    bispectrum: bundle.bispectrum,
    covariance: covariance ? { matrix: covariance, size: n } : undefined,
  });
  writeFileSync(
    join(folder, 'truth.json'),
    `${JSON.stringify({ scenario: DEMO_SCENARIO, noiseSeed: DEMO_NOISE_SEED, sigma8Template: spectrum.sigma8, growthRate: spectrum.growthRateLargeScale, parameters: truth }, null, 2)}\n`,
  );
  writeFileSync(join(folder, 'fit.json'), `${JSON.stringify(demoRunConfig(), null, 2)}\n`);
  return { entries: n, truth };
}
