import { normalQuantile } from './normal-quantile.js';
import { poolDraws } from './pool-draws.js';

/**
 * Rank normalisation (Vehtari et al. 2021, eq. 14): pool all draws, replace
 * each by its rank r (ties get their average rank) and map it to
 * z = Phi^{-1}((r - 3/8) / (S + 1/4)), S the total number of draws.
 * Returns chains of the same shapes.
 */
export function rankNormalize(chains: readonly Float64Array[]): Float64Array[] {
  const values = poolDraws(chains);
  const total = values.length;
  const order = new Uint32Array(total);
  for (let i = 0; i < total; i++) order[i] = i;
  order.sort((a, b) => values[a] - values[b]);
  const z = new Float64Array(total);
  for (let i = 0; i < total; ) {
    let j = i + 1;
    while (j < total && values[order[j]] === values[order[i]]) j++;
    const rank = (i + 1 + j) / 2; // average of the 1-based ranks i+1 .. j
    const zi = normalQuantile((rank - 0.375) / (total + 0.25));
    for (let k = i; k < j; k++) z[order[k]] = zi;
    i = j;
  }
  const out: Float64Array[] = [];
  let o = 0;
  for (const c of chains) {
    out.push(z.slice(o, o + c.length));
    o += c.length;
  }
  return out;
}
