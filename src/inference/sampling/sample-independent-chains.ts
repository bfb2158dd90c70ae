import { adaptiveMetropolisMethod, type AdaptiveMetropolisOptions } from './adaptive-metropolis-method.js';
import { runSampling, type SamplingResult } from './run-sampling.js';
import { validateRunSettings, type SamplingRunSettings } from './sampling-settings.js';

export type IndependentChainsSettings = SamplingRunSettings & AdaptiveMetropolisOptions;

/**
 * Sample a posterior with independent adaptive-Metropolis chains, one
 * proposal per chain and step evaluated in parallel worker threads. Stops
 * when rank-normalised split R-hat and ESS say the chains agree (see
 * AdaptiveMetropolisOptions and docs/conventions.md, "Sampling").
 */
export async function sampleIndependentChains(settings: IndependentChainsSettings): Promise<SamplingResult> {
  const s = validateRunSettings(settings);
  return runSampling(adaptiveMetropolisMethod(s.parameters, settings), s);
}
