import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { bulkEffectiveSampleSize, effectiveSampleSize, tailEffectiveSampleSize } from '../../../src/inference/diagnostics/effective-sample-size.js';
import { normalQuantile } from '../../../src/inference/diagnostics/normal-quantile.js';
import { potentialScaleReduction, rankNormalizedSplitRhat } from '../../../src/inference/diagnostics/rhat.js';

// Reference values: tests/fixtures/scipy-diagnostics/make_diagnostics.py (numpy/scipy,
// formulas of Vehtari et al. 2021, Bayesian Analysis 16, 667; direct-sum autocovariances).
interface Case {
  chains: number[][];
  rankNormalizedSplitRhat: number;
  plainRhat: number;
  ess: number;
  bulkEss: number;
  tailEss: number;
}
const fixture = JSON.parse(
  readFileSync(new URL('../../fixtures/scipy-diagnostics/diagnostics.json', import.meta.url), 'utf8'),
) as { cases: Record<string, Case>; normalQuantile: [number, number][] };

describe('rank-normalised R-hat and ESS against numpy/scipy', () => {
  for (const [name, c] of Object.entries(fixture.cases)) {
    const chains = c.chains.map((x) => Float64Array.from(x));
    it(`${name}: R-hat, ESS, bulk ESS and tail ESS`, () => {
      expect(potentialScaleReduction(chains)).toBeCloseTo(c.plainRhat, 12);
      expect(rankNormalizedSplitRhat(chains)).toBeCloseTo(c.rankNormalizedSplitRhat, 11);
      // FFT against direct-sum autocovariances: agreement to rounding.
      expect(effectiveSampleSize(chains) / c.ess - 1).toBeCloseTo(0, 9);
      expect(bulkEffectiveSampleSize(chains) / c.bulkEss - 1).toBeCloseTo(0, 9);
      expect(tailEffectiveSampleSize(chains) / c.tailEss - 1).toBeCloseTo(0, 9);
    });
  }

  it('flags the chain with a shifted mean and the one with a larger scale', () => {
    expect(rankNormalizedSplitRhat(fixture.cases.shifted.chains.map((x) => Float64Array.from(x)))).toBeGreaterThan(1.01);
    expect(rankNormalizedSplitRhat(fixture.cases.scaled.chains.map((x) => Float64Array.from(x)))).toBeGreaterThan(1.01);
  });
});

describe('normal quantile (Wichura AS 241)', () => {
  it('matches scipy.stats.norm.ppf to 1e-15 relative', () => {
    for (const [p, z] of fixture.normalQuantile) {
      const got = normalQuantile(p);
      expect(Math.abs(got - z)).toBeLessThanOrEqual(2e-15 * Math.max(1, Math.abs(z)));
    }
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(normalQuantile(1)).toBe(Infinity);
  });
});
