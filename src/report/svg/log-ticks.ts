import type { TickSet } from './linear-ticks.js';

/**
 * Tick positions for a log axis on [lo, hi] (both > 0): the powers of ten
 * inside; when fewer than three fit, also 2 and 5 times them; when the range
 * is narrower than that, the 1-9 multiples.
 */
export function logTicks(lo: number, hi: number): TickSet {
  const pick = (mantissas: readonly number[]): number[] => {
    const out: number[] = [];
    for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
      for (const m of mantissas) {
        const v = Number((m * 10 ** e).toPrecision(12));
        if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(v);
      }
    }
    return out;
  };
  for (const mantissas of [[1], [1, 2, 5], [1, 2, 3, 4, 5, 6, 7, 8, 9]]) {
    const values = pick(mantissas);
    if (values.length >= 3) {
      // Too many decades: keep every n-th power so that at most ~7 remain.
      const stride = Math.ceil(values.length / 7);
      return { values: values.filter((_, i) => i % stride === 0), step: 0 };
    }
  }
  return { values: pick([1, 2, 3, 4, 5, 6, 7, 8, 9]), step: 0 };
}
