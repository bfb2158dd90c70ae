import { InputError } from '../../contracts/input-error.js';
import { readRunJson, writeJsonAtomically } from './chain-files.js';
import type { FailureCounts } from './failure-tally.js';
import type { SamplingMethod } from './sampling-method.js';
import type { ValidatedRunSettings } from './sampling-settings.js';

/** The checkpoint file's layout ("treble-sampling-state", version 1). */
export interface SamplingCheckpoint {
  readonly format: 'treble-sampling-state';
  readonly formatVersion: 1;
  /** Byte length of the chain file that matches this state; resuming cuts the file back to it. */
  readonly chainBytes: number;
  readonly steps: number;
  readonly converged: boolean;
  readonly fingerprint: Record<string, unknown>;
  readonly kernel: unknown;
  readonly failures: FailureCounts;
  /** Stopping-rule memory and the latest progress note. */
  readonly memo: unknown;
  readonly note: string;
  readonly expectedSteps: number | null;
}

/** What fixes the chain: the method's settings, the seed and the parameters. Compared when resuming. */
export function runFingerprint(s: ValidatedRunSettings, method: SamplingMethod): Record<string, unknown> {
  return { ...method.fingerprint, seed: s.seed, parameters: s.parameters.map((p) => [p.name, p.lower, p.upper, p.start, p.scale].map(String)) };
}

/** Read a checkpoint and check it belongs to a run with this fingerprint (InputError naming the first differing setting). */
export function readCheckpoint(path: string, fingerprint: Record<string, unknown>): SamplingCheckpoint {
  const cp = readRunJson<SamplingCheckpoint>(path, 'output');
  if (cp.format !== 'treble-sampling-state') throw new InputError(`output: ${path} is not a treble sampling checkpoint`);
  for (const key of new Set([...Object.keys(fingerprint), ...Object.keys(cp.fingerprint)])) {
    if (JSON.stringify(fingerprint[key]) !== JSON.stringify(cp.fingerprint[key])) {
      throw new InputError(`${key}: ${JSON.stringify(fingerprint[key])} differs from the checkpointed run's ${JSON.stringify(cp.fingerprint[key])}; cannot resume ${path}`);
    }
  }
  return cp;
}

export function writeCheckpoint(path: string, state: Omit<SamplingCheckpoint, 'format' | 'formatVersion'>): void {
  writeJsonAtomically(path, { format: 'treble-sampling-state', formatVersion: 1, ...state });
}
