import { describe, expect, it } from 'vitest';
import { CubicSpline } from '../../src/numerics/cubic-spline.js';
import { SplineStencil } from '../../src/numerics/spline-stencil.js';

describe('SplineStencil', () => {
  const x = Float64Array.from({ length: 40 }, (_, i) => 0.01 + 0.005 * i);
  const points = Float64Array.from({ length: 500 }, (_, p) => x[0] + ((x[39] - x[0]) * p) / 499);

  it('gives what CubicSpline.at gives, for two splines on one grid (uniform and non-uniform)', () => {
    for (const grid of [x, x.map((v, i) => v + 1e-4 * Math.sin(i))]) {
      const stencil = new SplineStencil(new CubicSpline(grid, grid.map(Math.sin)), points);
      for (const fn of [(v: number) => Math.exp(-30 * v), (v: number) => Math.sin(80 * v) / v]) {
        const spline = new CubicSpline(grid, grid.map(fn));
        const out = stencil.apply(spline, new Float64Array(points.length));
        for (let p = 0; p < points.length; p++) expect(Math.abs(out[p] - spline.at(points[p]))).toBeLessThanOrEqual(1e-14 * Math.abs(spline.at(points[p])) + 1e-15);
      }
    }
  });

  it('refuses abscissae outside the grid and splines on another grid', () => {
    const spline = new CubicSpline(x, x);
    expect(() => new SplineStencil(spline, [x[0] - 1e-6])).toThrow(/outside the grid/);
    const stencil = new SplineStencil(spline, [0.05]);
    expect(stencil.fits(new CubicSpline(x.map((v) => v * 1.01), x))).toBe(false);
    expect(() => stencil.apply(new CubicSpline(x.map((v) => v * 1.01), x), new Float64Array(1))).toThrow(/different grid/);
  });
});
