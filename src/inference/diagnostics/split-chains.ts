/**
 * Split each chain into its first and second halves (the middle draw of an
 * odd-length chain is dropped), doubling the number of chains: the "split"
 * of split R-hat (Vehtari et al. 2021, Bayesian Analysis 16, 667, sec. 3.1).
 */
export function splitChains(chains: readonly Float64Array[]): Float64Array[] {
  const out: Float64Array[] = [];
  for (const c of chains) {
    const half = Math.floor(c.length / 2);
    out.push(c.slice(0, half), c.slice(c.length - half));
  }
  return out;
}
