import { InputError } from '../../contracts/input-error.js';
import type { AxisKind } from './axis-scale.js';

/**
 * The displayed range of an axis: the extent of the values, widened by
 * `padding` (a fraction of the span; in log space for log axes). A single
 * value gets a range around it.
 */
export function axisDomain(values: Iterable<number> | ArrayLike<number>, kind: AxisKind, padding = 0.05): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const raw of Array.from(values)) {
    if (!Number.isFinite(raw)) continue;
    if (kind === 'log' && raw <= 0) throw new InputError(`log axis needs positive values, got ${raw}`);
    const v = kind === 'log' ? Math.log10(raw) : raw;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (lo === Infinity) throw new InputError('nothing to plot: no finite values for an axis');
  if (hi === lo) {
    const half = kind === 'log' ? 0.5 : lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= half;
    hi += half;
  } else {
    const pad = (hi - lo) * padding;
    lo -= pad;
    hi += pad;
  }
  return kind === 'log' ? [10 ** lo, 10 ** hi] : [lo, hi];
}
