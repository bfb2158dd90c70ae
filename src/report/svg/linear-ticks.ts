/**
 * "Nice" tick positions for a linear axis: steps of 1, 2 or 5 times a power of
 * ten, about `target` of them inside [lo, hi] (common practice).
 */
export interface TickSet {
  values: number[];
  /** Spacing between ticks (linear axes) or 0 for log axes. */
  step: number;
}

function niceStep(span: number, target: number): number {
  const raw = span / Math.max(1, target);
  const power = 10 ** Math.floor(Math.log10(raw));
  const mantissa = raw / power;
  const nice = mantissa < 1.5 ? 1 : mantissa < 3.5 ? 2 : mantissa < 7.5 ? 5 : 10;
  return nice * power;
}

export function linearTicks(lo: number, hi: number, target = 5): TickSet {
  const step = niceStep(hi - lo, target);
  const first = Math.ceil(lo / step - 1e-9);
  const last = Math.floor(hi / step + 1e-9);
  const values: number[] = [];
  for (let i = first; i <= last; i++) {
    // Multiply integers by the step and round away binary noise (0.30000000000000004).
    const v = Number((i * step).toPrecision(12));
    values.push(v === 0 ? 0 : v);
  }
  return { values, step };
}
