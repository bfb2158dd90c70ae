import { InputError } from '../../contracts/input-error.js';
import { bulkEffectiveSampleSize, tailEffectiveSampleSize } from '../diagnostics/effective-sample-size.js';
import { rankNormalizedSplitRhat } from '../diagnostics/rhat.js';
import { AdaptiveMetropolisKernel, type AdaptiveMetropolisState } from './adaptive-metropolis-kernel.js';
import type { ChainHistory } from './chain-history.js';
import { acceptanceSummary, meanAndSd } from './draw-summary.js';
import type { BoundedParameter } from './sampled-parameter.js';
import type { SavedRandom } from './sampler-kernel.js';
import type { Assessment, RunDiagnostics, SamplingMethod } from './sampling-method.js';

/** Settings of the independent adaptive-Metropolis chains; every field has a documented default. */
export interface AdaptiveMetropolisOptions {
  /** Independent chains. Default 4 (whatever the number of workers, so chains do not depend on it). */
  readonly chains?: number;
  /** Steps t0 with the fixed starting proposal before adaptation. Default 100 x dim. */
  readonly adaptAfter?: number;
  /** eps of Haario et al., relative to the squared starting scales. Default 1e-6. */
  readonly regularization?: number;
  /** Leading fraction of every chain dropped as warm-up (stopping rule and summaries). Default 0.5. */
  readonly warmupFraction?: number;
  /** Converged when every rank-normalised split R-hat is below this ... Default 1.01. */
  readonly maxRhat?: number;
  /** ... and every bulk and tail ESS reaches this. Default 400. Both from Vehtari et al. 2021, sec. 4. */
  readonly minEss?: number;
}

export const adaptiveMetropolisDefaults = { chains: 4, regularization: 1e-6, warmupFraction: 0.5, maxRhat: 1.01, minEss: 400 } as const;

/** Starting proposal scales: the start-ball scale, else a tenth of the bounded range. */
function startingScales(parameters: readonly BoundedParameter[]): Float64Array {
  return Float64Array.from(parameters, (p) => p.scale ?? (p.upper - p.lower) / 10);
}

export function adaptiveMetropolisMethod(parameters: readonly BoundedParameter[], options: AdaptiveMetropolisOptions = {}): SamplingMethod {
  const dim = parameters.length;
  const d = adaptiveMetropolisDefaults;
  const chains = options.chains ?? d.chains;
  if (!Number.isInteger(chains) || chains < 2) throw new InputError(`chains must be an integer >= 2, got ${chains}`);
  const adaptAfter = options.adaptAfter ?? 100 * dim;
  if (!Number.isInteger(adaptAfter) || adaptAfter < 1) throw new InputError(`adaptAfter must be a positive integer, got ${adaptAfter}`);
  const regularization = options.regularization ?? d.regularization;
  if (!(regularization > 0)) throw new InputError(`regularization must be positive, got ${regularization}`);
  const warmupFraction = options.warmupFraction ?? d.warmupFraction;
  if (!(warmupFraction >= 0 && warmupFraction < 1)) throw new InputError(`warmupFraction must be in [0, 1), got ${warmupFraction}`);
  const maxRhat = options.maxRhat ?? d.maxRhat;
  if (!(maxRhat > 1)) throw new InputError(`maxRhat must be above 1, got ${maxRhat}`);
  const minEss = options.minEss ?? d.minEss;
  if (!(minEss > 0)) throw new InputError(`minEss must be positive, got ${minEss}`);
  const scales = startingScales(parameters);

  const diagnose = (history: ChainHistory, from: number) =>
    parameters.map((_, i) => {
      const draws = history.seriesByMember(i, from);
      return { draws, rhat: rankNormalizedSplitRhat(draws), bulk: bulkEffectiveSampleSize(draws), tail: tailEffectiveSampleSize(draws) };
    });

  return {
    name: 'adaptive-metropolis',
    members: chains,
    memberLabel: 'chain',
    fingerprint: { method: 'adaptive-metropolis', chains, adaptAfter, regularization },
    settings: { method: 'adaptive-metropolis', chains, adaptAfter, regularization, warmupFraction, maxRhat, minEss },
    createKernel(positions: Float64Array, logPosterior: Float64Array, random: SavedRandom) {
      return new AdaptiveMetropolisKernel(dim, scales, adaptAfter, regularization, {
        step: 0,
        positions: Array.from(positions),
        logPosterior: Array.from(logPosterior),
        accepted: new Array<number>(chains).fill(0),
        ...AdaptiveMetropolisKernel.initialMoments(positions, chains, dim),
        random,
      });
    },
    restoreKernel(saved: unknown) {
      return new AdaptiveMetropolisKernel(dim, scales, adaptAfter, regularization, saved as AdaptiveMetropolisState);
    },
    assess(history: ChainHistory): Assessment {
      const from = Math.floor(warmupFraction * history.steps);
      if (history.steps - from < 8) return { converged: false, memo: null, note: 'R-hat -', expectedSteps: null };
      const found = diagnose(history, from);
      const worstRhat = Math.max(...found.map((f) => f.rhat));
      const leastEss = Math.min(...found.map((f) => Math.min(f.bulk, f.tail)));
      return {
        converged: worstRhat < maxRhat && leastEss >= minEss,
        memo: null,
        note: `R-hat ${worstRhat.toFixed(3)}, ESS ${Math.round(leastEss)}`,
        expectedSteps: leastEss > 0 ? Math.ceil((history.steps * minEss) / leastEss) : null,
      };
    },
    summarize(history: ChainHistory, accepted: Float64Array): RunDiagnostics {
      const from = Math.floor(warmupFraction * history.steps);
      const found = history.steps - from >= 8 ? diagnose(history, from) : null;
      return {
        burnInSteps: from,
        keptSteps: history.steps - from,
        parameters: parameters.map((p, i) => ({
          name: p.name,
          ...meanAndSd(history.seriesByMember(i, from)),
          tau: null,
          ess: found ? found[i].bulk : Number.NaN,
          rhat: found ? found[i].rhat : null,
          tailEss: found ? found[i].tail : null,
        })),
        acceptance: acceptanceSummary(accepted, history.steps),
      };
    },
  };
}
