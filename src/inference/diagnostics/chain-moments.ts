/** Means and unbiased variances of equal-length chains, and the two R-hat variances. */
export interface ChainMoments {
  readonly means: Float64Array;
  readonly variances: Float64Array;
  /** W: mean within-chain variance. */
  readonly within: number;
  /** var+ = (N-1)/N W + B/N (Gelman & Rubin 1992; Vehtari et al. 2021, eq. 3). */
  readonly pooled: number;
}

export function chainMoments(chains: readonly Float64Array[]): ChainMoments {
  const m = chains.length;
  const n = chains[0].length;
  const means = new Float64Array(m);
  const variances = new Float64Array(m);
  for (let c = 0; c < m; c++) {
    const x = chains[c];
    if (x.length !== n) throw new RangeError('chains of unequal length');
    let s = 0;
    for (let i = 0; i < n; i++) s += x[i];
    const mean = s / n;
    let ss = 0;
    for (let i = 0; i < n; i++) ss += (x[i] - mean) ** 2;
    means[c] = mean;
    variances[c] = ss / (n - 1);
  }
  let within = 0;
  let grand = 0;
  for (let c = 0; c < m; c++) {
    within += variances[c] / m;
    grand += means[c] / m;
  }
  let between = 0; // B / N
  if (m > 1) {
    for (let c = 0; c < m; c++) between += (means[c] - grand) ** 2;
    between /= m - 1;
  }
  return { means, variances, within, pooled: ((n - 1) / n) * within + between };
}
