/**
 * Density thresholds of highest-density regions: for each fraction p, the
 * level such that the cells at or above it hold at least p of the total mass
 * (the smallest such set, since cells are taken densest first).
 */
export function massLevels(cellMass: ArrayLike<number>, fractions: readonly number[]): number[] {
  const sorted = Float64Array.from(cellMass).sort().reverse();
  let total = 0;
  for (const v of sorted) total += v;
  return fractions.map((p) => {
    if (!(p > 0 && p < 1)) throw new Error(`internal: credible fraction must be in (0, 1), got ${p}`);
    let cumulative = 0;
    for (const v of sorted) {
      cumulative += v;
      if (cumulative >= p * total) return v;
    }
    return sorted[sorted.length - 1];
  });
}
