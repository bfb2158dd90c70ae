import { InputError } from '../contracts/input-error.js';
import { RealFourier3d } from '../numerics/fft-3d.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import { Random } from '../numerics/random.js';
import { checkMesh, meshVolume, type Mesh } from './mesh.js';
import { forEachMode } from './mode-loop.js';

/**
 * Seeded Gaussian random field with power spectrum P(k), returned as the
 * half-complex discrete transform F of src/numerics/fft-3d.ts (docs/conventions.md,
 * "Mocks"): with delta(k) = (V / n^3) F(k), <|F(k)|^2> = n^6 P(k) / V.
 *
 * Made by colouring white noise: w(x) ~ N(0, 1) per cell, drawn in the index
 * order of the real layout, then F(k) = W(k) sqrt(n^3 P(k) / V) and F(0) = 0.
 * The phases and amplitudes are therefore both random (not fixed-amplitude),
 * and the field is real by construction.
 */
export function gaussianFieldSpectrum(mesh: Mesh, power: (k: number) => number, seed: number): Float64Array {
  checkMesh(mesh);
  const fourier = new RealFourier3d(mesh.n);
  const rng = new Random(seed);
  const noise = fourier.createField();
  for (let i = 0; i < noise.length; i++) noise[i] = rng.normal();
  const spec = fourier.forward(noise);
  const scale = mesh.n ** 3 / meshVolume(mesh);
  const kf = fundamentalFrequency(mesh.boxSize);
  forEachMode(mesh.n, (c, _nx, _ny, _nz, n2) => {
    if (n2 === 0) {
      spec[2 * c] = 0;
      spec[2 * c + 1] = 0;
      return;
    }
    const p = power(kf * Math.sqrt(n2));
    if (!(p >= 0) || !Number.isFinite(p)) {
      throw new InputError(`power spectrum: P(k = ${(kf * Math.sqrt(n2)).toPrecision(6)} h/Mpc) = ${p} is not a finite non-negative number`);
    }
    const a = Math.sqrt(scale * p);
    spec[2 * c] *= a;
    spec[2 * c + 1] *= a;
  });
  return spec;
}
