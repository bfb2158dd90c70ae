import { describe, expect, it } from 'vitest';
import { expNegative } from '../../src/numerics/fast-exp.js';

describe('expNegative', () => {
  it('matches Math.exp(-x) to 2.5e-13 relative (the d^5/120 bound, d < 1/128) on [0, 64), table nodes and their neighbours included', () => {
    let worst = 0;
    for (let i = 0; i <= 400000; i++) {
      const x = (64 * i) / 400001;
      worst = Math.max(worst, Math.abs(expNegative(x) / Math.exp(-x) - 1));
    }
    for (let j = 0; j < 64 * 128; j++) {
      for (const x of [j / 128, (j + 1) / 128 - 1e-15, j / 128 + 1e-12]) worst = Math.max(worst, Math.abs(expNegative(x) / Math.exp(-x) - 1));
    }
    expect(worst).toBeLessThan(2.5e-13);
  });

  it('is exact at 0 and hands negative, large and NaN arguments to Math.exp', () => {
    expect(expNegative(0)).toBe(1);
    for (const x of [-0.5, -1e-3, 64, 700, 1e6, -Infinity, Infinity]) expect(expNegative(x)).toBe(Math.exp(-x));
    expect(expNegative(Number.NaN)).toBeNaN();
  });
});
