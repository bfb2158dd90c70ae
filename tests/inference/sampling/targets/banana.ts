/**
 * Test target: a curved ("banana") density. With y1 ~ N(0, s^2), y2 ~ N(0, 1)
 * and x1 = y1, x2 = y2 + b (y1^2 - s^2), a map of unit Jacobian, so
 *   ln p(x) = -x1^2 / (2 s^2) - (x2 - b (x1^2 - s^2))^2 / 2.
 * Exact moments: E[x] = 0, Var x1 = s^2, Var x2 = 1 + 2 b^2 s^4 (E y1^4 = 3 s^4),
 * Cov(x1, x2) = b E[y1^3] = 0.
 */
export function bananaTarget(options: { s: number; b: number }): (theta: Float64Array) => number {
  const { s, b } = options;
  return (x) => -(x[0] * x[0]) / (2 * s * s) - 0.5 * (x[1] - b * (x[0] * x[0] - s * s)) ** 2;
}
