import { describe, expect, it } from 'vitest';
import { hartlapFactor, percivalInflation, sampleCovariance } from '../../src/data/covariance/sample-covariance.js';
import { fixtures } from '../inference/likelihood/support/scipy-fixtures.js';
import { Matrix, inverse } from 'ml-matrix';

describe('sample covariance from mock realisations', () => {
  const s = fixtures.sample;
  const real = s.realisations.map((r) => Float64Array.from(r));
  const n = s.mean.length;

  it('matches numpy.cov (ddof = 1) and the mean (fixture from numpy)', () => {
    const { mean, covariance, count } = sampleCovariance(real);
    expect(count).toBe(real.length);
    s.mean.forEach((v, i) => expect(mean[i]).toBeCloseTo(v, 12));
    s.covariance.flat().forEach((v, i) => expect(Math.abs(covariance[i] - v)).toBeLessThan(1e-12 * Math.abs(v) + 1e-12));
  });

  it('gives the Hartlap factor (N_s - N_d - 2)/(N_s - 1) and the corrected precision matrix (fixture from numpy)', () => {
    expect(hartlapFactor(real.length, n)).toBeCloseTo(s.hartlap, 15);
    const { covariance } = sampleCovariance(real);
    const precision = inverse(Matrix.from1DArray(n, n, Array.from(covariance))).mul(hartlapFactor(real.length, n));
    s.precision_hartlap.flat().forEach((v, i) => expect(precision.to1DArray()[i]).toBeCloseTo(v, 10));
    expect(() => hartlapFactor(8, 6)).toThrow(/8 realisations are too few for 6 data points/);
  });

  it('reports the Percival et al. 2014 inflation factors (eqs. 18 and 22, from memory; values written out in the numpy fixture script)', () => {
    const p = fixtures.percival;
    const { m1, m2 } = percivalInflation(p.ns, p.nd, p.np);
    expect(m1).toBeCloseTo(p.m1, 13);
    expect(m2).toBeCloseTo(p.m2, 13);
    // Many mocks: no inflation.
    expect(percivalInflation(1e8, 50, 7).m1).toBeCloseTo(1, 5);
  });

  it('refuses fewer than 2 realisations and ragged ones', () => {
    expect(() => sampleCovariance([Float64Array.from([1])])).toThrow(/at least 2 realisations/);
    expect(() => sampleCovariance([Float64Array.from([1, 2]), Float64Array.from([1])])).toThrow(/realisation 2 has 1 entries/);
  });
});
