import { expect } from 'vitest';

/**
 * Averaged templates [bin][multipole][17 values] agree to `tolerance` relative
 * to the largest template of the same bin and multipole (some entries are
 * exactly zero, e.g. the l > 0 moment of the constant 1/nbar^2 term, and are
 * rounding noise in both sums).
 */
export function expectTemplatesClose(actual: Float64Array, expected: Float64Array, tolerance: number): void {
  const T = 17;
  expect(actual.length).toBe(expected.length);
  for (let i = 0; i < actual.length; i++) {
    const row = expected.subarray(i - (i % T), i - (i % T) + T);
    const scale = Math.max(...Array.from(row, Math.abs));
    expect(Math.abs(actual[i] - expected[i])).toBeLessThanOrEqual(tolerance * scale);
  }
}
