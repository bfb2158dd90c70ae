import type { CubicSpline } from './cubic-spline.js';

/**
 * A natural cubic spline's value at fixed abscissae is linear in its node
 * values and second derivatives (Press et al., Numerical Recipes 3rd ed.,
 * eq. 3.3.3): y(t) = A y_i + B y_{i+1} + C y''_i + D y''_{i+1}. A stencil keeps
 * i and A–D of every abscissa for one grid, so that each new spline on that
 * grid (a new linear spectrum, same wavenumbers) is evaluated at all of them
 * with four multiply-adds per point and no interval search.
 */
export class SplineStencil {
  readonly size: number;
  private readonly x: Float64Array;
  private readonly index: Int32Array;
  private readonly coef: Float64Array;

  /** Abscissae must lie inside the grid of `grid` (no extrapolation). */
  constructor(grid: CubicSpline, points: ArrayLike<number>) {
    const n = points.length;
    const x = grid.x;
    this.size = n;
    this.x = x;
    this.index = new Int32Array(n);
    this.coef = new Float64Array(4 * n);
    for (let p = 0; p < n; p++) {
      const t = points[p];
      if (!(t >= grid.x0 && t <= grid.x1)) throw new RangeError(`spline stencil: abscissa ${t} lies outside the grid [${grid.x0}, ${grid.x1}]`);
      const i = grid.interval(t);
      const h = x[i + 1] - x[i];
      const a = (x[i + 1] - t) / h;
      const b = 1 - a;
      this.index[p] = i;
      this.coef[4 * p] = a;
      this.coef[4 * p + 1] = b;
      this.coef[4 * p + 2] = ((a * a * a - a) * h * h) / 6;
      this.coef[4 * p + 3] = ((b * b * b - b) * h * h) / 6;
    }
  }

  /** True when `spline` has the grid this stencil was built for. */
  fits(spline: CubicSpline): boolean {
    const x = spline.x;
    if (x === this.x) return true;
    if (x.length !== this.x.length) return false;
    for (let i = 0; i < x.length; i++) if (x[i] !== this.x[i]) return false;
    return true;
  }

  /** out[p] = spline(points[p]); the spline must fit the stencil. */
  apply(spline: CubicSpline, out: Float64Array): Float64Array {
    if (!this.fits(spline)) throw new RangeError('spline stencil: the spline has a different grid');
    const { y, y2 } = spline;
    const idx = this.index;
    const c = this.coef;
    for (let p = 0; p < this.size; p++) {
      const i = idx[p];
      out[p] = c[4 * p] * y[i] + c[4 * p + 1] * y[i + 1] + c[4 * p + 2] * y2[i] + c[4 * p + 3] * y2[i + 1];
    }
    return out;
  }
}
