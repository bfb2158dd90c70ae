import type { TriangleBins } from '../src/bispectrum/triangle-bins.js';

/**
 * Shape class of bin n for the accuracy study. Stand-in until the model's own
 * classifier lands in src/bispectrum (then this file re-exports it): on the
 * bin centres c1 >= c2 >= c3, in this order of precedence,
 * equilateral (c1 = c3), flattened (c1 >= c2 + c3 - dk/2: centres at or past
 * collinear), squeezed (c3 <= c1 / 4), isosceles (c1 = c2 or c2 = c3), general.
 */
export function studyShapeClass(bins: TriangleBins, n: number): string {
  const [i, j, l] = bins.indices.subarray(3 * n, 3 * n + 3);
  const [c1, c2, c3] = bins.centres.subarray(3 * n, 3 * n + 3);
  const dk = bins.shells.dk;
  if (i === l) return 'equilateral';
  if (c1 >= c2 + c3 - dk / 2 - 1e-12) return 'flattened';
  if (c3 <= c1 / 4 + 1e-12) return 'squeezed';
  if (i === j || j === l) return 'isosceles';
  return 'general';
}
