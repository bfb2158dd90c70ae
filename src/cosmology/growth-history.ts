import type { Background } from './background.js';

/**
 * Scale-independent linear growth of the matter field from the growth ODE in
 * x = ln a (e.g. Dodelson & Schmidt, Modern Cosmology 2nd ed., eq. 8.77 rewritten in ln a):
 *   D'' + (2 + dlnE/dlna) D' - (3/2) Omega_cl(a) D = 0,
 * Omega_cl the clustering fraction (cold matter plus rho - 3p of the massive neutrinos).
 * The growing mode starts at a = 1e-5 from the exact matter + radiation
 * solution D = a + (2/3) a_eq (Meszaros 1974), so D / a -> 1 deep in matter
 * domination and D = a exactly in Einstein–de Sitter. Fixed-step classical RK4;
 * D and D' are interpolated between steps by cubic Hermite polynomials.
 */
export class GrowthHistory {
  readonly lnA0: number;
  readonly step: number;
  /** D and dD/dln a at the nodes x_i = lnA0 + i step, up to a = 1. */
  readonly d: Float64Array;
  readonly dPrime: Float64Array;
  readonly dSecond: Float64Array;
  /** Growth-equation coefficients 2 + dlnE/dlna and (3/2) Omega_cl at the half steps x_j = lnA0 + j step / 2. */
  private readonly drag: Float64Array;
  private readonly source: Float64Array;

  constructor(background: Background, options: { aStart?: number; steps?: number } = {}) {
    const aStart = options.aStart ?? 1e-5;
    const steps = options.steps ?? 384;
    this.lnA0 = Math.log(aStart);
    this.step = -this.lnA0 / steps;
    const n = steps + 1;
    this.d = new Float64Array(n);
    this.dPrime = new Float64Array(n);
    this.dSecond = new Float64Array(n);
    this.drag = new Float64Array(2 * steps + 1);
    this.source = new Float64Array(2 * steps + 1);
    for (let j = 0; j <= 2 * steps; j++) {
      const g = background.growthCoefficients(Math.exp(this.lnA0 + 0.5 * j * this.step));
      this.drag[j] = 2 + g.dlnEdlna;
      this.source[j] = 1.5 * g.clusteringFraction;
    }
    const aEq = background.equalityScaleFactor;
    let y = aStart + (2 / 3) * aEq;
    let v = aStart;
    const h = this.step;
    for (let i = 0; i < n; i++) {
      this.d[i] = y;
      this.dPrime[i] = v;
      this.dSecond[i] = this.accel(2 * i, y, v);
      if (i === n - 1) break;
      // RK4 for the system (y, v)' = (v, accel(x, y, v)); half-step coefficients sit at index 2i + 1.
      const k1y = v;
      const k1v = this.dSecond[i];
      const k2y = v + 0.5 * h * k1v;
      const k2v = this.accel(2 * i + 1, y + 0.5 * h * k1y, k2y);
      const k3y = v + 0.5 * h * k2v;
      const k3v = this.accel(2 * i + 1, y + 0.5 * h * k2y, k3y);
      const k4y = v + h * k3v;
      const k4v = this.accel(2 * i + 2, y + h * k3y, k4y);
      y += (h / 6) * (k1y + 2 * k2y + 2 * k3y + k4y);
      v += (h / 6) * (k1v + 2 * k2v + 2 * k3v + k4v);
    }
  }

  /** D'' at half-step node j. */
  private accel(j: number, y: number, v: number): number {
    return -this.drag[j] * v + this.source[j] * y;
  }

  /** Cubic Hermite interpolation of (value, slope) node arrays at x = ln a. */
  private hermite(values: Float64Array, slopes: Float64Array, x: number): number {
    const last = values.length - 1;
    let t = (x - this.lnA0) / this.step;
    let i = Math.floor(t);
    if (i < 0) i = 0;
    else if (i > last - 1) i = last - 1;
    t -= i;
    const t2 = t * t;
    const t3 = t2 * t;
    return (
      (2 * t3 - 3 * t2 + 1) * values[i] +
      (t3 - 2 * t2 + t) * this.step * slopes[i] +
      (-2 * t3 + 3 * t2) * values[i + 1] +
      (t3 - t2) * this.step * slopes[i + 1]
    );
  }

  private checkRedshift(z: number): number {
    if (!(z >= 0) || !(Math.log(1 / (1 + z)) >= this.lnA0)) {
      throw new RangeError(`growth is tabulated for 0 <= z <= ${Math.exp(-this.lnA0) - 1}, got z = ${z}`);
    }
    return -Math.log1p(z);
  }

  /** Growth factor D(z), normalised so that D / a -> 1 deep in matter domination. */
  factor(z: number): number {
    return this.hermite(this.d, this.dPrime, this.checkRedshift(z));
  }

  /** Growth rate f(z) = dln D / dln a. */
  rate(z: number): number {
    const x = this.checkRedshift(z);
    return this.hermite(this.dPrime, this.dSecond, x) / this.hermite(this.d, this.dPrime, x);
  }
}
