import { selectData } from '../../../src/data/scale-cuts.js';
import { prepareCovariance } from '../../../src/data/covariance/covariance-choice.js';
import { JointLikelihood } from '../../../src/inference/likelihood/joint-likelihood.js';
import { ParameterSpace, type ParameterSpecs } from '../../../src/inference/parameters/parameter-space.js';
import { scanFixture, TRUTH } from '../scale-cuts/scan-fixture.js';

/**
 * Test support: the joint P + B likelihood of the noiseless fixture at fixed
 * cosmology with b1, b2, bG2 and bispShotPower sampled under wide uniform
 * priors (a nearly Gaussian posterior), for the sampler (module reference
 * target) and for the Fisher comparison.
 */
export const BIAS_PARAMETERS: ParameterSpecs = {
  b1: { prior: { kind: 'uniform', min: 1, max: 3 }, start: TRUTH.b1 },
  b2: { prior: { kind: 'uniform', min: -5, max: 5 }, start: TRUTH.b2 },
  bG2: { prior: { kind: 'uniform', min: -3, max: 3 }, start: TRUTH.bG2 },
  bispShotPower: { prior: { kind: 'uniform', min: -10, max: 10 }, start: TRUTH.bispShotPower },
};

export const CUTS = { limits: { P: { kMax: 0.1 }, B: { kMax: 0.1 + 1e-9 } } };

export function biasLikelihood() {
  const { bundle, source } = scanFixture({ bKMax: 0.1 });
  const selection = selectData(bundle.dataVector.entries, CUTS);
  const parameters = new ParameterSpace(BIAS_PARAMETERS);
  const covariance = prepareCovariance({ source: 'gaussian' }, { bundle, selection, theory: bundle.dataVector.values, freeParameters: 4 });
  return { bundle, source, selection, covariance, likelihood: new JointLikelihood({ bundle, selection, covariance, parameters, models: source }) };
}

export function biasPosterior(): (theta: Float64Array) => number {
  const { likelihood } = biasLikelihood();
  return (theta) => likelihood.logPosterior(theta);
}
