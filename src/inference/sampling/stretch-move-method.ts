import { InputError } from '../../contracts/input-error.js';
import { integratedAutocorrelationTime } from '../diagnostics/autocorrelation-time.js';
import type { ChainHistory } from './chain-history.js';
import { acceptanceSummary, meanAndSd } from './draw-summary.js';
import type { BoundedParameter } from './sampled-parameter.js';
import type { SavedRandom } from './sampler-kernel.js';
import type { Assessment, RunDiagnostics, SamplingMethod } from './sampling-method.js';
import { StretchMoveKernel, type StretchMoveState } from './stretch-move-kernel.js';

/** Settings of the stretch-move ensemble; every field has a documented default. */
export interface StretchMoveOptions {
  /** Number of walkers, even and >= 2 dim + 2. Default max(16, 4 dim) rounded up to even. */
  readonly walkers?: number;
  /** Stretch scale a of g(z) (Goodman & Weare 2010). Default 2. */
  readonly stretch?: number;
  /** Converged once steps >= tauMultiple * max tau ... Default 50. */
  readonly tauMultiple?: number;
  /** ... and every tau moved by less than this fraction since the previous check. Default 0.01. */
  readonly tauDrift?: number;
  /** Burn-in removed from the summaries: burnInTaus * max tau steps. Default 3. */
  readonly burnInTaus?: number;
}

export const stretchMoveDefaults = { stretch: 2, tauMultiple: 50, tauDrift: 0.01, burnInTaus: 3 } as const;

function positive(value: number | undefined, fallback: number, field: string, min = 0): number {
  const v = value ?? fallback;
  if (typeof v !== 'number' || !(v > min) || !Number.isFinite(v)) throw new InputError(`${field} must be a number above ${min}, got ${value}`);
  return v;
}

/** Largest tau over parameters, each from all walkers with Sokal windowing. */
function ensembleTaus(history: ChainHistory, from: number): { taus: number[]; windowed: boolean } {
  const taus: number[] = [];
  let windowed = true;
  for (let p = 0; p < history.dim; p++) {
    const t = integratedAutocorrelationTime(history.seriesByMember(p, from));
    taus.push(t.tau);
    windowed &&= t.converged;
  }
  return { taus, windowed };
}

export function stretchMoveMethod(parameters: readonly BoundedParameter[], options: StretchMoveOptions = {}): SamplingMethod {
  const dim = parameters.length;
  const fallbackWalkers = 2 * Math.ceil(Math.max(16, 4 * dim) / 2);
  const walkers = options.walkers ?? fallbackWalkers;
  if (!Number.isInteger(walkers) || walkers % 2 !== 0 || walkers < 2 * dim + 2) {
    throw new InputError(`walkers must be an even integer >= 2 x parameters + 2 = ${2 * dim + 2}, got ${walkers}`);
  }
  const stretch = positive(options.stretch, stretchMoveDefaults.stretch, 'stretch', 1);
  const tauMultiple = positive(options.tauMultiple, stretchMoveDefaults.tauMultiple, 'tauMultiple');
  const tauDrift = positive(options.tauDrift, stretchMoveDefaults.tauDrift, 'tauDrift');
  const burnInTaus = options.burnInTaus ?? stretchMoveDefaults.burnInTaus;
  if (!(burnInTaus >= 0)) throw new InputError(`burnInTaus must be >= 0, got ${burnInTaus}`);

  const burnIn = (history: ChainHistory): number => {
    const { taus } = ensembleTaus(history, 0);
    return Math.min(Math.ceil(burnInTaus * Math.max(...taus)), Math.floor(history.steps / 2));
  };

  return {
    name: 'stretch-move-ensemble',
    members: walkers,
    memberLabel: 'walker',
    fingerprint: { method: 'stretch-move-ensemble', walkers, stretch },
    settings: { method: 'stretch-move-ensemble', walkers, stretch, tauMultiple, tauDrift, burnInTaus },
    createKernel(positions: Float64Array, logPosterior: Float64Array, random: SavedRandom) {
      return new StretchMoveKernel(dim, stretch, {
        step: 0,
        positions: Array.from(positions),
        logPosterior: Array.from(logPosterior),
        accepted: new Array<number>(walkers).fill(0),
        random,
      });
    },
    restoreKernel(saved: unknown) {
      return new StretchMoveKernel(dim, stretch, saved as StretchMoveState);
    },
    assess(history: ChainHistory, memo: unknown): Assessment {
      const { taus, windowed } = ensembleTaus(history, 0);
      const previous = memo as number[] | null;
      const tauMax = Math.max(...taus);
      const steady = previous !== null && taus.every((t, i) => Math.abs(t - previous[i]) < tauDrift * t);
      return {
        converged: windowed && steady && history.steps >= tauMultiple * tauMax,
        memo: taus,
        note: `tau ${tauMax.toFixed(1)}`,
        expectedSteps: Math.ceil(tauMultiple * tauMax),
      };
    },
    summarize(history: ChainHistory, accepted: Float64Array): RunDiagnostics {
      const from = burnIn(history);
      const kept = history.steps - from;
      const { taus } = ensembleTaus(history, from);
      return {
        burnInSteps: from,
        keptSteps: kept,
        parameters: parameters.map((p, i) => ({
          name: p.name,
          ...meanAndSd(history.seriesByMember(i, from)),
          tau: taus[i],
          ess: (kept * walkers) / taus[i],
          rhat: null,
          tailEss: null,
        })),
        acceptance: acceptanceSummary(accepted, history.steps),
      };
    },
  };
}
