import { InputError } from '../contracts/input-error.js';
import { shellCentre, type ShellGrid } from '../bispectrum/triangle-bins.js';
import { latticeShell } from '../numerics/lattice-shell.js';
import { meshNyquist, type Mesh } from './mesh.js';

/**
 * The modes of one k shell (half-open rule, src/numerics/lattice-shell.ts) as
 * entries of a half-complex spectrum (src/numerics/fft-3d.ts): only vectors
 * with nz >= 0 are stored; `weight` is 2 when nz > 0 (the entry stands for n
 * and -n) and 1 on the nz = 0 plane, where n and -n are separate entries.
 */
export interface ShellModes {
  /** Full-lattice number of modes, n and -n both counted: sum of `weight`. */
  readonly count: number;
  /** Complex index (ix n + iy)(n/2 + 1) + iz of each stored entry. */
  readonly index: Int32Array;
  readonly weight: Uint8Array;
  /** Signed integer components, 3 per entry. */
  readonly vector: Int16Array;
  /** |n| and mu = nz / |n| of each entry. */
  readonly norm: Float64Array;
  readonly mu: Float64Array;
}

/** Upper edge of the last shell; every estimator requires it <= the Nyquist wavenumber. */
export function shellsUpperEdge(shells: ShellGrid): number {
  return shellCentre(shells, shells.count - 1) + shells.dk / 2;
}

export function shellModesOf(mesh: Mesh, shells: ShellGrid): ShellModes[] {
  const top = shellsUpperEdge(shells);
  if (top > meshNyquist(mesh) * (1 + 1e-12)) {
    throw new InputError(
      `k bins: the last shell ends at ${top.toPrecision(6)} h/Mpc, beyond the Nyquist wavenumber ${meshNyquist(mesh).toPrecision(6)} h/Mpc of the mesh`,
      { hint: 'lower kMax or use a finer mesh' },
    );
  }
  const { n } = mesh;
  const nzHalf = n / 2 + 1;
  const out: ShellModes[] = [];
  for (let s = 0; s < shells.count; s++) {
    const c = shellCentre(shells, s);
    const lattice = latticeShell(mesh.boxSize, c - shells.dk / 2, c + shells.dk / 2);
    const keep: number[] = [];
    for (let m = 0; m < lattice.count; m++) if (lattice.vectors[3 * m + 2] >= 0) keep.push(m);
    const index = new Int32Array(keep.length);
    const weight = new Uint8Array(keep.length);
    const vector = new Int16Array(3 * keep.length);
    const norm = new Float64Array(keep.length);
    const mu = new Float64Array(keep.length);
    let count = 0;
    keep.forEach((m, e) => {
      const x = lattice.vectors[3 * m];
      const y = lattice.vectors[3 * m + 1];
      const z = lattice.vectors[3 * m + 2];
      index[e] = (((x + n) % n) * n + ((y + n) % n)) * nzHalf + z;
      weight[e] = z > 0 ? 2 : 1;
      vector.set([x, y, z], 3 * e);
      norm[e] = Math.sqrt(lattice.normSquared[m]);
      mu[e] = z / norm[e];
      count += weight[e];
    });
    out.push({ count, index, weight, vector, norm, mu });
  }
  return out;
}

