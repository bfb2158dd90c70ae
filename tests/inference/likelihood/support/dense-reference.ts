import { Matrix, determinant, inverse } from 'ml-matrix';
import { Random } from '../../../../src/numerics/random.js';

/**
 * Independent dense reference pieces for the likelihood tests, built on
 * ml-matrix (a general-purpose library): inverse and determinant of the
 * covariance, and a seeded random symmetric positive-definite matrix.
 */
export function randomCovariance(n: number, seed: number, scale = 1): Float64Array {
  const rng = new Random(seed);
  const a = Matrix.zeros(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a.set(i, j, rng.normal());
  const c = a.mmul(a.transpose()).add(Matrix.eye(n, n).mul(n));
  return Float64Array.from(c.mul(scale).to1DArray());
}

export function randomVector(n: number, seed: number, sigma = 1, mean = 0): Float64Array {
  const rng = new Random(seed);
  return Float64Array.from({ length: n }, () => mean + sigma * rng.normal());
}

export class DenseGaussian {
  readonly precision: Matrix;
  readonly logDet: number;
  readonly flatPrecision: Float64Array;
  private readonly scratch: Float64Array;
  constructor(
    cov: Float64Array,
    readonly n: number,
  ) {
    const m = Matrix.from1DArray(n, n, Array.from(cov));
    this.precision = inverse(m);
    this.logDet = Math.log(determinant(m));
    this.flatPrecision = Float64Array.from(this.precision.to1DArray());
    this.scratch = new Float64Array(n);
  }

  /** ln N(d; m, C). */
  logDensity(d: Float64Array, m: Float64Array): number {
    const r = Matrix.columnVector(Array.from(d, (v, i) => v - m[i]));
    const chi2 = r.transpose().mmul(this.precision).mmul(r).get(0, 0);
    return -0.5 * (chi2 + this.logDet + this.n * Math.log(2 * Math.PI));
  }

  /** The same with the precision as a flat array (fast loops for brute-force integrals). */
  logDensityFast(d: Float64Array, m: Float64Array): number {
    const n = this.n;
    const r = this.scratch;
    for (let i = 0; i < n; i++) r[i] = d[i] - m[i];
    let chi2 = 0;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += this.flatPrecision[i * n + j] * r[j];
      chi2 += r[i] * s;
    }
    return -0.5 * (chi2 + this.logDet + n * Math.log(2 * Math.PI));
  }

  chi2(d: Float64Array, m: Float64Array): number {
    const r = Matrix.columnVector(Array.from(d, (v, i) => v - m[i]));
    return r.transpose().mmul(this.precision).mmul(r).get(0, 0);
  }
}
