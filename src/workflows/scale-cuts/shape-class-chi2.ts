import { shapeClassOf, type ShapeClass } from '../../bispectrum/shape-classes.js';
import { choleskyFactor, choleskySolve } from '../../data/covariance/cholesky-factor.js';
import type { MeasuredEntry } from '../../data/data-vector.js';

/**
 * Shape class of a data-vector entry: the triangle class of
 * src/bispectrum/shape-classes.ts for a bispectrum entry, "power" for a P entry.
 */
export type DataEntryShapeClass = ShapeClass | 'power';

export function dataEntryShapeClass(e: MeasuredEntry, dk: number): DataEntryShapeClass {
  if (e.statistic === 'P') return 'power';
  const [i, j, l] = e.shells;
  const [c1, c2, c3] = e.k;
  return shapeClassOf(i, j, l, c1, c2, c3, dk);
}

/**
 * Share of chi^2 = r^T C^{-1} r carried by each class of entries:
 * chi2_c = sum_{i in c} r_i (C^{-1} r)_i, so the shares add up to chi^2
 * (with a correlated covariance a share can be negative).
 * `precisionFactor` multiplies C^{-1} (Hartlap).
 */
export function chiSquareByClass(residual: Float64Array, covariance: Float64Array, classes: readonly DataEntryShapeClass[], precisionFactor = 1): Partial<Record<DataEntryShapeClass, number>> {
  const w = choleskySolve(choleskyFactor(covariance, residual.length, 'scan covariance'), residual);
  const out: Partial<Record<DataEntryShapeClass, number>> = {};
  for (let i = 0; i < residual.length; i++) out[classes[i]] = (out[classes[i]] ?? 0) + precisionFactor * residual[i] * w[i];
  return out;
}
