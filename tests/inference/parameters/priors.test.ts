import { describe, expect, it } from 'vitest';
import { logPriorDensity, priorProblems, type PriorSpec } from '../../../src/inference/parameters/priors.js';
import { gaussLegendreOn } from '../../../src/numerics/gauss-legendre.js';

/**
 * int exp(log density) over [a, b] by composite Gauss–Legendre (64 panels x 8 nodes),
 * in ln x when `logarithmic` (x = e^u, dx = e^u du).
 */
function integrate(p: PriorSpec, a: number, b: number, logarithmic = false): number {
  const [lo, hi] = logarithmic ? [Math.log(a), Math.log(b)] : [a, b];
  let s = 0;
  const panels = 64;
  for (let i = 0; i < panels; i++) {
    const r = gaussLegendreOn(8, lo + ((hi - lo) * i) / panels, lo + ((hi - lo) * (i + 1)) / panels);
    r.nodes.forEach((u, j) => {
      const x = logarithmic ? Math.exp(u) : u;
      s += r.weights[j] * Math.exp(logPriorDensity(p, x)) * (logarithmic ? x : 1);
    });
  }
  return s;
}

describe('priors', () => {
  it('are normalised densities on their support (numerical integration)', () => {
    expect(integrate({ kind: 'uniform', min: -2, max: 3 }, -2, 3)).toBeCloseTo(1, 12);
    expect(integrate({ kind: 'gaussian', mean: 1, sigma: 0.5 }, -9, 11)).toBeCloseTo(1, 12);
    expect(integrate({ kind: 'log-uniform', min: 0.01, max: 10 }, 0.01, 10, true)).toBeCloseTo(1, 12);
  });

  it('have the textbook shapes: log-uniform is uniform in ln x, the Gaussian falls by 1/2 in ln per sigma^2', () => {
    const lu: PriorSpec = { kind: 'log-uniform', min: 1, max: 100 };
    expect(logPriorDensity(lu, 2) + Math.log(2)).toBeCloseTo(logPriorDensity(lu, 50) + Math.log(50), 12);
    const g: PriorSpec = { kind: 'gaussian', mean: 0, sigma: 2 };
    expect(logPriorDensity(g, 0) - logPriorDensity(g, 2)).toBeCloseTo(0.5, 12);
  });

  it('are -Infinity outside the support, including truncated Gaussians', () => {
    expect(logPriorDensity({ kind: 'uniform', min: 0, max: 1 }, 1.0001)).toBe(-Infinity);
    expect(logPriorDensity({ kind: 'log-uniform', min: 1, max: 2 }, 0.5)).toBe(-Infinity);
    expect(logPriorDensity({ kind: 'gaussian', mean: 0, sigma: 1, min: 0 }, -0.1)).toBe(-Infinity);
  });

  it('are validated field by field', () => {
    expect(priorProblems({ kind: 'uniform', min: 2, max: 1 }, 'p')).toEqual(['p: max (1) must exceed min (2)']);
    expect(priorProblems({ kind: 'gaussian', mean: 0, sigma: -1 }, 'p')).toEqual(['p.sigma must be positive, got -1']);
    expect(priorProblems({ kind: 'log-uniform', min: 0, max: 1 }, 'p')).toEqual(['p.min must be positive for a log-uniform prior, got 0']);
    expect(priorProblems({ kind: 'cauchy' }, 'p')[0]).toMatch(/p\.kind must be uniform, gaussian, log-uniform or flat/);
    expect(priorProblems({ kind: 'uniform', min: 0, max: 1, mean: 3 }, 'p')).toEqual(['p.mean is not a field of a uniform prior (min, max)']);
  });
});
