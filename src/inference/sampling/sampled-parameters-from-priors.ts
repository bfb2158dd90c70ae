import type { PriorSpec } from '../parameters/priors.js';
import type { SampledParameter } from './sampled-parameter.js';

/** Fraction of a bounded prior's width, or of a Gaussian prior's sigma, used as the start-ball scale. */
export const startBallFraction = { width: 0.01, sigma: 0.1 } as const;

/**
 * The samplers' parameter list from the sampled parameters of a fit (the
 * free names, their priors and starts of a ParameterSpace, in theta order):
 * bounds = the prior's support; start ball = start +- 1% of a bounded prior's
 * width, or +- 0.1 sigma of a Gaussian prior. The priors themselves stay in
 * the log-posterior; the bounds only spare it calls where it is -Infinity.
 */
export function sampledParametersFromPriors(space: {
  readonly free: readonly string[];
  readonly priors: readonly PriorSpec[];
  readonly starts: ArrayLike<number>;
}): SampledParameter[] {
  return space.free.map((name, i) => {
    const p = space.priors[i];
    const start = space.starts[i];
    switch (p.kind) {
      case 'uniform':
      case 'log-uniform':
        return { name, lower: p.min, upper: p.max, start, scale: startBallFraction.width * (p.max - p.min) };
      case 'gaussian':
        return { name, lower: p.min ?? -Infinity, upper: p.max ?? Infinity, start, scale: startBallFraction.sigma * p.sigma };
      case 'flat':
        throw new Error(`${name}: a flat prior belongs to an analytically marginalised parameter, not a sampled one`);
    }
  });
}
