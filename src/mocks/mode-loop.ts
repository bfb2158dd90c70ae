import { signedFrequency } from '../numerics/fft-3d.js';

/**
 * Calls `visit` for every entry of an n^3 half-complex spectrum with its
 * complex index c and the signed integer wavevector (nx, ny, nz), nz >= 0,
 * and n2 = |n|^2.
 */
export function forEachMode(n: number, visit: (c: number, nx: number, ny: number, nz: number, n2: number) => void): void {
  const nzHalf = n / 2 + 1;
  for (let a = 0; a < n; a++) {
    const nx = signedFrequency(a, n);
    for (let b = 0; b < n; b++) {
      const ny = signedFrequency(b, n);
      const base = (a * n + b) * nzHalf;
      for (let nz = 0; nz < nzHalf; nz++) visit(base + nz, nx, ny, nz, nx * nx + ny * ny + nz * nz);
    }
  }
}
