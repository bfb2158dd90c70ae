import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { InterruptedError } from '../../contracts/interrupted-error.js';
import { join } from 'node:path';
import { createJointLikelihood } from '../../inference/likelihood/joint-likelihood-options.js';
import type { JointLikelihood } from '../../inference/likelihood/joint-likelihood.js';
import { findPosteriorMode } from '../../inference/optimize/find-posterior-mode.js';
import { chainFilePaths } from '../../inference/sampling/chain-files.js';
import type { LogPosteriorReference } from '../../inference/sampling/log-posterior-reference.js';
import { trebleLibraryModule } from '../../inference/sampling/module-locations.js';
import type { ProgressMode } from '../../inference/sampling/progress-display.js';
import { sampleEnsemble } from '../../inference/sampling/sample-ensemble.js';
import { sampleIndependentChains } from '../../inference/sampling/sample-independent-chains.js';
import { sampledParametersFromPriors } from '../../inference/sampling/sampled-parameters-from-priors.js';
import { fitAssumptions } from './fit-assumptions.js';
import { lockOutputFolder } from './output-lock.js';
import { CHAIN_STEM, loadFinishedRun } from './finished-run.js';
import { summariseFit, type FitSummary } from './fit-summary.js';
import type { RunConfig } from './run-config.js';

/**
 * The joint fit: validate and build the likelihood once on this thread (so a
 * bad input fails before any worker starts), print the assumptions, sample in
 * worker threads with checkpoints in the output folder, then find the best fit
 * and write the summary. `resume` continues an interrupted run; `fresh`
 * deletes an earlier run in the output folder first.
 */
export interface FitRunOptions {
  readonly resume?: boolean;
  readonly fresh?: boolean;
  readonly progress?: ProgressMode;
  /** Overrides the config's worker count (0: evaluate on this thread). */
  readonly workers?: number;
  readonly log?: (line: string) => void;
}

export function logPosteriorTarget(config: RunConfig): LogPosteriorReference {
  return { module: trebleLibraryModule(), exportName: 'createJointLogPosterior', options: config.likelihood };
}

function removeEarlierRun(folder: string): void {
  const paths = chainFilePaths(join(folder, CHAIN_STEM));
  for (const f of [paths.chain, paths.sidecar, paths.state, join(folder, 'summary.json'), join(folder, 'summary.txt')]) rmSync(f, { force: true });
}

export async function runJointFit(config: RunConfig, options: FitRunOptions = {}): Promise<FitSummary> {
  const log = options.log ?? ((line: string) => process.stderr.write(`${line}\n`));
  const likelihood = createJointLikelihood(config.likelihood);
  log(`treble fit: ${config.title}`);
  for (const a of fitAssumptions(config, likelihood)) log(`  ${a.key}: ${a.value}`);
  mkdirSync(config.output, { recursive: true });
  const unlock = lockOutputFolder(config.output);
  try {
    return await sampleAndFinish(config, likelihood, options, log);
  } finally {
    unlock();
  }
}

async function sampleAndFinish(config: RunConfig, likelihood: JointLikelihood, options: FitRunOptions, log: (line: string) => void): Promise<FitSummary> {
  if (options.fresh) removeEarlierRun(config.output);
  const parameters = sampledParametersFromPriors(likelihood.parameters);
  const target = logPosteriorTarget(config);
  const workers = options.workers ?? config.sampler.workers;
  const common = {
    parameters,
    target,
    output: join(config.output, CHAIN_STEM),
    seed: config.sampler.seed,
    workers,
    resume: options.resume ?? false,
    progress: options.progress,
    priors: config.likelihood.parameters,
    ...config.sampler.settings,
  };
  log(`  output: ${config.output}`);
  const result = config.sampler.method === 'chains' ? await sampleIndependentChains(common) : await sampleEnsemble(common);
  log(`sampling stopped: ${result.stopReason} after ${result.steps} steps (burn-in ${result.diagnostics.burnInSteps})`);
  if (result.stopReason === 'interrupted') {
    throw new InterruptedError(`interrupted after ${result.steps} steps; the checkpoint in ${config.output} is intact: continue with \`treble fit --resume ${config.file}\`, or summarise what there is with \`treble report ${config.file}\``);
  }
  return finishFit(config, likelihood, { workers, log });
}

/** Best fit and summary of a run whose sampling has stopped; writes summary.json and summary.txt. */
export async function finishFit(
  config: RunConfig,
  likelihood: JointLikelihood = createJointLikelihood(config.likelihood),
  options: { workers?: number; log?: (line: string) => void } = {},
): Promise<FitSummary> {
  const run = loadFinishedRun(config.output);
  const parameters = sampledParametersFromPriors(likelihood.parameters);
  // Start the peak search at the highest-posterior draw and at `peak.starts` points drawn like the sampler's starts.
  let bestRow = run.history.row(0, 0);
  for (let s = 0; s < run.history.steps; s++) {
    for (let m = 0; m < run.history.members; m++) {
      const r = run.history.row(s, m);
      if (r[0] > bestRow[0]) bestRow = r;
    }
  }
  const mode = await findPosteriorMode({
    parameters,
    target: logPosteriorTarget(config),
    seed: config.peak.seed,
    starts: config.peak.starts,
    startPoints: [Array.from(bestRow.subarray(1))],
    workers: options.workers ?? config.sampler.workers,
  });
  const summary = summariseFit(config, likelihood, run, mode);
  writeFileSync(join(config.output, 'summary.json'), `${JSON.stringify(summary, null, 2)}\n`);
  writeFileSync(join(config.output, 'summary.txt'), summary.table);
  options.log?.(`summary: ${join(config.output, 'summary.json')}`);
  return summary;
}
