import { InputError } from '../../contracts/input-error.js';

/**
 * Delta chi-square of the region holding probability p of a 2-D Gaussian:
 * the chi-square CDF for 2 degrees of freedom is 1 - exp(-x/2), so
 * x = -2 ln(1 - p) (2.30 for 68.27%, 6.18 for 95.45%).
 */
export function deltaChiSquareTwoDof(p: number): number {
  return -2 * Math.log(1 - p);
}

/** Gaussian probability within 1 and 2 sigma in one dimension, used for "1σ" and "2σ" ellipses. */
export const ONE_SIGMA_MASS = 0.682689492137;
export const TWO_SIGMA_MASS = 0.954499736104;

/**
 * Points on the ellipse (p - c)^T C^{-1} (p - c) = deltaChiSquare, traced as
 * c + sqrt(deltaChiSquare) L (cos t, sin t) with C = L L^T (Cholesky).
 */
export function covarianceEllipse(
  centre: readonly [number, number],
  covariance: readonly (readonly number[])[],
  deltaChiSquare: number,
  points = 120,
  name = 'covariance',
): Array<[number, number]> {
  const [a, b] = covariance[0] ?? [];
  const [b2, c] = covariance[1] ?? [];
  if (covariance.length !== 2 || covariance[0].length !== 2 || covariance[1].length !== 2) {
    throw new InputError(`${name} must be a 2x2 matrix`);
  }
  if (![a, b, b2, c, centre[0], centre[1]].every(Number.isFinite)) throw new InputError(`${name} or its centre holds a non-finite number`);
  if (Math.abs(b - b2) > 1e-10 * Math.max(Math.abs(b), Math.abs(b2), Math.sqrt(Math.abs(a * c)))) {
    throw new InputError(`${name} is not symmetric: [0][1] = ${b} but [1][0] = ${b2}`);
  }
  if (!(a > 0) || !(a * c - b * b > 0)) throw new InputError(`${name} is not positive definite`);
  const l11 = Math.sqrt(a);
  const l21 = b / l11;
  const l22 = Math.sqrt(c - l21 * l21);
  const r = Math.sqrt(deltaChiSquare);
  const out: Array<[number, number]> = [];
  for (let i = 0; i < points; i++) {
    const t = (2 * Math.PI * i) / points;
    const u = r * Math.cos(t);
    const v = r * Math.sin(t);
    out.push([centre[0] + l11 * u, centre[1] + l21 * u + l22 * v]);
  }
  return out;
}
