/**
 * Natural cubic spline through (x_i, y_i) on a strictly increasing grid
 * (Press et al., Numerical Recipes 3rd ed., sec. 3.3, eqs. 3.3.7–3.3.8).
 * Lookup is O(1) on uniform grids and a bisection otherwise. Outside the grid
 * the spline continues as the straight line with the end slope; callers that
 * must refuse or warn about extrapolation check `x0` and `x1` themselves.
 */
export class CubicSpline {
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Second derivatives at the nodes. */
  readonly y2: Float64Array;
  readonly x0: number;
  readonly x1: number;
  private readonly uniformStep: number;
  private readonly slope0: number;
  private readonly slope1: number;

  constructor(x: ArrayLike<number>, y: ArrayLike<number>) {
    const n = x.length;
    if (n < 3) throw new RangeError(`a cubic spline needs at least 3 points, got ${n}`);
    if (y.length !== n) throw new RangeError(`spline x and y lengths differ (${n} vs ${y.length})`);
    this.x = Float64Array.from(x);
    this.y = Float64Array.from(y);
    for (let i = 1; i < n; i++) {
      if (!(this.x[i] > this.x[i - 1])) {
        throw new RangeError(`spline abscissae must increase strictly (index ${i}: ${this.x[i - 1]} then ${this.x[i]})`);
      }
    }
    this.y2 = new Float64Array(n);
    const u = new Float64Array(n);
    for (let i = 1; i < n - 1; i++) {
      const sig = (this.x[i] - this.x[i - 1]) / (this.x[i + 1] - this.x[i - 1]);
      const p = sig * this.y2[i - 1] + 2;
      this.y2[i] = (sig - 1) / p;
      const d =
        (this.y[i + 1] - this.y[i]) / (this.x[i + 1] - this.x[i]) -
        (this.y[i] - this.y[i - 1]) / (this.x[i] - this.x[i - 1]);
      u[i] = ((6 * d) / (this.x[i + 1] - this.x[i - 1]) - sig * u[i - 1]) / p;
    }
    this.y2[n - 1] = 0;
    for (let k = n - 2; k >= 0; k--) this.y2[k] = this.y2[k] * this.y2[k + 1] + u[k];
    this.x0 = this.x[0];
    this.x1 = this.x[n - 1];
    const h = (this.x1 - this.x0) / (n - 1);
    let uniform = true;
    for (let i = 1; i < n && uniform; i++) {
      if (Math.abs(this.x[i] - this.x[i - 1] - h) > 1e-9 * Math.abs(h)) uniform = false;
    }
    this.uniformStep = uniform ? h : 0;
    this.slope0 = this.derivative(this.x0);
    this.slope1 = this.derivative(this.x1);
  }

  /** Index i with x[i] <= t < x[i+1], clamped to [0, n-2]. */
  private interval(t: number): number {
    const n = this.x.length;
    if (this.uniformStep > 0) {
      let i = Math.floor((t - this.x0) / this.uniformStep);
      if (i < 0) i = 0;
      else if (i > n - 2) i = n - 2;
      return i;
    }
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (this.x[mid] > t) hi = mid;
      else lo = mid;
    }
    return lo;
  }

  at(t: number): number {
    if (t < this.x0) return this.y[0] + this.slope0 * (t - this.x0);
    const n = this.x.length;
    if (t > this.x1) return this.y[n - 1] + this.slope1 * (t - this.x1);
    const i = this.interval(t);
    const h = this.x[i + 1] - this.x[i];
    const a = (this.x[i + 1] - t) / h;
    const b = 1 - a;
    return a * this.y[i] + b * this.y[i + 1] + ((a * a * a - a) * this.y2[i] + (b * b * b - b) * this.y2[i + 1]) * (h * h) / 6;
  }

  /** First derivative of the spline (end slope outside the grid). */
  derivative(t: number): number {
    const i = this.interval(Math.min(Math.max(t, this.x0), this.x1));
    const h = this.x[i + 1] - this.x[i];
    if (t < this.x0 || t > this.x1) {
      const tc = t < this.x0 ? this.x0 : this.x1;
      return this.derivativeInside(i, h, tc);
    }
    return this.derivativeInside(i, h, t);
  }

  private derivativeInside(i: number, h: number, t: number): number {
    const a = (this.x[i + 1] - t) / h;
    const b = 1 - a;
    return (
      (this.y[i + 1] - this.y[i]) / h -
      ((3 * a * a - 1) * h * this.y2[i]) / 6 +
      ((3 * b * b - 1) * h * this.y2[i + 1]) / 6
    );
  }
}

