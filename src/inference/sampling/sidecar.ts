import { version } from '../../io/package-version.js';
import type { ChainFilePaths } from './chain-files.js';
import type { FailureCounts } from './failure-tally.js';
import type { RunDiagnostics, SamplingMethod } from './sampling-method.js';
import type { ValidatedRunSettings } from './sampling-settings.js';
import { basename } from 'node:path';

export type RunStatus = 'running' | 'converged' | 'max-steps' | 'interrupted' | 'halted';

/** The JSON sidecar beside a chain file (layout "treble-chain", version 1; see docs/conventions.md). */
export interface ChainSidecar {
  readonly format: 'treble-chain';
  readonly formatVersion: 1;
  readonly software: { readonly name: 'treble'; readonly version: string };
  readonly status: RunStatus;
  readonly message: string | null;
  readonly updated: string;
  readonly chainFile: string;
  readonly stateFile: string;
  readonly columns: readonly string[];
  readonly parameters: readonly { name: string; lower: number | null; upper: number | null; start: number | null; scale: number | null }[];
  readonly priors: unknown;
  readonly seed: number;
  readonly sampler: Record<string, unknown>;
  readonly run: { maxSteps: number; checkEvery: number; checkpointSeconds: number; maxLikelihoodErrors: number; workerRestarts: number; workers: number };
  readonly target: { module: string; exportName: string; options: unknown };
  readonly steps: number;
  readonly failures: FailureCounts;
  readonly diagnostics: RunDiagnostics | null;
}

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null);

export function buildSidecar(
  s: ValidatedRunSettings,
  method: SamplingMethod,
  paths: ChainFilePaths,
  progress: { status: RunStatus; message: string | null; steps: number; failures: FailureCounts; diagnostics: RunDiagnostics | null },
): ChainSidecar {
  return {
    format: 'treble-chain',
    formatVersion: 1,
    software: { name: 'treble', version },
    status: progress.status,
    message: progress.message,
    updated: new Date().toISOString(),
    chainFile: basename(paths.chain),
    stateFile: basename(paths.state),
    columns: ['step', method.memberLabel, 'logPosterior', ...s.parameters.map((p) => p.name)],
    parameters: s.parameters.map((p) => ({ name: p.name, lower: finiteOrNull(p.lower), upper: finiteOrNull(p.upper), start: p.start, scale: p.scale })),
    priors: s.priors,
    seed: s.seed,
    sampler: method.settings,
    run: {
      maxSteps: s.maxSteps,
      checkEvery: s.checkEvery,
      checkpointSeconds: s.checkpointSeconds,
      maxLikelihoodErrors: s.maxLikelihoodErrors,
      workerRestarts: s.workerRestarts,
      workers: s.workers,
    },
    target: s.target,
    steps: progress.steps,
    failures: progress.failures,
    diagnostics: progress.diagnostics,
  };
}
