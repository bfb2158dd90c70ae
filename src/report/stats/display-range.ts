import { axisDomain } from '../svg/axis-domain.js';

/**
 * The range to show for a sample: its 0.1% to 99.9% quantiles (so a few
 * stray draws do not squash the plot), widened to include any reference
 * values (truths), then padded by 5%.
 */
export function sampleDisplayRange(samples: ArrayLike<number>, include: readonly number[] = []): [number, number] {
  const sorted = Float64Array.from(samples).sort();
  const at = (p: number): number => sorted[Math.min(sorted.length - 1, Math.max(0, Math.round(p * (sorted.length - 1))))];
  return axisDomain([at(0.001), at(0.999), ...include], 'linear', 0.05);
}
