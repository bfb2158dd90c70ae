import { InputError } from '../contracts/input-error.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';

/**
 * A periodic cubic box of side `boxSize` (Mpc/h) sampled on n^3 cells, n a
 * power of two (the FFT of src/numerics/fft-3d.ts needs one).
 */
export interface Mesh {
  readonly n: number;
  readonly boxSize: number;
}

export function checkMesh(mesh: Mesh, where = 'mesh'): Mesh {
  const { n, boxSize } = mesh;
  if (!Number.isInteger(n) || n < 4 || (n & (n - 1)) !== 0) {
    throw new InputError(`${where}.n must be a power of two >= 4, got ${n}`);
  }
  if (!(boxSize > 0) || !Number.isFinite(boxSize)) throw new InputError(`${where}.boxSize must be a positive length in Mpc/h, got ${boxSize}`);
  return mesh;
}

export function meshVolume(mesh: Mesh): number {
  return mesh.boxSize ** 3;
}

/** Nyquist wavenumber pi n / L of the mesh. */
export function meshNyquist(mesh: Mesh): number {
  return (mesh.n / 2) * fundamentalFrequency(mesh.boxSize);
}
