import type { ChainHistory } from './chain-history.js';
import type { SamplerKernel, SavedRandom } from './sampler-kernel.js';

/** What a stopping-rule check found. */
export interface Assessment {
  readonly converged: boolean;
  /** Carried to the next check and saved in checkpoints (e.g. the previous tau). */
  readonly memo: unknown;
  /** Short text for the progress display, e.g. "tau 31.2". */
  readonly note: string;
  /** Total steps the rule expects to need, when it can tell. */
  readonly expectedSteps: number | null;
}

/** Per-parameter summary of the draws kept after burn-in. */
export interface ParameterSummary {
  readonly name: string;
  readonly mean: number;
  readonly sd: number;
  /** Integrated autocorrelation time in steps (ensemble), or null. */
  readonly tau: number | null;
  /** Effective sample size (ensemble: kept draws / tau; chains: bulk ESS). */
  readonly ess: number;
  /** Rank-normalised split R-hat over independent chains, or null (ensemble). */
  readonly rhat: number | null;
  readonly tailEss: number | null;
}

export interface RunDiagnostics {
  readonly burnInSteps: number;
  readonly keptSteps: number;
  readonly parameters: readonly ParameterSummary[];
  /** Accepted moves / steps, over members. */
  readonly acceptance: { readonly mean: number; readonly min: number; readonly max: number };
}

/** One sampling method as the run driver sees it. */
export interface SamplingMethod {
  /** "stretch-move-ensemble" or "adaptive-metropolis". */
  readonly name: string;
  readonly members: number;
  /** Column name of the member index in chain files: "walker" or "chain". */
  readonly memberLabel: string;
  /** Settings that determine the chain; a resumed run must repeat them. */
  readonly fingerprint: Record<string, unknown>;
  /** Everything recorded about the method in the sidecar. */
  readonly settings: Record<string, unknown>;
  createKernel(positions: Float64Array, logPosterior: Float64Array, random: SavedRandom): SamplerKernel;
  restoreKernel(saved: unknown): SamplerKernel;
  assess(history: ChainHistory, memo: unknown): Assessment;
  summarize(history: ChainHistory, accepted: Float64Array): RunDiagnostics;
}
