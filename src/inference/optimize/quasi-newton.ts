import type { LocalSearchResult, Objective } from './nelder-mead.js';

export interface QuasiNewtonOptions {
  /** Relative finite-difference step h_i = relativeStep (1 + |x_i|). Default 1e-6 (~ eps^(1/3)). */
  readonly relativeStep?: number;
  /** Stop when the step is below xTolerance (1 + |x|) in every coordinate. Default 1e-12. */
  readonly xTolerance?: number;
  /** Default 200. */
  readonly maxIterations?: number;
}

/** Central-difference gradient, O(h^2) error. */
function gradient(f: Objective, x: Float64Array, relativeStep: number, out: Float64Array): number {
  let evaluations = 0;
  for (let i = 0; i < x.length; i++) {
    const xi = x[i];
    const h = relativeStep * (1 + Math.abs(xi));
    x[i] = xi + h;
    const up = f(x);
    x[i] = xi - h;
    const down = f(x);
    x[i] = xi;
    out[i] = (up - down) / (2 * h);
    evaluations += 2;
  }
  return evaluations;
}

/**
 * BFGS quasi-Newton minimisation (Nocedal & Wright, Numerical Optimization,
 * 2nd ed., alg. 6.1, inverse-Hessian update eq. 6.17) with central-difference
 * gradients and a backtracking Armijo line search (their alg. 3.1, c1 = 1e-4).
 * Meant to polish a point already near a smooth minimum.
 */
export function quasiNewton(f: Objective, start: Float64Array, options: QuasiNewtonOptions = {}): LocalSearchResult {
  const d = start.length;
  const rel = options.relativeStep ?? 1e-6;
  const xTol = options.xTolerance ?? 1e-12;
  const maxIterations = options.maxIterations ?? 200;
  const x = start.slice();
  let fx = f(x);
  let evaluations = 1;
  const g = new Float64Array(d);
  evaluations += gradient(f, x, rel, g);
  const H = new Float64Array(d * d);
  for (let i = 0; i < d; i++) H[i * d + i] = 1 / Math.max(1e-12, Math.abs(g[i]) || 1);
  const p = new Float64Array(d);
  const s = new Float64Array(d);
  const y = new Float64Array(d);
  const gNew = new Float64Array(d);
  const xNew = new Float64Array(d);
  const Hy = new Float64Array(d);
  let converged = false;
  for (let it = 0; it < maxIterations && !converged; it++) {
    let slope = 0;
    for (let i = 0; i < d; i++) {
      let v = 0;
      for (let j = 0; j < d; j++) v -= H[i * d + j] * g[j];
      p[i] = v;
      slope += v * g[i];
    }
    if (!(slope < 0)) {
      // Not a descent direction: reset to steepest descent.
      H.fill(0);
      for (let i = 0; i < d; i++) {
        H[i * d + i] = 1;
        p[i] = -g[i];
      }
      slope = -g.reduce((a, v) => a + v * v, 0);
      if (slope === 0) break;
    }
    let t = 1;
    let fNew = Infinity;
    for (let k = 0; k < 60; k++) {
      for (let i = 0; i < d; i++) xNew[i] = x[i] + t * p[i];
      fNew = f(xNew);
      evaluations++;
      if (fNew <= fx + 1e-4 * t * slope) break;
      t /= 2;
    }
    if (!(fNew <= fx)) break; // no progress possible at this precision
    converged = true;
    for (let i = 0; i < d; i++) {
      s[i] = xNew[i] - x[i];
      if (Math.abs(s[i]) > xTol * (1 + Math.abs(x[i]))) converged = false;
    }
    evaluations += gradient(f, xNew, rel, gNew);
    let sy = 0;
    for (let i = 0; i < d; i++) {
      y[i] = gNew[i] - g[i];
      sy += s[i] * y[i];
    }
    x.set(xNew);
    g.set(gNew);
    fx = fNew;
    if (sy > 1e-300) {
      let yHy = 0;
      for (let i = 0; i < d; i++) {
        let v = 0;
        for (let j = 0; j < d; j++) v += H[i * d + j] * y[j];
        Hy[i] = v;
        yHy += y[i] * v;
      }
      const rho = 1 / sy;
      // H <- (I - rho s y^T) H (I - rho y s^T) + rho s s^T, expanded:
      for (let i = 0; i < d; i++) {
        for (let j = 0; j < d; j++) {
          H[i * d + j] += -rho * (s[i] * Hy[j] + Hy[i] * s[j]) + (rho * rho * yHy + rho) * s[i] * s[j];
        }
      }
    }
  }
  return { x, value: fx, evaluations, converged };
}
