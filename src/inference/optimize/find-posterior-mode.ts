import { InputError } from '../../contracts/input-error.js';
import { Random } from '../../numerics/random.js';
import { loadLogPosterior } from '../sampling/load-log-posterior.js';
import { normalizeLogPosteriorReference, type LogPosteriorReference } from '../sampling/log-posterior-reference.js';
import { drawStartingPoint, validateSampledParameters, type SampledParameter } from '../sampling/sampled-parameter.js';
import { defaultWorkerCount, WorkerPool } from '../sampling/worker-pool.js';
import { climbFromStart, type ModeClimb } from './climb-from-start.js';

export interface ModeSearchSettings {
  readonly parameters: readonly SampledParameter[];
  readonly target: LogPosteriorReference;
  /** Seed of the drawn starting points. */
  readonly seed: number;
  /** Number of starts drawn like the samplers' starting points (start ball, else uniform in the bounds). Default 8. */
  readonly starts?: number;
  /** Extra starting points given explicitly (e.g. drawn from the prior), tried before the drawn ones. */
  readonly startPoints?: readonly (readonly number[])[];
  /** Worker threads, each climbing from its share of the starts. Default: the core count. 0: this thread. */
  readonly workers?: number;
}

export interface ModeSearchResult {
  /** The highest log-posterior found. */
  readonly best: ModeClimb;
  /** Every climb, in the order of the starts. */
  readonly climbs: readonly ModeClimb[];
  /** Starts whose maximum agrees with the best to 1e-6 in log-posterior: a sign the mode is global. */
  readonly agreeing: number;
}

/**
 * Maximum a posteriori point from several starts (multi-start Nelder–Mead
 * with restarts and a BFGS polish, see climbFromStart), the starts shared
 * out over worker threads; the result does not depend on the worker count.
 */
export async function findPosteriorMode(settings: ModeSearchSettings): Promise<ModeSearchResult> {
  const parameters = validateSampledParameters(settings.parameters);
  const target = normalizeLogPosteriorReference(settings.target);
  const dim = parameters.length;
  const drawn = settings.starts ?? 8;
  if (!Number.isInteger(drawn) || drawn < 0) throw new InputError(`starts must be an integer >= 0, got ${drawn}`);
  if (!Number.isInteger(settings.seed) || settings.seed < 0) throw new InputError(`seed must be a non-negative integer, got ${settings.seed}`);
  const given = settings.startPoints ?? [];
  given.forEach((p, i) => {
    if (!Array.isArray(p) || p.length !== dim || !p.every(Number.isFinite)) throw new InputError(`startPoints[${i}] must list ${dim} finite numbers`);
  });
  const count = given.length + drawn;
  if (count === 0) throw new InputError('starts: no starting point (starts = 0 and no startPoints)');
  const starts = new Float64Array(count * dim);
  given.forEach((p, i) => starts.set(p, i * dim));
  const random = new Random(settings.seed);
  for (let i = given.length; i < count; i++) drawStartingPoint(parameters, random, starts, i * dim);

  const workers = settings.workers ?? defaultWorkerCount();
  let climbs: ModeClimb[];
  if (workers === 0) {
    const logPost = await loadLogPosterior(target);
    climbs = Array.from({ length: count }, (_, i) => climbFromStart(logPost, parameters, starts.subarray(i * dim, (i + 1) * dim)));
  } else {
    const pool = await WorkerPool.start(target, Math.min(workers, count), 0);
    try {
      climbs = await pool.climb(starts, parameters);
    } finally {
      await pool.close();
    }
  }
  let best = climbs[0];
  for (const c of climbs) if (c.logPosterior > best.logPosterior) best = c;
  const agreeing = climbs.filter((c) => Math.abs(c.logPosterior - best.logPosterior) <= 1e-6 * (1 + Math.abs(best.logPosterior))).length;
  return { best, climbs, agreeing };
}
