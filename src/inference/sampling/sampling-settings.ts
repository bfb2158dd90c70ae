import { InputError } from '../../contracts/input-error.js';
import { normalizeLogPosteriorReference, type LogPosteriorReference } from './log-posterior-reference.js';
import type { ProgressMode } from './progress-display.js';
import { validateSampledParameters, type BoundedParameter, type SampledParameter } from './sampled-parameter.js';
import { defaultWorkerCount } from './worker-pool.js';

/** Settings shared by both samplers; every optional field has a documented default. */
export interface SamplingRunSettings {
  readonly parameters: readonly SampledParameter[];
  readonly target: LogPosteriorReference;
  /** Path stem of the run's files: <output>.csv, <output>.json, <output>.state.json. */
  readonly output: string;
  /** Seed of every random number of the run; with it the chain is fixed, whatever the workers. */
  readonly seed: number;
  /** Worker threads. Default: the core count. 0 evaluates on this thread. */
  readonly workers?: number;
  /** Continue from <output>.state.json when it exists. Default false (existing files are an error). */
  readonly resume?: boolean;
  /** Hard cap on steps. Default 100000. */
  readonly maxSteps?: number;
  /** The stopping rule is checked every this many steps. Default 100. */
  readonly checkEvery?: number;
  /** Wall-clock seconds between checkpoints (a SIGKILL loses at most this much). Default 30. */
  readonly checkpointSeconds?: number;
  /** Thrown log-posterior evaluations tolerated before the run stops. Default 0. */
  readonly maxLikelihoodErrors?: number;
  /** Dead workers replaced before the run stops. Default 3. */
  readonly workerRestarts?: number;
  /** Default "auto". */
  readonly progress?: ProgressMode;
  /** Default process.stderr. */
  readonly progressStream?: NodeJS.WritableStream;
  /** Seconds between plain progress lines. Default 30. */
  readonly progressSeconds?: number;
  /** SIGINT (Ctrl-C) ends the run after the current step with a final checkpoint. Default true. */
  readonly handleInterrupt?: boolean;
  /** Aborting ends the run like SIGINT. */
  readonly signal?: AbortSignal;
  /** Recorded as given in the sidecar (e.g. the prior specification). */
  readonly priors?: unknown;
}

export interface ValidatedRunSettings {
  readonly parameters: BoundedParameter[];
  readonly target: Required<LogPosteriorReference>;
  readonly output: string;
  readonly seed: number;
  readonly workers: number;
  readonly resume: boolean;
  readonly maxSteps: number;
  readonly checkEvery: number;
  readonly checkpointSeconds: number;
  readonly maxLikelihoodErrors: number;
  readonly workerRestarts: number;
  readonly progress: ProgressMode;
  readonly progressStream: NodeJS.WritableStream;
  readonly progressSeconds: number;
  readonly handleInterrupt: boolean;
  readonly signal: AbortSignal | undefined;
  readonly priors: unknown;
}

export const samplingRunDefaults = {
  maxSteps: 100_000,
  checkEvery: 100,
  checkpointSeconds: 30,
  maxLikelihoodErrors: 0,
  workerRestarts: 3,
  progressSeconds: 30,
} as const;

function count(value: number | undefined, fallback: number, field: string, min: number): number {
  const v = value ?? fallback;
  if (!Number.isInteger(v) || v < min) throw new InputError(`${field} must be an integer >= ${min}, got ${value}`);
  return v;
}

function seconds(value: number | undefined, fallback: number, field: string): number {
  const v = value ?? fallback;
  if (typeof v !== 'number' || !(v >= 0) || !Number.isFinite(v)) throw new InputError(`${field} must be a number of seconds >= 0, got ${value}`);
  return v;
}

export function validateRunSettings(s: SamplingRunSettings): ValidatedRunSettings {
  const d = samplingRunDefaults;
  if (typeof s.output !== 'string' || s.output.length === 0) throw new InputError('output must be a path stem for the chain files');
  if (!Number.isInteger(s.seed) || s.seed < 0 || s.seed > 0xffffffff) throw new InputError(`seed must be an integer in [0, 2^32), got ${s.seed}`);
  let priors: unknown = null;
  try {
    priors = s.priors === undefined ? null : JSON.parse(JSON.stringify(s.priors));
  } catch {
    throw new InputError('priors must be JSON-serialisable');
  }
  return {
    parameters: validateSampledParameters(s.parameters),
    target: normalizeLogPosteriorReference(s.target),
    output: s.output,
    seed: s.seed,
    workers: count(s.workers, defaultWorkerCount(), 'workers', 0),
    resume: s.resume ?? false,
    maxSteps: count(s.maxSteps, d.maxSteps, 'maxSteps', 1),
    checkEvery: count(s.checkEvery, d.checkEvery, 'checkEvery', 1),
    checkpointSeconds: seconds(s.checkpointSeconds, d.checkpointSeconds, 'checkpointSeconds'),
    maxLikelihoodErrors: count(s.maxLikelihoodErrors, d.maxLikelihoodErrors, 'maxLikelihoodErrors', 0),
    workerRestarts: count(s.workerRestarts, d.workerRestarts, 'workerRestarts', 0),
    progress: s.progress ?? 'auto',
    progressStream: s.progressStream ?? process.stderr,
    progressSeconds: seconds(s.progressSeconds, d.progressSeconds, 'progressSeconds'),
    handleInterrupt: s.handleInterrupt ?? true,
    signal: s.signal,
    priors,
  };
}
