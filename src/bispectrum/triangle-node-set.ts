/**
 * Weighted closing triangles standing for each bin: what an average over a bin
 * reduces to once the orientation is integrated separately. Centres and
 * effective wavenumbers have one node per bin; the continuous bin-volume
 * average has many. Nodes of bin b are start[b] .. start[b+1]-1; weights of a
 * bin sum to 1; sides are in the bin's order (k1 from the first listed shell).
 */
export interface TriangleNodeSet {
  readonly binCount: number;
  readonly start: Int32Array;
  readonly k1: Float64Array;
  readonly k2: Float64Array;
  readonly k3: Float64Array;
  readonly weight: Float64Array;
}

/** One node per bin, weight 1. */
export function singleNodePerBin(k1: Float64Array, k2: Float64Array, k3: Float64Array): TriangleNodeSet {
  const n = k1.length;
  const start = new Int32Array(n + 1);
  for (let b = 0; b <= n; b++) start[b] = b;
  return { binCount: n, start, k1, k2, k3, weight: new Float64Array(n).fill(1) };
}
