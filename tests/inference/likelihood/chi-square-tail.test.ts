import { describe, expect, it } from 'vitest';
import { chiSquarePValue } from '../../../src/inference/likelihood/chi-square-tail.js';
import { fixtures } from './support/scipy-fixtures.js';

describe('chi-square p-value', () => {
  it('matches scipy.stats.chi2.sf from small to large degrees of freedom (fixture from scipy)', () => {
    for (const { chi2, dof, sf } of fixtures.chi2_sf) {
      const p = chiSquarePValue(chi2, dof);
      expect(Math.abs(p - sf)).toBeLessThan(1e-10 + 1e-8 * sf);
    }
  });

  it('is exp(-chi2/2) for 2 degrees of freedom (closed form, A&S 26.4.21)', () => {
    for (const x of [0.1, 2, 9, 40]) expect(chiSquarePValue(x, 2)).toBeCloseTo(Math.exp(-x / 2), 13);
  });

  it('has no p-value without degrees of freedom', () => {
    expect(chiSquarePValue(3, 0)).toBeNaN();
  });
});
