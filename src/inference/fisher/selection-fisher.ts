import type { ParameterValues } from '../../contracts/statistic-model.js';
import { choleskyFactor, choleskySolve } from '../../data/covariance/cholesky-factor.js';
import { selectVector } from '../../data/scale-cuts.js';
import { fisherMatrix, type FisherMatrix } from './fisher-matrix.js';
import type { SourceModelVector } from './source-model-vector.js';

/**
 * Fisher matrix of the entries `indices` of a bundle's data vector, with the
 * covariance of exactly those entries (row-major, already cut). Parameters the
 * models are linear in take their exact columns; the others are differentiated
 * numerically by fisherMatrix (two steps, a warning when they disagree).
 * `precisionFactor` multiplies C^{-1} (a Hartlap factor; 1 for a Gaussian covariance).
 */
export interface SelectionFisherSetup {
  readonly vector: SourceModelVector;
  readonly names: readonly string[];
  readonly fiducial: ParameterValues;
  readonly indices: Int32Array;
  readonly covariance: Float64Array;
  readonly precisionFactor?: number;
  readonly steps?: Readonly<Record<string, number>>;
  readonly label?: string;
}

export function selectionFisher(s: SelectionFisherSetup): FisherMatrix {
  const n = s.indices.length;
  const factor = choleskyFactor(s.covariance, n, s.label ?? 'covariance');
  const h = s.precisionFactor ?? 1;
  const linear = new Set(s.vector.linearNames(s.fiducial));
  const exactNames = s.names.filter((name) => linear.has(name));
  const columns = s.vector.linearColumns(s.fiducial, exactNames);
  const exactDerivatives = Object.fromEntries(exactNames.map((name) => [name, selectVector(columns[name], s.indices)]));
  return fisherMatrix({
    names: s.names,
    fiducial: s.fiducial,
    model: (p) => selectVector(s.vector.evaluate(p), s.indices),
    precision: (v) => {
      const out = choleskySolve(factor, v);
      if (h !== 1) for (let i = 0; i < out.length; i++) out[i] *= h;
      return out;
    },
    steps: s.steps,
    exactDerivatives,
  });
}
