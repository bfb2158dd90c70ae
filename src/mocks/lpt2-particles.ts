import { RealFourier3d } from '../numerics/fft-3d.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import { checkMesh, type Mesh } from './mesh.js';
import { forEachMode } from './mode-loop.js';
import { dealiasSpectrum } from './second-order-field.js';

/** Complex factor per mode applied to a spectrum (k in h/Mpc), zero at k = 0. */
function filtered(spec: Float64Array, mesh: Mesh, factor: (kx: number, ky: number, kz: number, k2: number) => [number, number]): Float64Array {
  const kf = fundamentalFrequency(mesh.boxSize);
  const out = new Float64Array(spec.length);
  forEachMode(mesh.n, (c, nx, ny, nz, n2) => {
    if (n2 === 0) return;
    const [fr, fi] = factor(kf * nx, kf * ny, kf * nz, kf * kf * n2);
    out[2 * c] = spec[2 * c] * fr - spec[2 * c + 1] * fi;
    out[2 * c + 1] = spec[2 * c] * fi + spec[2 * c + 1] * fr;
  });
  return out;
}

/**
 * Particles displaced by second-order Lagrangian perturbation theory from the
 * mesh points q (one per cell), into redshift space along z (docs/conventions.md,
 * "Mocks"; Bouchet et al. 1995, A&A 296, 575 and Scoccimarro 1998, MNRAS 299,
 * 1097, from memory):
 *   Psi1 = i k / k^2 delta_L,  Psi2 = (3/7) i k / k^2 FT[sum_{a<b} (t_aa t_bb - t_ab^2)],
 *   t_ab = FT^-1[k_a k_b / k^2 delta_L],
 *   x = q + Psi1 + Psi2 + z-hat f (Psi1_z + 2 Psi2_z)
 * (growth rate of the second order 2f, the Einstein–de Sitter value the Z2
 * kernel also assumes). The linear field is first restricted like the
 * second-order field (dealiasSpectrum). Returns positions in [0, L), 3 per particle.
 */
export function lpt2Particles(linear: Float64Array, mesh: Mesh, f: number): Float64Array {
  checkMesh(mesh);
  const { n, boxSize } = mesh;
  const fourier = new RealFourier3d(n);
  const scratch = fourier.createSpectrum();
  const delta = dealiasSpectrum(linear.slice(), n);
  const axis = (a: number, kx: number, ky: number, kz: number) => (a === 0 ? kx : a === 1 ? ky : kz);
  const t: Float64Array[] = [];
  for (let a = 0; a < 3; a++) {
    for (let b = a; b < 3; b++) t.push(fourier.inverse(filtered(delta, mesh, (kx, ky, kz, k2) => [(axis(a, kx, ky, kz) * axis(b, kx, ky, kz)) / k2, 0]), undefined, scratch));
  }
  const [txx, txy, txz, tyy, tyz, tzz] = t;
  const source = new Float64Array(n ** 3);
  for (let x = 0; x < source.length; x++) {
    source[x] = txx[x] * tyy[x] + txx[x] * tzz[x] + tyy[x] * tzz[x] - txy[x] ** 2 - txz[x] ** 2 - tyz[x] ** 2;
  }
  const second = dealiasSpectrum(fourier.forward(source), n);
  const positions = new Float64Array(3 * n ** 3);
  const h = boxSize / n;
  for (let a = 0; a < 3; a++) {
    const first = fourier.inverse(filtered(delta, mesh, (kx, ky, kz, k2) => [0, axis(a, kx, ky, kz) / k2]), undefined, scratch);
    const psi2 = fourier.inverse(filtered(second, mesh, (kx, ky, kz, k2) => [0, ((3 / 7) * axis(a, kx, ky, kz)) / k2]), undefined, scratch);
    const rsd = a === 2 ? f : 0;
    for (let i = 0; i < n ** 3; i++) {
      const q = h * (a === 0 ? Math.floor(i / (n * n)) : a === 1 ? Math.floor(i / n) % n : i % n);
      const x = q + first[i] * (1 + rsd) + psi2[i] * (1 + 2 * rsd);
      positions[3 * i + a] = ((x % boxSize) + boxSize) % boxSize;
    }
  }
  return positions;
}
