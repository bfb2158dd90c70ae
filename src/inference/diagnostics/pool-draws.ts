/** All draws of several chains, concatenated in chain order. */
export function poolDraws(chains: readonly Float64Array[]): Float64Array {
  let total = 0;
  for (const c of chains) total += c.length;
  const all = new Float64Array(total);
  let o = 0;
  for (const c of chains) {
    all.set(c, o);
    o += c.length;
  }
  return all;
}
