import { InputError } from '../../contracts/input-error.js';

/**
 * Fisher information of a Gaussian likelihood with a parameter-independent
 * covariance: F_ab = (d m / d theta_a)^T C^{-1} (d m / d theta_b)
 * (Tegmark, Taylor & Heavens 1997, ApJ 480, 22, eq. 15 without the covariance
 * derivative term).
 *
 * Derivatives are central differences at two steps h and h/2; the reported
 * derivative is their Richardson combination (4 D(h/2) - D(h)) / 3, and a
 * parameter whose two estimates differ by more than `stabilityTolerance`
 * (in the C^{-1} norm) is named in `warnings`.
 *
 * A parameter that moves the model, over a change of max(|fiducial|, step),
 * by less than NO_INFORMATION_FRACTION of the model itself (both in the
 * C^{-1} norm) carries no information beyond rounding: its row and column
 * are set to zero, with a warning, so that inverting the matrix names it.
 */
export const NO_INFORMATION_FRACTION = 1e-10;

export type ModelVectorFunction = (params: Readonly<Record<string, number>>) => Float64Array;

/** Applies C^{-1} to a vector: out = C^{-1} v. */
export type PrecisionOperator = (v: Float64Array) => Float64Array;

export interface FisherSetup {
  readonly names: readonly string[];
  readonly fiducial: Readonly<Record<string, number>>;
  readonly model: ModelVectorFunction;
  readonly precision: PrecisionOperator;
  /** Absolute step per parameter; default 1% of |fiducial|, or 0.01 at zero. */
  readonly steps?: Readonly<Record<string, number>>;
  /** Relative disagreement of the two step sizes that triggers a warning (default 0.01). */
  readonly stabilityTolerance?: number;
  /**
   * Exact derivatives for parameters the model is linear in (for example the
   * columns of StatisticModel.linearPart); they skip finite differences.
   */
  readonly exactDerivatives?: Readonly<Record<string, Float64Array>>;
}

export interface FisherMatrix {
  readonly names: readonly string[];
  /** Row-major n x n. */
  readonly matrix: Float64Array;
  readonly warnings: readonly string[];
}

export function defaultFisherStep(value: number): number {
  return value === 0 ? 0.01 : 0.01 * Math.abs(value);
}

function centralDifference(model: ModelVectorFunction, fiducial: Readonly<Record<string, number>>, name: string, h: number): Float64Array {
  const mUp = model({ ...fiducial, [name]: fiducial[name] + h });
  const mDown = model({ ...fiducial, [name]: fiducial[name] - h });
  const d = new Float64Array(mUp.length);
  for (let i = 0; i < d.length; i++) d[i] = (mUp[i] - mDown[i]) / (2 * h);
  return d;
}

/**
 * Central differences at steps h and h/2 and their Richardson combination
 * (4 D(h/2) - D(h)) / 3, the derivative fisherMatrix uses.
 */
export function twoStepDerivative(model: ModelVectorFunction, fiducial: Readonly<Record<string, number>>, name: string, h: number): { derivative: Float64Array; coarse: Float64Array; fine: Float64Array } {
  const coarse = centralDifference(model, fiducial, name, h);
  const fine = centralDifference(model, fiducial, name, h / 2);
  const derivative = new Float64Array(fine.length);
  for (let i = 0; i < derivative.length; i++) derivative[i] = (4 * fine[i] - coarse[i]) / 3;
  return { derivative, coarse, fine };
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

export function fisherMatrix(setup: FisherSetup): FisherMatrix {
  const { names } = setup;
  if (names.length === 0) throw new InputError('Fisher matrix: no parameters were given');
  const tolerance = setup.stabilityTolerance ?? 0.01;
  const warnings: string[] = [];
  const derivatives: Float64Array[] = [];
  const weighted: Float64Array[] = [];
  const scales: number[] = [];
  for (const name of names) {
    const value = setup.fiducial[name];
    if (value === undefined || !Number.isFinite(value)) {
      throw new InputError(`Fisher matrix: parameter "${name}" has no finite fiducial value`);
    }
    const exact = setup.exactDerivatives?.[name];
    const h = setup.steps?.[name] ?? defaultFisherStep(value);
    if (!(h > 0)) throw new InputError(`Fisher matrix: step for "${name}" must be positive, got ${h}`);
    scales.push(Math.max(Math.abs(value), h));
    let d: Float64Array;
    if (exact) {
      d = exact;
    } else {
      const { derivative, coarse, fine } = twoStepDerivative(setup.model, setup.fiducial, name, h);
      d = derivative;
      const diff = new Float64Array(fine.length);
      for (let i = 0; i < d.length; i++) diff[i] = fine[i] - coarse[i];
      const normFine = Math.sqrt(Math.max(dot(fine, setup.precision(fine)), 0));
      const normDiff = Math.sqrt(Math.max(dot(diff, setup.precision(diff)), 0));
      if (normFine > 0 && normDiff / normFine > tolerance) {
        warnings.push(
          `derivative with respect to "${name}" changes by ${(100 * normDiff / normFine).toFixed(2)}% between steps ${h} and ${h / 2}: choose another step`,
        );
      }
    }
    derivatives.push(d);
    weighted.push(setup.precision(d));
  }
  const n = names.length;
  const matrix = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      const v = dot(derivatives[a], weighted[b]);
      matrix[a * n + b] = v;
      matrix[b * n + a] = v;
    }
  }
  const m0 = setup.model(setup.fiducial);
  const signal = Math.sqrt(Math.max(dot(m0, setup.precision(m0)), 0));
  names.forEach((name, a) => {
    const effect = Math.sqrt(Math.max(matrix[a * n + a], 0)) * scales[a];
    if (signal > 0 && effect < NO_INFORMATION_FRACTION * signal) {
      for (let b = 0; b < n; b++) matrix[a * n + b] = matrix[b * n + a] = 0;
      warnings.push(`"${name}" changes the model by ${(effect / signal).toExponential(1)} of itself over ${scales[a]}: no information beyond rounding (row and column set to zero)`);
    }
  });
  return { names: [...names], matrix, warnings };
}
