import { InputError } from '../contracts/input-error.js';
import { RealFourier3d } from '../numerics/fft-3d.js';
import { Random } from '../numerics/random.js';
import { checkMesh, meshVolume, type Mesh } from './mesh.js';

/**
 * Adds Gaussian white noise of constant power `noisePower` ((Mpc/h)^3) to a
 * half-complex spectrum (in place): an independent Gaussian field with
 * P_eps(k) = noisePower, made like gaussianFieldSpectrum from its own seed.
 * Being Gaussian and independent it adds nothing to the mean bispectrum.
 */
export function addWhiteNoise(spec: Float64Array, mesh: Mesh, noisePower: number, seed: number): Float64Array {
  checkMesh(mesh);
  if (!(noisePower >= 0) || !Number.isFinite(noisePower)) throw new InputError(`noise power must be finite and >= 0, got ${noisePower}`);
  const fourier = new RealFourier3d(mesh.n);
  const rng = new Random(seed);
  // White noise per cell with variance noisePower / V_cell has power noisePower.
  const sigma = Math.sqrt(noisePower / (meshVolume(mesh) / mesh.n ** 3));
  const noise = fourier.createField();
  for (let i = 0; i < noise.length; i++) noise[i] = sigma * rng.normal();
  const w = fourier.forward(noise);
  w[0] = 0;
  w[1] = 0;
  for (let i = 0; i < spec.length; i++) spec[i] += w[i];
  return spec;
}

/** Poisson deviate by multiplication of uniforms (Knuth, TAOCP vol. 2, 3.4.1), in pieces of mean <= 30. */
function poisson(rng: Random, mean: number): number {
  let total = 0;
  let rest = mean;
  while (rest > 0) {
    const piece = Math.min(rest, 30);
    rest -= piece;
    const limit = Math.exp(-piece);
    let prod = rng.uniform();
    while (prod > limit) {
      total++;
      prod *= rng.uniform();
    }
  }
  return total;
}

/**
 * Poisson sampling of a field: each cell holds N ~ Poisson(nbar V_cell (1 + delta)),
 * with 1 + delta clipped at 0 where the field goes negative, and the galaxy
 * overdensity N / (nbar V_cell) - 1 is returned as a half-complex spectrum
 * together with the number of objects. Its shot noise is 1/nbar (subtract it
 * from P_0 via the estimator's `shotNoise`).
 */
export function poissonSampledSpectrum(
  spec: Float64Array,
  mesh: Mesh,
  numberDensity: number,
  seed: number,
): { spectrum: Float64Array; objects: number; clippedCells: number } {
  checkMesh(mesh);
  if (!(numberDensity > 0) || !Number.isFinite(numberDensity)) {
    throw new InputError(`number density must be positive in (h/Mpc)^3, got ${numberDensity}`);
  }
  const fourier = new RealFourier3d(mesh.n);
  const rng = new Random(seed);
  const field = fourier.inverse(spec);
  const perCell = numberDensity * (meshVolume(mesh) / mesh.n ** 3);
  let objects = 0;
  let clippedCells = 0;
  for (let i = 0; i < field.length; i++) {
    const onePlus = 1 + field[i];
    if (onePlus < 0) clippedCells++;
    const count = poisson(rng, perCell * Math.max(onePlus, 0));
    objects += count;
    field[i] = count / perCell - 1;
  }
  const spectrum = fourier.forward(field);
  spectrum[0] = 0;
  spectrum[1] = 0;
  return { spectrum, objects, clippedCells };
}
