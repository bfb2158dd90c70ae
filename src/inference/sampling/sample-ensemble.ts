import { runSampling, type SamplingResult } from './run-sampling.js';
import { validateRunSettings, type SamplingRunSettings } from './sampling-settings.js';
import { stretchMoveMethod, type StretchMoveOptions } from './stretch-move-method.js';

export type EnsembleSamplingSettings = SamplingRunSettings & StretchMoveOptions;

/**
 * Sample a posterior with the Goodman–Weare stretch-move ensemble, the two
 * halves of the ensemble evaluated in parallel worker threads. Stops when
 * the chain is long compared with its autocorrelation time (see
 * StretchMoveOptions and docs/conventions.md, "Sampling").
 */
export async function sampleEnsemble(settings: EnsembleSamplingSettings): Promise<SamplingResult> {
  const s = validateRunSettings(settings);
  return runSampling(stretchMoveMethod(s.parameters, settings), s);
}
