/**
 * exp(-x) for the hot loops of the bispectrum quadratures, about 2.5 times
 * cheaper than Math.exp under V8: exp(-x) = exp(-j/128) exp(-d), j = floor(128 x),
 * the first factor from a table and the second from its Taylor series to d^4
 * (0 <= d < 1/128, remainder below d^5/120 < 2.5e-13). Relative error below
 * 2.5e-13 for 0 <= x < 64 (tests/numerics/fast-exp.test.ts); other arguments,
 * NaN included, go to Math.exp.
 */
const STEPS = 128;
/** Arguments at or beyond this leave the table (the WebAssembly kernel of src/bispectrum/compiled-multipole-kernel.ts relies on it). */
export const EXP_TABLE_LIMIT = 64;
/** exp(-j/128), j = 0 .. 128 * 64; shared with the WebAssembly kernel. */
export const EXP_TABLE = Float64Array.from({ length: STEPS * EXP_TABLE_LIMIT + 1 }, (_, j) => Math.exp(-j / STEPS));

export function expNegative(x: number): number {
  if (!(x >= 0 && x < EXP_TABLE_LIMIT)) return Math.exp(-x);
  const j = (x * STEPS) | 0;
  const d = x - j / STEPS;
  return EXP_TABLE[j] * (1 - d * (1 - d * (0.5 - d * (1 / 6 - d / 24))));
}
