import { fundamentalFrequency, latticeShell } from '../../numerics/lattice-shell.js';
import type { ShellGrid } from '../triangle-bins.js';

/**
 * The k shells of a triangle binning on the lattice of one periodic box, in
 * integer units: which shell every |n|^2 belongs to. Built from the numerics
 * lattice-shell helper, so the half-open edge rule is the one of
 * docs/conventions.md by construction.
 */
export interface LatticeShellTable {
  readonly kf: number;
  /** shellOfNorm[|n|^2] = shell index, or -1 when |n|^2 is in no shell. */
  readonly shellOfNorm: Int16Array;
  /** Largest |n|^2 of shell s (or of the shells below it when s is empty). */
  readonly maxNorm: Int32Array;
  /** Integer vectors of each shell, 3 per vector (both n and -n listed; may include n = 0). */
  readonly vectors: readonly Int16Array[];
}

export function latticeShellTable(boxSize: number, grid: ShellGrid): LatticeShellTable {
  const kf = fundamentalFrequency(boxSize);
  const vectors: Int16Array[] = [];
  const norms: Int32Array[] = [];
  let top = 0;
  for (let s = 0; s < grid.count; s++) {
    const centre = grid.kMin + s * grid.dk;
    const shell = latticeShell(boxSize, centre - grid.dk / 2, centre + grid.dk / 2);
    vectors.push(shell.vectors);
    norms.push(shell.normSquared);
    for (const n2 of shell.normSquared) if (n2 > top) top = n2;
  }
  const shellOfNorm = new Int16Array(top + 1).fill(-1);
  // The zero vector (a shell starting at k = 0) is never a side of a triangle:
  // an estimator drops the k = 0 mode.
  const maxNorm = new Int32Array(grid.count);
  let running = 0;
  for (let s = 0; s < grid.count; s++) {
    for (const n2 of norms[s]) {
      if (n2 === 0) continue;
      shellOfNorm[n2] = s;
      if (n2 > running) running = n2;
    }
    maxNorm[s] = running;
  }
  return { kf, shellOfNorm, maxNorm, vectors };
}