/**
 * Interpolation of a positive function in log-log space: a natural cubic spline
 * of ln y against ln x. Outside the table it continues as a power law with the
 * end logarithmic slope.
 */
export class LogLogSpline {
  private readonly spline: CubicSpline;
  readonly xMin: number;
  readonly xMax: number;

  constructor(x: ArrayLike<number>, y: ArrayLike<number>) {
    const n = x.length;
    const lx = new Float64Array(n);
    const ly = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      if (!(x[i] > 0) || !(y[i] > 0)) {
        throw new RangeError(`log-log interpolation needs positive values (row ${i}: x=${x[i]}, y=${y[i]})`);
      }
      lx[i] = Math.log(x[i]);
      ly[i] = Math.log(y[i]);
    }
    this.spline = new CubicSpline(lx, ly);
    this.xMin = x[0];
    this.xMax = x[n - 1];
  }

  at(x: number): number {
    return Math.exp(this.spline.at(Math.log(x)));
  }

  /** Logarithmic slope d ln y / d ln x. */
  slope(x: number): number {
    return this.spline.derivative(Math.log(x));
  }

  /** Fill out[i] = y(xs[i]). */
  fill(xs: ArrayLike<number>, out: Float64Array): Float64Array {
    for (let i = 0; i < xs.length; i++) out[i] = Math.exp(this.spline.at(Math.log(xs[i])));
    return out;
  }
}

/**
 * Two natural cubic splines on one uniform grid, evaluated together as
 * s1(t) + c s2(t): one interval search and one set of weights (eq. 3.3.3 as in
 * CubicSpline.at) for both, with no calls inside — for hot loops. Outside the
 * grid the end intervals' cubics are continued (callers keep t in range).
 */
export class SharedGridSplines {
  private readonly x: Float64Array;
  private readonly y1: Float64Array;
  private readonly d1: Float64Array;
  private readonly y2: Float64Array;
  private readonly d2: Float64Array;
  private readonly x0: number;
  private readonly invStep: number;
  private readonly step2over6: number;
  private readonly last: number;

  constructor(first: CubicSpline, second: CubicSpline) {
    const n = first.x.length;
    const step = (first.x1 - first.x0) / (n - 1);
    for (let i = 0; i < n; i++) {
      if (second.x[i] !== first.x[i] || Math.abs(first.x[i] - first.x0 - i * step) > 1e-9 * step) {
        throw new RangeError('SharedGridSplines needs two splines on one uniform grid');
      }
    }
    this.x = first.x;
    this.y1 = first.y;
    this.d1 = first.y2;
    this.y2 = second.y;
    this.d2 = second.y2;
    this.x0 = first.x0;
    this.invStep = 1 / step;
    this.step2over6 = (step * step) / 6;
    this.last = n - 2;
  }

  /**
   * The tables behind `sum`, for a compiled copy of it: the grid, per grid
   * point the four numbers y1, y1'', y2, y2'' (interleaved), the grid start,
   * 1 / step, step^2 / 6 and the last interval index.
   */
  packed(): { readonly x: Float64Array; readonly values: Float64Array; readonly x0: number; readonly invStep: number; readonly step2over6: number; readonly last: number } {
    const n = this.x.length;
    const values = new Float64Array(4 * n);
    for (let i = 0; i < n; i++) {
      values[4 * i] = this.y1[i];
      values[4 * i + 1] = this.d1[i];
      values[4 * i + 2] = this.y2[i];
      values[4 * i + 3] = this.d2[i];
    }
    return { x: this.x, values, x0: this.x0, invStep: this.invStep, step2over6: this.step2over6, last: this.last };
  }

  /** s1(t) + c s2(t). */
  sum(t: number, c: number): number {
    let i = Math.floor((t - this.x0) * this.invStep);
    if (i < 0) i = 0;
    else if (i > this.last) i = this.last;
    const a = (this.x[i + 1] - t) * this.invStep;
    const b = 1 - a;
    const ca = (a * a * a - a) * this.step2over6;
    const cb = (b * b * b - b) * this.step2over6;
    const { y1, d1, y2, d2 } = this;
    return a * y1[i] + b * y1[i + 1] + ca * d1[i] + cb * d1[i + 1] + c * (a * y2[i] + b * y2[i + 1] + ca * d2[i] + cb * d2[i + 1]);
  }
}
