import type { RandomState } from '../../numerics/random.js';

/** Evaluates proposals (count x dim, row-wise): log-posteriors, -Infinity for zero probability. */
export type ProposalEvaluator = (points: Float64Array) => Promise<Float64Array>;

/** Generator state as saved in checkpoints. */
export interface SavedRandom {
  readonly words: RandomState;
  readonly spare: number | null;
}

/**
 * One Markov-chain method advancing a set of members (ensemble walkers or
 * independent chains) by one step. advance() is atomic: when the evaluator
 * rejects, the kernel is left exactly as before the call (points, counters,
 * random state), so a checkpoint taken afterwards resumes bit-identically.
 */
export interface SamplerKernel {
  readonly members: number;
  readonly dim: number;
  /** Current points (members x dim, row-wise) and their log-posteriors. */
  readonly positions: Float64Array;
  readonly logPosterior: Float64Array;
  /** Accepted moves per member. */
  readonly accepted: Float64Array;
  /** Completed steps. */
  readonly step: number;
  advance(evaluate: ProposalEvaluator): Promise<void>;
  /** JSON-safe state from which the kernel's factory rebuilds it exactly. */
  saveState(): unknown;
}
