import type { BiasForKernels } from '../perturbation/kernels.js';
import { RealFourier3d } from '../numerics/fft-3d.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import { checkMesh, type Mesh } from './mesh.js';
import { forEachMode } from './mode-loop.js';

/**
 * Keeps the modes with |n| < n/3 (in units of k_f) and zeroes the rest. For
 * fields limited to these modes a product of two fields is free of aliasing on
 * every mode it keeps (Orszag's two-thirds rule, J. Atmos. Sci. 28 (1971)
 * 1074, from memory): |n1_x + n2_x| <= 2n/3 folds only onto |m_x| > n/3.
 */
export function dealiasSpectrum(spec: Float64Array, n: number): Float64Array {
  forEachMode(n, (c, _x, _y, _z, n2) => {
    if (9 * n2 >= n * n) {
      spec[2 * c] = 0;
      spec[2 * c + 1] = 0;
    }
  });
  return spec;
}

/** Multiplies every mode by a complex factor (re, im) given by `factor`. */
function multiplied(
  spec: Float64Array,
  n: number,
  kf: number,
  factor: (kx: number, ky: number, kz: number, k2: number) => [number, number],
): Float64Array {
  const out = new Float64Array(spec.length);
  forEachMode(n, (c, nx, ny, nz, n2) => {
    if (n2 === 0) return;
    const [fr, fi] = factor(kf * nx, kf * ny, kf * nz, kf * kf * n2);
    const re = spec[2 * c];
    const im = spec[2 * c + 1];
    out[2 * c] = re * fr - im * fi;
    out[2 * c + 1] = re * fi + im * fr;
  });
  return out;
}

/**
 * Redshift-space galaxy field to second order at field level, line of sight z
 * (docs/conventions.md, "Mocks"):
 *   delta_s(k) = Z1(k) delta_L(k) + int Z2(q1, q2) delta_L(q1) delta_L(q2), q1 + q2 = k,
 * with Z1, Z2 of src/perturbation/kernels.ts. The convolution is evaluated
 * exactly as products of derivative fields in configuration space:
 *   F2 pair = 5/7 d^2 - g.psi + 2/7 t_ij t_ij,  G2 pair = 3/7 d^2 - g.psi + 4/7 t_ij t_ij,
 *   tidal pair = t_ij t_ij - d^2,
 * where d = delta_L, g_i = FT^-1[i k_i delta], psi_i = FT^-1[i k_i / k^2 delta],
 * t_ij = FT^-1[k_i k_j / k^2 delta]; the velocity term
 *   (f mu k / 2)[mu1/q1 (b1 + f mu2^2) + mu2/q2 (b1 + f mu1^2)]
 * is -i f k_z FT[psi_z v] with v = FT^-1[(b1 + f mu^2) delta]. The linear field
 * is first restricted to |k| < (n/3) k_f and the quadratic part is kept on the
 * same modes (dealiasSpectrum), so the result is the exact convolution of the
 * restricted linear field.
 *
 * `linear` is the half-complex discrete transform of delta_L (left untouched);
 * the result is the discrete transform of delta_s.
 */
export function secondOrderGalaxySpectrum(linear: Float64Array, mesh: Mesh, bias: BiasForKernels): Float64Array {
  checkMesh(mesh);
  const { n } = mesh;
  const { b1, b2, bG2, f } = bias;
  const fourier = new RealFourier3d(n);
  const kf = fundamentalFrequency(mesh.boxSize);
  const delta = dealiasSpectrum(linear.slice(), n);
  const scratch = fourier.createSpectrum();
  const toReal = (factor: (kx: number, ky: number, kz: number, k2: number) => [number, number]) =>
    fourier.inverse(multiplied(delta, n, kf, factor), undefined, scratch);

  const d = fourier.inverse(delta, undefined, scratch);
  const size = d.length;
  const dd = new Float64Array(size); // d^2
  const shift = new Float64Array(size); // g . psi
  const tt = new Float64Array(size); // t_ij t_ij
  for (let x = 0; x < size; x++) dd[x] = d[x] * d[x];
  const axes: ((kx: number, ky: number, kz: number) => number)[] = [(kx) => kx, (_x, ky) => ky, (_x, _y, kz) => kz];
  const psis: Float64Array[] = [];
  for (const ki of axes) {
    const g = toReal((kx, ky, kz) => [0, ki(kx, ky, kz)]);
    const psi = toReal((kx, ky, kz, k2) => [0, ki(kx, ky, kz) / k2]);
    for (let x = 0; x < size; x++) shift[x] += g[x] * psi[x];
    psis.push(psi);
  }
  const psiZ = psis[2];
  for (let i = 0; i < 3; i++) {
    for (let j = i; j < 3; j++) {
      const t = toReal((kx, ky, kz, k2) => [(axes[i](kx, ky, kz) * axes[j](kx, ky, kz)) / k2, 0]);
      const weight = i === j ? 1 : 2;
      for (let x = 0; x < size; x++) tt[x] += weight * t[x] * t[x];
    }
  }
  const local = new Float64Array(size); // b1 F2 + b2/2 + bG2 sigma^2 pairs
  const growth = new Float64Array(size); // G2 pair
  for (let x = 0; x < size; x++) {
    local[x] = b1 * ((5 / 7) * dd[x] - shift[x] + (2 / 7) * tt[x]) + 0.5 * b2 * dd[x] + bG2 * (tt[x] - dd[x]);
    growth[x] = (3 / 7) * dd[x] - shift[x] + (4 / 7) * tt[x];
  }
  const v = toReal((_x, _y, kz, k2) => [b1 + (f * kz * kz) / k2, 0]);
  const flow = new Float64Array(size);
  for (let x = 0; x < size; x++) flow[x] = psiZ[x] * v[x];

  const localK = fourier.forward(local);
  const growthK = fourier.forward(growth);
  const flowK = fourier.forward(flow);
  const out = fourier.createSpectrum();
  forEachMode(n, (c, _x, _y, nz, n2) => {
    if (n2 === 0 || 9 * n2 >= n * n) return;
    const mu2 = (nz * nz) / n2;
    const kz = kf * nz;
    const z1 = b1 + f * mu2;
    // -i f kz (a + i b) = f kz b - i f kz a
    out[2 * c] = z1 * delta[2 * c] + localK[2 * c] + f * mu2 * growthK[2 * c] + f * kz * flowK[2 * c + 1];
    out[2 * c + 1] = z1 * delta[2 * c + 1] + localK[2 * c + 1] + f * mu2 * growthK[2 * c + 1] - f * kz * flowK[2 * c];
  });
  return out;
}
