import { choleskyFactor, solveLower, type CholeskyFactor } from '../../data/covariance/cholesky-factor.js';

/**
 * Cholesky factor of a covariance that splits into independent blocks: the
 * connected components of its non-zero pattern (an analytic Gaussian
 * covariance is a 3 x 3 block per k bin plus one entry per triangle; a mock
 * covariance is one dense block). Each block is factorised on its own, so
 * whitening costs sum_b n_b^2 / 2 instead of n^2 / 2. Exact: it is the
 * Cholesky factor of the symmetrically permuted matrix.
 */
export class BlockCholesky {
  readonly size: number;
  /** ln det C. */
  readonly logDet: number;
  readonly blocks: readonly { readonly indices: Int32Array; readonly factor: CholeskyFactor }[];
  private readonly scratchIn: Float64Array;
  private readonly scratchOut: Float64Array;
  private readonly singleIndex: Int32Array;
  private readonly singleInverse: Float64Array;
  private readonly multiples: readonly { readonly indices: Int32Array; readonly factor: CholeskyFactor; readonly x: Float64Array; readonly y: Float64Array }[];

  constructor(matrix: Float64Array, n: number, label = 'covariance') {
    this.size = n;
    const components = connectedComponents(matrix, n);
    let logDet = 0;
    let largest = 0;
    this.blocks = components.map((indices) => {
      const m = indices.length;
      largest = Math.max(largest, m);
      const sub = new Float64Array(m * m);
      for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) sub[a * m + b] = matrix[indices[a] * n + indices[b]];
      const factor = choleskyFactor(sub, m, m === n ? label : `${label} (block of entries ${[...indices.slice(0, 4)].map((i) => i + 1).join(', ')}${m > 4 ? ', ...' : ''})`);
      logDet += factor.logDet;
      return { indices, factor };
    });
    this.logDet = logDet;
    this.scratchIn = new Float64Array(largest);
    this.scratchOut = new Float64Array(largest);
    // Entries uncorrelated with any other are whitened in one flat loop, first.
    const singles = this.blocks.filter((b) => b.indices.length === 1);
    this.singleIndex = Int32Array.from(singles, (b) => b.indices[0]);
    this.singleInverse = Float64Array.from(singles, (b) => 1 / b.factor.lower[0]);
    this.multiples = this.blocks
      .filter((b) => b.indices.length > 1)
      .map((b) => ({ ...b, x: this.scratchIn.subarray(0, b.indices.length), y: this.scratchOut.subarray(0, b.indices.length) }));
  }

  /**
   * out = L^{-1} v with the entries permuted (single entries first, then the
   * blocks); norms and dot products are unchanged by the permutation.
   */
  whiten(v: Float64Array, out: Float64Array = new Float64Array(this.size)): Float64Array {
    const single = this.singleIndex;
    const inverse = this.singleInverse;
    let offset = single.length;
    for (let a = 0; a < offset; a++) out[a] = v[single[a]] * inverse[a];
    for (const { indices, factor, x, y } of this.multiples) {
      const m = indices.length;
      for (let a = 0; a < m; a++) x[a] = v[indices[a]];
      solveLower(factor, x, y);
      out.set(y, offset);
      offset += m;
    }
    return out;
  }
}

/** Connected components of the graph with an edge (i, j) wherever M_ij != 0 (union–find). */
function connectedComponents(m: Float64Array, n: number): Int32Array[] {
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]];
      i = parent[i];
    }
    return i;
  };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      if (m[i * n + j] !== 0 || m[j * n + i] !== 0) {
        const a = find(i);
        const b = find(j);
        if (a !== b) parent[Math.max(a, b)] = Math.min(a, b);
      }
    }
  }
  const groups = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const r = find(i);
    const g = groups.get(r) ?? [];
    g.push(i);
    groups.set(r, g);
  }
  return [...groups.values()].map((g) => Int32Array.from(g));
}
