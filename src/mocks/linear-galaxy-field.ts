import { checkMesh, type Mesh } from './mesh.js';
import { forEachMode } from './mode-loop.js';

/**
 * Linear redshift-space galaxy field Z1(k) delta_L(k) = (b1 + f mu^2) delta_L(k),
 * line of sight z (Kaiser 1987, MNRAS 227, 1), as a new half-complex spectrum.
 */
export function linearGalaxySpectrum(linear: Float64Array, mesh: Mesh, b1: number, f: number): Float64Array {
  checkMesh(mesh);
  const out = new Float64Array(linear.length);
  forEachMode(mesh.n, (c, _x, _y, nz, n2) => {
    if (n2 === 0) return;
    const z1 = b1 + (f * nz * nz) / n2;
    out[2 * c] = z1 * linear[2 * c];
    out[2 * c + 1] = z1 * linear[2 * c + 1];
  });
  return out;
}
