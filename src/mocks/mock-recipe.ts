import { InputError, InputErrors } from '../contracts/input-error.js';
import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { linearPowerFromCosmology, validateCosmology } from '../cosmology/index.js';
import { RealFourier3d } from '../numerics/fft-3d.js';
import { gaussianFieldSpectrum } from './gaussian-field.js';
import { linearGalaxySpectrum } from './linear-galaxy-field.js';
import { lpt2Particles } from './lpt2-particles.js';
import { particleOverdensitySpectrum } from './mass-assignment.js';
import type { Mesh } from './mesh.js';
import { checkMesh } from './mesh.js';
import { secondOrderGalaxySpectrum } from './second-order-field.js';
import { addWhiteNoise, poissonSampledSpectrum } from './stochastic-field.js';
import { isJsonObject, type JsonObject } from '../io/json-with-lines.js';

/**
 * A mock box described in JSON:
 *   { "mesh": { "n": 128, "boxSize": 2000 }, "redshift": 1, "cosmology": { ... },
 *     "seed": 1, "order": "linear" | "second" | "2lpt",
 *     "bias": { "b1": 2, "b2": 0.5, "bG2": -0.29 }, "growthRate": 0.87 (optional),
 *     "noise": { "kind": "gaussian" | "poisson", "numberDensity": 3e-4 } (optional) }
 */
export interface MockRecipe {
  readonly mesh: Mesh;
  readonly redshift: number;
  readonly cosmology: unknown;
  readonly seed: number;
  /** 2lpt: matter particles (bias ignored) assigned to the mesh by interlaced, compensated CIC. */
  readonly order: 'linear' | 'second' | '2lpt';
  readonly bias: { readonly b1: number; readonly b2: number; readonly bG2: number };
  readonly growthRate: number | undefined;
  readonly noise: { readonly kind: 'gaussian' | 'poisson'; readonly numberDensity: number } | undefined;
}


export function validateMockRecipe(json: unknown, file: string): MockRecipe {
  if (!isJsonObject(json)) throw new InputError(`${file}: the mock recipe must be a JSON object`);
  const problems: string[] = [];
  const known = new Set(['mesh', 'redshift', 'cosmology', 'seed', 'order', 'bias', 'growthRate', 'noise']);
  for (const k of Object.keys(json)) if (!known.has(k)) problems.push(`${file}: ${k} is not a known key (${[...known].join(', ')})`);
  const num = (key: string, v: unknown, ok: (x: number) => boolean, what: string): number => {
    if (typeof v !== 'number' || !Number.isFinite(v) || !ok(v)) problems.push(`${file}: ${key} must be ${what}, got ${JSON.stringify(v)}`);
    return Number(v);
  };
  const mesh = isJsonObject(json.mesh) ? json.mesh : {};
  if (!isJsonObject(json.mesh)) problems.push(`${file}: mesh must be an object { n, boxSize }`);
  const n = num('mesh.n', mesh.n, (x) => Number.isInteger(x) && x >= 4 && (x & (x - 1)) === 0, 'a power of two >= 4');
  const boxSize = num('mesh.boxSize', mesh.boxSize, (x) => x > 0, 'a positive length in Mpc/h');
  const redshift = num('redshift', json.redshift, (x) => x >= 0, 'a number >= 0');
  const seed = num('seed', json.seed, (x) => Number.isInteger(x), 'an integer');
  const order = json.order ?? 'linear';
  if (order !== 'linear' && order !== 'second' && order !== '2lpt') problems.push(`${file}: order must be "linear", "second" or "2lpt", got ${JSON.stringify(order)}`);
  const bias = isJsonObject(json.bias) ? json.bias : {};
  if (!isJsonObject(json.bias)) problems.push(`${file}: bias must be an object { b1, b2, bG2 }`);
  const b1 = num('bias.b1', bias.b1, () => true, 'a number');
  const b2 = num('bias.b2', bias.b2 ?? 0, () => true, 'a number');
  const bG2 = num('bias.bG2', bias.bG2 ?? 0, () => true, 'a number');
  const growthRate = json.growthRate === undefined ? undefined : num('growthRate', json.growthRate, (x) => x >= 0, 'a number >= 0');
  let noise: MockRecipe['noise'];
  if (json.noise !== undefined) {
    const nz = isJsonObject(json.noise) ? json.noise : {};
    if (nz.kind !== 'gaussian' && nz.kind !== 'poisson') problems.push(`${file}: noise.kind must be "gaussian" or "poisson", got ${JSON.stringify(nz.kind)}`);
    const numberDensity = num('noise.numberDensity', nz.numberDensity, (x) => x > 0, 'a positive number in (h/Mpc)^3');
    noise = { kind: nz.kind as 'gaussian' | 'poisson', numberDensity };
  }
  if (problems.length > 0) throw new InputErrors(problems);
  return { mesh: checkMesh({ n, boxSize }, `${file}: mesh`), redshift, cosmology: json.cosmology, seed, order: order as MockRecipe['order'], bias: { b1, b2, bG2 }, growthRate, noise };
}

/** The linear spectrum of a recipe's cosmology at its redshift (src/cosmology). */
export function recipeSpectrum(recipe: MockRecipe, file: string): LinearSpectrum {
  return linearPowerFromCosmology(validateCosmology(recipe.cosmology, { path: 'cosmology', file }), recipe.redshift, { kMin: 1e-4, kMax: 10 });
}

/**
 * The overdensity of a recipe's mock on its mesh (real space, the layout of
 * src/numerics/fft-3d.ts): Gaussian linear field from `seed`, then the linear
 * (Z1) or second-order (Z1 + Z2) redshift-space galaxy field or 2LPT matter
 * particles on the mesh, then the noise
 * (seed + 1 for its own random numbers).
 */
export function makeMockField(recipe: MockRecipe, spectrum: LinearSpectrum): { values: Float64Array; objects: number | undefined } {
  const { mesh, bias, seed } = recipe;
  const f = recipe.growthRate ?? spectrum.growthRateLargeScale;
  const lin = gaussianFieldSpectrum(mesh, (k) => spectrum.power(k), seed);
  let spec =
    recipe.order === 'second'
      ? secondOrderGalaxySpectrum(lin, mesh, { ...bias, f })
      : recipe.order === '2lpt'
        ? particleOverdensitySpectrum(lpt2Particles(lin, mesh, f), mesh)
        : linearGalaxySpectrum(lin, mesh, bias.b1, f);
  let objects: number | undefined;
  if (recipe.noise?.kind === 'gaussian') spec = addWhiteNoise(spec, mesh, 1 / recipe.noise.numberDensity, seed + 1);
  if (recipe.noise?.kind === 'poisson') {
    const sampled = poissonSampledSpectrum(spec, mesh, recipe.noise.numberDensity, seed + 1);
    spec = sampled.spectrum;
    objects = sampled.objects;
  }
  return { values: new RealFourier3d(mesh.n).inverse(spec), objects };
}
