import { InputError } from '../../contracts/input-error.js';
import { pooledQuantile } from '../../inference/diagnostics/pooled-quantile.js';
import { rankNormalizedSplitRhat } from '../../inference/diagnostics/rhat.js';
import { bulkEffectiveSampleSize } from '../../inference/diagnostics/effective-sample-size.js';
import { meanAndSd } from '../../inference/sampling/draw-summary.js';

/**
 * One-dimensional posterior summaries from the kept draws of each chain
 * (walker or independent chain): mean, standard deviation, equal-tailed 68% and
 * 95% intervals (pooled quantiles 0.16/0.84 and 0.025/0.975, numpy's linear
 * rule), rank-normalised split R-hat and bulk ESS (Vehtari et al. 2021).
 * Over the walkers of an ensemble the R-hat is a check of mixing between
 * walkers, which are not independent chains (docs/conventions.md, "Fit").
 */
export interface PosteriorRow {
  readonly name: string;
  readonly mean: number;
  readonly sd: number;
  readonly median: number;
  readonly interval68: readonly [number, number];
  readonly interval95: readonly [number, number];
  readonly rhat: number | null;
  readonly ess: number | null;
}

export function posteriorRow(name: string, chains: readonly Float64Array[], diagnostics = true): PosteriorRow {
  if (chains.length === 0 || chains[0].length < 4) throw new InputError(`posterior of ${name}: fewer than 4 kept draws per chain; sample longer`);
  const { mean, sd } = meanAndSd(chains);
  const q = (p: number) => pooledQuantile(chains, p);
  const stable = diagnostics && sd > 0;
  return {
    name,
    mean,
    sd,
    median: q(0.5),
    interval68: [q(0.16), q(0.84)],
    interval95: [q(0.025), q(0.975)],
    rhat: stable ? rankNormalizedSplitRhat(chains) : null,
    ess: stable ? bulkEffectiveSampleSize(chains) : null,
  };
}
