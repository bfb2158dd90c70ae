import { Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { checkCovarianceShape } from '../../../src/data/covariance/check-covariance.js';
import { choleskyFactor } from '../../../src/data/covariance/cholesky-factor.js';
import { BlockCholesky } from '../../../src/inference/likelihood/block-cholesky.js';
import { DenseGaussian, randomCovariance, randomVector } from './support/dense-reference.js';

/** A covariance with independent blocks {0, 3, 5}, {1}, {2, 4} (interleaved on purpose). */
function blockCovariance(): Float64Array {
  const n = 6;
  const m = new Float64Array(n * n);
  const blocks = [[0, 3, 5], [1], [2, 4]];
  blocks.forEach((b, s) => {
    const c = randomCovariance(b.length, 40 + s);
    b.forEach((i, a) => b.forEach((j, bb) => (m[i * n + j] = c[a * b.length + bb])));
  });
  return m;
}

describe('block Cholesky factor of the covariance', () => {
  it('finds the independent blocks and gives the dense ln det and chi-square (ml-matrix reference)', () => {
    const m = blockCovariance();
    const f = new BlockCholesky(m, 6);
    expect(f.blocks.map((b) => [...b.indices])).toEqual([[0, 3, 5], [1], [2, 4]]);
    const dense = new DenseGaussian(m, 6);
    expect(f.logDet).toBeCloseTo(dense.logDet, 11);
    const v = randomVector(6, 2);
    const w = f.whiten(v);
    const chi2 = w.reduce((s, x) => s + x * x, 0);
    expect(chi2).toBeCloseTo(dense.chi2(v, new Float64Array(6)), 10);
  });

  it('treats a dense covariance as one block', () => {
    const m = randomCovariance(9, 8);
    const f = new BlockCholesky(m, 9);
    expect(f.blocks).toHaveLength(1);
    expect(f.logDet).toBeCloseTo(new DenseGaussian(m, 9).logDet, 10);
  });
});

describe('covariance refusals', () => {
  it('refuses a matrix that is not positive definite, quoting its smallest eigenvalue', () => {
    // [[2, 1, 0], [1, 2, 3], [0, 3, 2]] has eigenvalues 2 and 2 +- sqrt(10): the smallest is -1.16228
    // (characteristic polynomial worked by hand: (2 - x)[(2 - x)^2 - 10] = 0).
    const m = Float64Array.from([2, 1, 0, 1, 2, 3, 0, 3, 2]);
    expect(() => choleskyFactor(m, 3, 'covariance.csv')).toThrow(/covariance\.csv is not positive definite: smallest eigenvalue -1\.16228/);
    expect(2 - Math.sqrt(10)).toBeCloseTo(-1.16228, 5);
    // The same refusal from inside a block of a block-structured matrix: the block [[2, 1], [1, 0.2]]
    // has eigenvalues 1.1 +- sqrt(1.81), the smallest -0.245362 (by hand).
    const blocks = new Float64Array(16);
    blocks.set([1, 0, 0, 0]);
    blocks.set([0, 2, 1, 0], 4);
    blocks.set([0, 1, 0.2, 0], 8);
    blocks.set([0, 0, 0, 1], 12);
    expect(() => new BlockCholesky(blocks, 4)).toThrow(/block of entries 2, 3\) is not positive definite: smallest eigenvalue -0\.24536/);
  });

  it('refuses NaN elements, naming the element', () => {
    const m = Float64Array.from([1, 0, 0, Number.NaN]);
    expect(() => checkCovarianceShape(m, 2, 2, 'cov')).toThrow(/cov: element \(2, 2\) is NaN/);
  });

  it('refuses a size that does not match the data vector, giving both sizes', () => {
    const m = Float64Array.from(new Matrix([[1, 0], [0, 1]]).to1DArray());
    expect(() => checkCovarianceShape(m, 2, 3, 'cov')).toThrow(/cov: a 2 x 2 matrix .* does not match the data vector of 3 entries/);
  });

  it('refuses an asymmetric matrix, naming the element', () => {
    const m = Float64Array.from([1, 0.5, 0.4, 1]);
    expect(() => checkCovarianceShape(m, 2, 2, 'cov')).toThrow(/not symmetric at \(2, 1\)/);
  });
});
