import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { InputError } from '../../contracts/input-error.js';
import { writeMeasurementBundle } from '../../data/write-measurement-bundle.js';
import {
  boxBundle,
  checkMesh,
  makeMockField,
  measureMeshValues,
  measureParticles,
  planOf,
  readMeshField,
  readParticleTable,
  recipeSpectrum,
  validateMockRecipe,
  writeMeshField,
} from '../../mocks/index.js';
import { action } from '../run-command.js';

function parsed(flag: string, text: string | undefined, ok: (x: number) => boolean = () => true): number {
  const v = Number(text);
  if (text === undefined || text.trim() === '' || !Number.isFinite(v) || !ok(v)) throw new InputError(`--${flag}: not an acceptable number: "${text}"`);
  return v;
}

interface MeasureOptions {
  field?: string;
  particles?: string;
  box?: string;
  mesh?: string;
  out: string;
  dk: string;
  powerKmax?: string;
  bispKmax: string;
  shotNoise?: string;
  redshift?: string;
  numberDensity?: string;
  cosmology?: string;
}

function cosmologyFile(path: string): Record<string, number> {
  let json: unknown;
  try {
    json = JSON.parse(readFileSync(path, 'utf8'));
  } catch (e) {
    throw new InputError(`--cosmology ${path}: cannot read it (${(e as Error).message})`);
  }
  if (typeof json !== 'object' || json === null || Array.isArray(json) || Object.values(json).some((v) => typeof v !== 'number')) {
    throw new InputError(`--cosmology ${path}: must be a JSON object of named numbers`);
  }
  return json as Record<string, number>;
}

/** `treble mock-box` (make a mock field from a JSON recipe) and `treble measure-box` (field or particles -> bundle). */
export function registerMockBox(program: Command): void {
  program
    .command('mock-box <recipe>')
    .description('make a seeded mock overdensity on a periodic mesh (Gaussian or second-order redshift-space field, optional noise)')
    .requiredOption('--out <header.json>', 'mesh field header to write (values go beside it as .f64)')
    .action(
      action((recipePath: string, opts: { out: string }) => {
        let json: unknown;
        try {
          json = JSON.parse(readFileSync(recipePath, 'utf8'));
        } catch (e) {
          throw new InputError(`${recipePath}: cannot read the recipe (${(e as Error).message})`);
        }
        const recipe = validateMockRecipe(json, recipePath);
        const spectrum = recipeSpectrum(recipe, recipePath);
        const { values, objects } = makeMockField(recipe, spectrum);
        const about: Record<string, number> = { redshift: recipe.redshift, seed: recipe.seed, growthRate: recipe.growthRate ?? spectrum.growthRateLargeScale };
        if (recipe.noise) about.numberDensity = recipe.noise.numberDensity;
        if (objects !== undefined) about.objects = objects;
        writeMeshField(opts.out, { mesh: recipe.mesh, values, about, cosmology: recipe.cosmology as Record<string, number> });
        process.stdout.write(`wrote ${opts.out} (${recipe.mesh.n}^3 mesh, box ${recipe.mesh.boxSize} Mpc/h)\n`);
      }),
    );

  program
    .command('measure-box')
    .description('measure P0, P2, P4 and B0, B2 (line of sight z) of a mesh field or a particle CSV in a periodic box; writes a measurement bundle')
    .option('--field <header.json>', 'mesh field written by mock-box')
    .option('--particles <file.csv>', 'particle positions, columns x, y, z in Mpc/h (needs --box and --mesh)')
    .option('--box <L>', 'box side in Mpc/h, for --particles')
    .option('--mesh <n>', 'mesh points per side (power of two), for --particles')
    .requiredOption('--out <folder>', 'measurement bundle folder')
    .option('--dk <units of k_f>', 'shell width and first centre in units of the fundamental frequency', '2')
    .option('--power-kmax <k>', 'highest P_l shell centre, h/Mpc (default: every shell below the Nyquist wavenumber)')
    .option('--bisp-kmax <k>', 'highest B_l shell centre, h/Mpc (0: no bispectrum)', '0.1')
    .option('--shot-noise <P>', 'subtracted from P_0, (Mpc/h)^3 (default 1/nbar for particles, 0 for a field)')
    .option('--redshift <z>', 'redshift recorded in the bundle (default the field header, else 0)')
    .option('--number-density <nbar>', 'number density recorded in the bundle, (h/Mpc)^3')
    .option('--cosmology <file.json>', 'fiducial cosmology recorded in the bundle (default: the one in the field header)')
    .action(
      action((opts: MeasureOptions) => {
        if ((opts.field === undefined) === (opts.particles === undefined)) throw new InputError('measure-box: give exactly one of --field and --particles');
        const bins = {
          dk: parsed('dk', opts.dk, (x) => x >= 1),
          powerKMax: opts.powerKmax === undefined ? undefined : parsed('power-kmax', opts.powerKmax, (x) => x > 0),
          bispectrumKMax: parsed('bisp-kmax', opts.bispKmax, (x) => x >= 0),
          shotNoise: 0,
        };
        let about: Record<string, number> = {};
        let fiducial = opts.cosmology === undefined ? undefined : cosmologyFile(opts.cosmology);
        let measurement;
        if (opts.field !== undefined) {
          const field = readMeshField(opts.field);
          about = { ...field.about };
          fiducial ??= field.cosmology;
          const shotNoise = opts.shotNoise === undefined ? 0 : parsed('shot-noise', opts.shotNoise, (x) => x >= 0);
          measurement = measureMeshValues(field.values, planOf(field.mesh, { ...bins, shotNoise }));
        } else {
          const mesh = checkMesh({ n: parsed('mesh', opts.mesh), boxSize: parsed('box', opts.box) }, '--mesh/--box');
          const positions = readParticleTable(opts.particles as string);
          const nbar = positions.length / 3 / mesh.boxSize ** 3;
          about.numberDensity = nbar;
          const shotNoise = opts.shotNoise === undefined ? 1 / nbar : parsed('shot-noise', opts.shotNoise, (x) => x >= 0);
          measurement = measureParticles(positions, planOf(mesh, { ...bins, shotNoise }));
        }
        const numberDensity = opts.numberDensity !== undefined ? parsed('number-density', opts.numberDensity, (x) => x > 0) : about.numberDensity;
        if (numberDensity === undefined) throw new InputError('measure-box: the bundle needs a number density: pass --number-density');
        if (fiducial === undefined) throw new InputError('measure-box: the bundle needs a fiducial cosmology: pass --cosmology <file.json>');
        const redshift = opts.redshift !== undefined ? parsed('redshift', opts.redshift, (x) => x >= 0) : (about.redshift ?? 0);
        writeMeasurementBundle(opts.out, boxBundle(measurement, { redshift, numberDensity, fiducialCosmology: fiducial, description: `measured by treble measure-box from ${opts.field ?? opts.particles}` }));
        process.stdout.write(`wrote the measurement bundle ${opts.out}\n`);
      }),
    );
}
