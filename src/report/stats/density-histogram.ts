import { InputError } from '../../contracts/input-error.js';

/** A histogram normalised as a probability density: sum of density × width = 1. */
export interface DensityHistogram {
  /** bins + 1 edges, increasing. */
  edges: Float64Array;
  density: Float64Array;
}

/** Rice rule, 2 n^(1/3), kept within 10..50 bins (common practice). */
export function defaultBinCount(sampleSize: number): number {
  return Math.max(10, Math.min(50, Math.round(2 * Math.cbrt(sampleSize))));
}

/**
 * Equal-width bins on [lo, hi]; the last bin includes hi. Values outside the
 * range are left out of both the counts and the normalisation.
 */
export function densityHistogram(values: ArrayLike<number>, lo: number, hi: number, bins: number): DensityHistogram {
  if (!(hi > lo) || !Number.isInteger(bins) || bins < 1) {
    throw new InputError(`histogram needs hi > lo and a positive whole bin count, got [${lo}, ${hi}] with ${bins} bins`);
  }
  const width = (hi - lo) / bins;
  const counts = new Float64Array(bins);
  let total = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!(v >= lo && v <= hi)) continue;
    counts[Math.min(bins - 1, Math.floor((v - lo) / width))] += 1;
    total += 1;
  }
  if (total === 0) throw new InputError(`histogram: no values inside [${lo}, ${hi}]`);
  const edges = new Float64Array(bins + 1);
  for (let i = 0; i <= bins; i++) edges[i] = lo + i * width;
  const density = counts.map((c) => c / (total * width));
  return { edges, density };
}
