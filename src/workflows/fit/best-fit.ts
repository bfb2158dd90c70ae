import { createJointLikelihood } from '../../inference/likelihood/joint-likelihood-options.js';
import { findPosteriorMode } from '../../inference/optimize/find-posterior-mode.js';
import { sampledParametersFromPriors } from '../../inference/sampling/sampled-parameters-from-priors.js';
import { fitAssumptions, type Assumption } from './fit-assumptions.js';
import type { RunConfig } from './run-config.js';
import { logPosteriorTarget } from './run-fit.js';

/**
 * The quick best fit of a run config without sampling: the maximum of the
 * posterior from the parameters' starts and `peak.starts` more points drawn
 * like the sampler's starting points, with chi-square, dof, p-value and the
 * best-fit values of the analytically marginalised parameters.
 */
export interface BestFit {
  readonly assumptions: readonly Assumption[];
  readonly values: Readonly<Record<string, number>>;
  readonly marginalised: Readonly<Record<string, number>>;
  readonly logPosterior: number;
  readonly chi2: number;
  readonly dof: number;
  readonly pValue: number;
  readonly starts: number;
  readonly startsAgreeing: number;
}

export async function findBestFit(config: RunConfig, options: { workers?: number } = {}): Promise<BestFit> {
  const likelihood = createJointLikelihood(config.likelihood);
  const mode = await findPosteriorMode({
    parameters: sampledParametersFromPriors(likelihood.parameters),
    target: logPosteriorTarget(config),
    seed: config.peak.seed,
    starts: config.peak.starts,
    startPoints: [Array.from(likelihood.parameters.starts)],
    workers: options.workers ?? config.sampler.workers,
  });
  const point = likelihood.pointAt(Float64Array.from(mode.best.theta), { bestFit: true });
  return {
    assumptions: fitAssumptions(config, likelihood),
    values: point.values,
    marginalised: point.marginalised ?? {},
    logPosterior: mode.best.logPosterior,
    chi2: point.chi2,
    dof: point.dof,
    pValue: point.pValue,
    starts: mode.climbs.length,
    startsAgreeing: mode.agreeing,
  };
}
