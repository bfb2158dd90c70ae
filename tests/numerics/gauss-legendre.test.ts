import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { gaussLegendre, gaussLegendreOn } from '../../src/numerics/gauss-legendre.js';
import { legendre } from '../../src/numerics/legendre.js';

const fixture = JSON.parse(readFileSync(new URL('../fixtures/numpy/gauss_legendre.json', import.meta.url), 'utf8')) as {
  rules: Record<string, { nodes: number[]; weights: number[] }>;
};

describe('Gauss–Legendre quadrature', () => {
  it('matches numpy leggauss nodes and weights (fixture from numpy)', () => {
    for (const [n, ref] of Object.entries(fixture.rules)) {
      const rule = gaussLegendre(Number(n));
      ref.nodes.forEach((x, i) => expect(rule.nodes[i]).toBeCloseTo(x, 14));
      ref.weights.forEach((w, i) => expect(rule.weights[i]).toBeCloseTo(w, 14));
    }
  });

  it('integrates x^(2n-1) and x^(2n-2) exactly but not x^(2n) (A&S 25.4.29)', () => {
    const n = 6;
    const { nodes, weights } = gaussLegendreOn(n, 0, 1);
    const integral = (p: number) => nodes.reduce((s, x, i) => s + weights[i] * x ** p, 0);
    expect(integral(2 * n - 1)).toBeCloseTo(1 / (2 * n), 14);
    expect(integral(2 * n - 2)).toBeCloseTo(1 / (2 * n - 1), 14);
    expect(Math.abs(integral(2 * n) - 1 / (2 * n + 1))).toBeGreaterThan(1e-8);
  });

  it('Legendre polynomials are orthogonal with norm 2/(2l+1) (A&S 22.2.10)', () => {
    const { nodes, weights } = gaussLegendre(12);
    for (let l = 0; l <= 8; l++) {
      for (let m = 0; m <= 8; m++) {
        let s = 0;
        for (let i = 0; i < nodes.length; i++) s += weights[i] * legendre(l, nodes[i]) * legendre(m, nodes[i]);
        expect(s).toBeCloseTo(l === m ? 2 / (2 * l + 1) : 0, 13);
      }
    }
  });

  it('refuses a non-positive order', () => {
    expect(() => gaussLegendre(0)).toThrow(/positive integer/);
  });
});
