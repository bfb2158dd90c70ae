/** Quantile p of all draws pooled, interpolating linearly between order statistics (numpy's default rule). */
export function pooledQuantile(chains: readonly Float64Array[], p: number): number {
  let total = 0;
  for (const c of chains) total += c.length;
  const all = new Float64Array(total);
  let o = 0;
  for (const c of chains) {
    all.set(c, o);
    o += c.length;
  }
  all.sort();
  const h = (total - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, total - 1);
  return all[lo] + (h - lo) * (all[hi] - all[lo]);
}
