import { describe, expect, it } from 'vitest';
import { insideLoops } from './point-in-loops.js';
import { Random } from '../../src/numerics/random.js';
import { credibleContours } from '../../src/report/stats/credible-contours.js';
import { covarianceEllipse, deltaChiSquareTwoDof } from '../../src/report/stats/covariance-ellipse.js';
import { densityHistogram } from '../../src/report/stats/density-histogram.js';
import { massLevels } from '../../src/report/stats/mass-levels.js';
import { InputError } from '../../src/contracts/input-error.js';

function correlatedGaussian(n: number, seed: number, rho: number): { x: Float64Array; y: Float64Array } {
  const r = new Random(seed);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = r.normal();
    const b = r.normal();
    x[i] = 1 + 2 * a;
    y[i] = -3 + 0.5 * (rho * a + Math.sqrt(1 - rho * rho) * b);
  }
  return { x, y };
}

describe('sample statistics for plots', () => {
  it('normalises histogram bars to unit area', () => {
    const r = new Random(1);
    const v = Array.from({ length: 5000 }, () => r.normal());
    const h = densityHistogram(v, -5, 5, 37);
    let area = 0;
    for (let i = 0; i < 37; i++) area += h.density[i] * (h.edges[i + 1] - h.edges[i]);
    expect(area).toBeCloseTo(1, 12);
    // The peak of a unit normal density is 1/sqrt(2 pi) = 0.399; bins of width 0.27 blur it a little.
    expect(Math.max(...h.density)).toBeGreaterThan(0.36);
    expect(Math.max(...h.density)).toBeLessThan(0.44);
    expect(() => densityHistogram(v, 1, 1, 10)).toThrow(InputError);
  });

  it('finds the mass levels of highest-density cells', () => {
    // Cells 5, 3, 1, 1 of total 10: 50% needs the 5 alone, 80% needs 5 + 3, 90% adds a 1.
    expect(massLevels([1, 5, 1, 3], [0.5, 0.8, 0.9])).toEqual([5, 3, 1]);
  });

  it('draws 68% and 95% contours that enclose those fractions of a correlated Gaussian sample', () => {
    const { x, y } = correlatedGaussian(20000, 11, 0.7);
    const contours = credibleContours(x, y, [0.68, 0.95], {
      xDomain: [1 - 9, 1 + 9],
      yDomain: [-3 - 2.25, -3 + 2.25],
      bins: 60,
      smoothingCells: 0.8,
    });
    for (const c of contours) {
      expect(c.loops.length).toBeGreaterThan(0);
      let inside = 0;
      for (let i = 0; i < x.length; i++) if (insideLoops(x[i], y[i], c.loops)) inside++;
      expect(inside / x.length).toBeGreaterThan(c.fraction - 0.02);
      expect(inside / x.length).toBeLessThan(c.fraction + 0.02);
    }
    // The 68% region of this Gaussian is the ellipse with Delta chi^2 = -2 ln(0.32) = 2.28; its largest
    // x offset from the mean is sigma_x sqrt(2.28) = 3.02.
    const xs = contours[0].loops.flat().map((p) => p[0]);
    expect(Math.max(...xs) - 1).toBeGreaterThan(3.02 * 0.93);
    expect(Math.max(...xs) - 1).toBeLessThan(3.02 * 1.07);
  });

  it('traces ellipses on the requested chi-square surface', () => {
    const cov = [
      [4, 1.2],
      [1.2, 1],
    ];
    const det = 4 * 1 - 1.2 * 1.2;
    const dchi = deltaChiSquareTwoDof(0.6827);
    expect(dchi).toBeCloseTo(2.2957, 3);
    for (const [px, py] of covarianceEllipse([0.5, -1], cov, dchi, 24)) {
      const dx = px - 0.5;
      const dy = py + 1;
      // Inverse of [[a, b], [b, c]] is [[c, -b], [-b, a]] / det.
      expect((1 * dx * dx - 2 * 1.2 * dx * dy + 4 * dy * dy) / det).toBeCloseTo(dchi, 10);
    }
    expect(() => covarianceEllipse([0, 0], [[1, 2], [2, 1]], 1)).toThrow(/not positive definite/);
    expect(() => covarianceEllipse([0, 0], [[1, 0.1], [0.2, 1]], 1)).toThrow(/not symmetric/);
  });
});
