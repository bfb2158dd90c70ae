import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { InputError } from '../../contracts/input-error.js';

/**
 * Cholesky factor C = L L^T of a symmetric positive-definite matrix (Golub &
 * Van Loan, Matrix Computations, alg. 4.2.1), row-major Float64Array, with the
 * triangular solves the likelihood needs. The covariance enters the
 * likelihood only through this factor.
 */
export interface CholeskyFactor {
  readonly size: number;
  /** Lower triangle, row-major n x n (upper part zero). */
  readonly lower: Float64Array;
  /** ln det C = 2 sum ln L_ii. */
  readonly logDet: number;
}

/** Smallest eigenvalue of a symmetric row-major matrix (ml-matrix eigen-decomposition). */
export function smallestEigenvalue(m: Float64Array, n: number): number {
  const rows = Array.from({ length: n }, (_, i) => Array.from(m.subarray(i * n, (i + 1) * n)));
  const e = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
  return Math.min(...e.realEigenvalues);
}

/**
 * Factorise, or throw an InputError naming `label` and the smallest eigenvalue
 * when the matrix is not positive definite.
 */
export function choleskyFactor(m: Float64Array, n: number, label = 'covariance'): CholeskyFactor {
  const L = new Float64Array(n * n);
  let logDet = 0;
  for (let j = 0; j < n; j++) {
    const rj = j * n;
    let d = m[rj + j];
    for (let k = 0; k < j; k++) d -= L[rj + k] * L[rj + k];
    if (!(d > 0)) {
      throw new InputError(`${label} is not positive definite: smallest eigenvalue ${smallestEigenvalue(m, n).toPrecision(6)} (the Cholesky pivot of row ${j + 1} is ${d.toPrecision(6)})`, { where: label });
    }
    const ljj = Math.sqrt(d);
    L[rj + j] = ljj;
    logDet += 2 * Math.log(ljj);
    for (let i = j + 1; i < n; i++) {
      const ri = i * n;
      let s = m[ri + j];
      for (let k = 0; k < j; k++) s -= L[ri + k] * L[rj + k];
      L[ri + j] = s / ljj;
    }
  }
  return { size: n, lower: L, logDet };
}

/** Solve L y = b (forward substitution) into `out`. */
export function solveLower(f: CholeskyFactor, b: Float64Array, out: Float64Array = new Float64Array(f.size)): Float64Array {
  const n = f.size;
  const L = f.lower;
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    let s = b[i];
    for (let k = 0; k < i; k++) s -= L[ri + k] * out[k];
    out[i] = s / L[ri + i];
  }
  return out;
}

/** Solve L^T x = y (back substitution) into `out`. */
export function solveUpper(f: CholeskyFactor, y: Float64Array, out: Float64Array = new Float64Array(f.size)): Float64Array {
  const n = f.size;
  const L = f.lower;
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i];
    for (let k = i + 1; k < n; k++) s -= L[k * n + i] * out[k];
    out[i] = s / L[i * n + i];
  }
  return out;
}

/** C^{-1} b. */
export function choleskySolve(f: CholeskyFactor, b: Float64Array): Float64Array {
  return solveUpper(f, solveLower(f, b));
}
