import { legendrePair } from './legendre.js';

/**
 * Gauss–Legendre quadrature nodes and weights on [-1, 1] by Newton iteration on
 * the three-term Legendre recurrence (Abramowitz & Stegun 25.4.29; Press et al.,
 * Numerical Recipes 3rd ed., sec. 4.6). An n-point rule integrates polynomials of
 * degree <= 2n - 1 exactly.
 */
export interface QuadratureRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

const cache = new Map<number, QuadratureRule>();

export function gaussLegendre(n: number): QuadratureRule {
  if (!Number.isInteger(n) || n < 1) {
    throw new RangeError(`Gauss–Legendre order must be a positive integer, got ${n}`);
  }
  const hit = cache.get(n);
  if (hit) return hit;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const half = Math.floor((n + 1) / 2);
  const pair = new Float64Array(2);
  // Derivative of L_n from L_n and L_{n-1} (A&S 22.8.5).
  const derivative = (x: number) => {
    legendrePair(n, x, pair);
    return (n * (x * pair[0] - pair[1])) / (x * x - 1);
  };
  for (let i = 0; i < half; i++) {
    // Tricomi's initial guess for the i-th root, then Newton steps.
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    for (let iter = 0; iter < 100; iter++) {
      const dx = legendrePair(n, x, pair)[0] / derivative(x);
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    const dp = derivative(x);
    const w = 2 / ((1 - x * x) * dp * dp);
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = w;
    weights[n - 1 - i] = w;
  }
  if (n % 2 === 1) nodes[(n - 1) / 2] = 0;
  const rule = { nodes, weights };
  cache.set(n, rule);
  return rule;
}

/** The n-point rule mapped affinely onto [a, b]. */
export function gaussLegendreOn(n: number, a: number, b: number): QuadratureRule {
  const base = gaussLegendre(n);
  const half = 0.5 * (b - a);
  const mid = 0.5 * (b + a);
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    nodes[i] = mid + half * base.nodes[i];
    weights[i] = half * base.weights[i];
  }
  return { nodes, weights };
}
