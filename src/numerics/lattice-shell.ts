/**
 * Discrete wavevectors of a periodic box of side L (k_f = 2 pi / L) that fall in
 * a k shell [kLo, kHi) — the half-open rule of docs/conventions.md. Vectors are
 * integer triples n with k = k_f |n|; the line of sight is the z axis.
 * Both n and -n are listed (a real field's modes come in such pairs).
 */
export interface LatticeShell {
  /** Number of vectors in the shell. */
  readonly count: number;
  /** Integer components, 3 per vector: [nx0, ny0, nz0, nx1, ...]. */
  readonly vectors: Int16Array;
  /** |n|^2 of each vector. */
  readonly normSquared: Int32Array;
}

export function fundamentalFrequency(boxSize: number): number {
  return (2 * Math.PI) / boxSize;
}

/** All lattice vectors with kLo <= k_f |n| < kHi. */
export function latticeShell(boxSize: number, kLo: number, kHi: number): LatticeShell {
  const kf = fundamentalFrequency(boxSize);
  // Compare integer |n|^2 with the squared bounds in units of k_f. The bounds are
  // nudged down by a relative 1e-9 so that a vector whose k equals an edge up to
  // rounding always goes to the shell above, as the half-open rule says.
  const lo2 = (kLo / kf) ** 2 * (1 - 1e-9);
  const hi2 = (kHi / kf) ** 2 * (1 - 1e-9);
  const nMax = Math.ceil(kHi / kf);
  const out: number[] = [];
  const norms: number[] = [];
  for (let x = -nMax; x <= nMax; x++) {
    for (let y = -nMax; y <= nMax; y++) {
      const xy = x * x + y * y;
      if (xy >= hi2) continue;
      for (let z = -nMax; z <= nMax; z++) {
        const n2 = xy + z * z;
        if (n2 >= lo2 && n2 < hi2) {
          out.push(x, y, z);
          norms.push(n2);
        }
      }
    }
  }
  return { count: norms.length, vectors: Int16Array.from(out), normSquared: Int32Array.from(norms) };
}
