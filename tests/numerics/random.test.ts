import { describe, expect, it } from 'vitest';
import { Random } from '../../src/numerics/random.js';

describe('seeded random numbers', () => {
  it('is reproducible for a seed and differs between seeds', () => {
    const a = new Random(42);
    const b = new Random(42);
    const c = new Random(43);
    const sa = Array.from({ length: 5 }, () => a.uniform());
    expect(Array.from({ length: 5 }, () => b.uniform())).toEqual(sa);
    expect(Array.from({ length: 5 }, () => c.uniform())).not.toEqual(sa);
  });

  it('restores its exact state, including a pending normal deviate', () => {
    const r = new Random(7);
    r.normal(); // leaves a spare
    const saved = r.getState();
    const next = [r.normal(), r.uniform(), r.normal()];
    const restored = Random.fromState(JSON.parse(JSON.stringify(saved)));
    expect([restored.normal(), restored.uniform(), restored.normal()]).toEqual(next);
  });

  it('normal deviates have mean 0 and variance 1 within 5 standard errors', () => {
    const r = new Random(2024);
    const n = 200_000;
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const x = r.normal();
      s += x;
      s2 += x * x;
    }
    const mean = s / n;
    const variance = s2 / n - mean * mean;
    // Standard errors of the sample mean (1/sqrt n) and variance (sqrt(2/n)) for a unit normal.
    expect(Math.abs(mean)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(variance - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
  });

  it('uniform deviates stay in [0, 1)', () => {
    const r = new Random(1);
    let lo = 1;
    let hi = 0;
    for (let i = 0; i < 100_000; i++) {
      const u = r.uniform();
      lo = Math.min(lo, u);
      hi = Math.max(hi, u);
    }
    expect(lo).toBeGreaterThanOrEqual(0);
    expect(hi).toBeLessThan(1);
    expect(hi - lo).toBeGreaterThan(0.999);
  });
});
