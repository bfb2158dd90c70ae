import { describe, expect, it } from 'vitest';
import { CubicSpline, LogLogSpline, SharedGridSplines } from '../../src/numerics/cubic-spline.js';

describe('cubic spline', () => {
  it('interpolates sin to the O(h^4) accuracy of a cubic spline away from the ends', () => {
    // Interior error bound of a cubic spline: (5/384) h^4 max|f''''| (de Boor, A Practical Guide to Splines, ch. IV).
    const n = 201;
    const x = Float64Array.from({ length: n }, (_, i) => (i * Math.PI * 2) / (n - 1));
    const s = new CubicSpline(x, Array.from(x, Math.sin));
    const h = x[1] - x[0];
    const bound = (5 / 384) * h ** 4 * 1.01;
    let worst = 0;
    for (let t = 0.5; t < 5.5; t += 0.0137) worst = Math.max(worst, Math.abs(s.at(t) - Math.sin(t)));
    expect(worst).toBeLessThan(bound * 4);
    expect(worst).toBeGreaterThan(0);
  });

  it('uses the same answer on uniform and non-uniform grids for a straight line', () => {
    const s1 = new CubicSpline([0, 1, 2, 3], [1, 3, 5, 7]);
    const s2 = new CubicSpline([0, 0.5, 2, 3], [1, 2, 5, 7]);
    for (const t of [-1, 0.25, 1.7, 2.9, 4]) {
      expect(s1.at(t)).toBeCloseTo(1 + 2 * t, 13);
      expect(s2.at(t)).toBeCloseTo(1 + 2 * t, 13);
    }
  });

  it('log-log spline reproduces a power law exactly, inside and beyond the table', () => {
    const k = Array.from({ length: 50 }, (_, i) => 1e-3 * 1.2 ** i);
    const s = new LogLogSpline(k, k.map((v) => 3 * v ** -1.5));
    for (const t of [1e-4, 2e-3, 0.05, 10]) expect(s.at(t) / (3 * t ** -1.5) - 1).toBeCloseTo(0, 12);
    expect(s.slope(0.01)).toBeCloseTo(-1.5, 12);
  });

  it('refuses non-increasing abscissae and non-positive log-log values', () => {
    expect(() => new CubicSpline([0, 1, 1], [0, 1, 2])).toThrow(/increase strictly.*index 2/);
    expect(() => new LogLogSpline([1, 2, 3], [1, 0, 2])).toThrow(/row 1/);
  });
});

describe('SharedGridSplines', () => {
  it('gives s1(t) + c s2(t) as two CubicSpline.at calls, to 1e-14, and refuses grids that differ or are not uniform', () => {
    const x = Float64Array.from({ length: 50 }, (_, i) => 0.004 + 0.003 * i);
    const s1 = new CubicSpline(x, x.map((v) => 1e4 * Math.exp(-20 * v)));
    const s2 = new CubicSpline(x, x.map((v) => 300 * Math.sin(100 * v)));
    const pair = new SharedGridSplines(s1, s2);
    for (let p = 0; p <= 1000; p++) {
      const t = x[0] + ((x[49] - x[0]) * p) / 1000;
      for (const c of [0, 0.37, 1]) {
        const want = s1.at(t) + c * s2.at(t);
        expect(Math.abs(pair.sum(t, c) - want)).toBeLessThanOrEqual(1e-14 * (Math.abs(s1.at(t)) + Math.abs(s2.at(t))));
      }
    }
    expect(() => new SharedGridSplines(s1, new CubicSpline(x.map((v) => v * 1.001), x))).toThrow(/one uniform grid/);
    const bent = x.map((v, i) => v + 1e-4 * i * i);
    expect(() => new SharedGridSplines(new CubicSpline(bent, x), new CubicSpline(bent, x))).toThrow(/one uniform grid/);
  });
});
