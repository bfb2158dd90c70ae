import { EigenvalueDecomposition, Matrix, inverse } from 'ml-matrix';
import { InputError } from '../../contracts/input-error.js';
import type { FisherMatrix } from './fisher-matrix.js';

/** Errors from a Fisher matrix: marginalised sqrt((F^{-1})_aa), conditional 1/sqrt(F_aa). */
export interface FisherErrors {
  readonly names: readonly string[];
  readonly marginalised: Float64Array;
  readonly conditional: Float64Array;
  /** Row-major parameter covariance F^{-1}. */
  readonly covariance: Float64Array;
}

function toMatrix(f: FisherMatrix): Matrix {
  const n = f.names.length;
  const m = new Matrix(n, n);
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) m.set(a, b, f.matrix[a * n + b]);
  return m;
}

/**
 * Refuses a singular (or numerically singular) Fisher matrix and names the
 * degenerate direction: the eigenvector of the smallest eigenvalue of the
 * diagonally normalised matrix D^{-1/2} F D^{-1/2}, listed by its large components.
 */
export function assertInvertible(f: FisherMatrix, relativeFloor = 1e-12): void {
  const n = f.names.length;
  for (let a = 0; a < n; a++) {
    if (!(f.matrix[a * n + a] > 0)) {
      throw new InputError(`Fisher matrix is singular: the data do not constrain "${f.names[a]}" at all (zero information)`);
    }
  }
  const scaled = new Matrix(n, n);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      scaled.set(a, b, f.matrix[a * n + b] / Math.sqrt(f.matrix[a * n + a] * f.matrix[b * n + b]));
    }
  }
  const evd = new EigenvalueDecomposition(scaled, { assumeSymmetric: true });
  const values = evd.realEigenvalues;
  let iMin = 0;
  for (let i = 1; i < n; i++) if (values[i] < values[iMin]) iMin = i;
  const largest = Math.max(...values);
  if (values[iMin] <= relativeFloor * largest) {
    const vec = evd.eigenvectorMatrix.getColumn(iMin);
    const parts = vec
      .map((c, i) => ({ c, name: f.names[i] }))
      .filter((p) => Math.abs(p.c) > 0.2)
      .sort((p, q) => Math.abs(q.c) - Math.abs(p.c))
      .map((p) => `${p.c >= 0 ? '+' : '-'}${Math.abs(p.c).toFixed(2)} ${p.name}`);
    throw new InputError(
      `Fisher matrix is singular: the data cannot tell apart the combination ${parts.join(' ')} (normalised eigenvalue ${values[iMin].toExponential(2)})`,
      { hint: 'fix one of these parameters, add a prior on it, or add data that break the degeneracy' },
    );
  }
}

export function fisherErrors(f: FisherMatrix): FisherErrors {
  assertInvertible(f);
  const n = f.names.length;
  const inv = inverse(toMatrix(f));
  const covariance = new Float64Array(n * n);
  const marginalised = new Float64Array(n);
  const conditional = new Float64Array(n);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) covariance[a * n + b] = inv.get(a, b);
    marginalised[a] = Math.sqrt(inv.get(a, a));
    conditional[a] = 1 / Math.sqrt(f.matrix[a * n + a]);
  }
  return { names: f.names, marginalised, conditional, covariance };
}

/**
 * Sum of Fisher matrices of independent data (or a data Fisher matrix plus an
 * external Gaussian prior). Parameters are the union in order of first
 * appearance; a matrix lacking a parameter contributes zero information on it.
 */
export function addFisher(...parts: readonly FisherMatrix[]): FisherMatrix {
  const names: string[] = [];
  for (const p of parts) for (const name of p.names) if (!names.includes(name)) names.push(name);
  const n = names.length;
  const matrix = new Float64Array(n * n);
  const warnings: string[] = [];
  for (const p of parts) {
    const map = p.names.map((name) => names.indexOf(name));
    const m = p.names.length;
    for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) matrix[map[a] * n + map[b]] += p.matrix[a * m + b];
    warnings.push(...p.warnings);
  }
  return { names, matrix, warnings };
}

/** Gaussian prior of standard deviations sigma_a, uncorrelated, as a Fisher matrix. */
export function gaussianPriorFisher(sigmas: Readonly<Record<string, number>>): FisherMatrix {
  const names = Object.keys(sigmas);
  const n = names.length;
  const matrix = new Float64Array(n * n);
  names.forEach((name, a) => {
    const s = sigmas[name];
    if (!(s > 0) || !Number.isFinite(s)) throw new InputError(`prior width for "${name}" must be positive and finite, got ${s}`);
    matrix[a * n + a] = 1 / (s * s);
  });
  return { names, matrix, warnings: [] };
}

/** The Fisher matrix restricted to a subset of parameters (the others held fixed). */
export function fixParameters(f: FisherMatrix, keep: readonly string[]): FisherMatrix {
  const n = f.names.length;
  const idx = keep.map((name) => {
    const i = f.names.indexOf(name);
    if (i < 0) throw new InputError(`parameter "${name}" is not in the Fisher matrix (it has: ${f.names.join(', ')})`);
    return i;
  });
  const m = idx.length;
  const matrix = new Float64Array(m * m);
  for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) matrix[a * m + b] = f.matrix[idx[a] * n + idx[b]];
  return { names: [...keep], matrix, warnings: f.warnings };
}
