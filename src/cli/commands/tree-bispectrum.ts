import { readFileSync, writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { InputError } from '../../contracts/input-error.js';
import {
  bispectrumMultipoleCsv,
  enumerateTriangleBins,
  parseBinAveraging,
  parseTriangleListCsv,
  shellGrid,
  TREE_BISPECTRUM_PARAMETERS,
  TreeBispectrumModel,
  triangleShapeClasses,
} from '../../bispectrum/index.js';
import { linearSpectrumOfConfig, readLinearTheoryConfig } from '../../cosmology/index.js';
import { numberOption, parameterAssignments } from '../cli-options.js';
import { action } from '../run-command.js';

interface TreeBispectrumOptions {
  kmin: string;
  kmax: string;
  dk: string;
  average: string;
  triangles?: string;
  nbar?: string;
  ell: string;
  sigmaV: string;
  ir: boolean;
  irAveraged?: boolean;
  set: string[];
  out?: string;
}

function readText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: cannot read the triangle list (${(err as NodeJS.ErrnoException).code ?? String(err)})`);
  }
}

/** `treble bispectrum <config>`: tree-level B_l per triangle bin (or listed triangle) as CSV. */
export function registerTreeBispectrum(program: Command): void {
  program
    .command('bispectrum')
    .description('tree-level redshift-space galaxy bispectrum multipoles per triangle bin for a linear-theory config, as CSV')
    .argument('<config>', 'linear-theory config (JSON: redshift, cosmology, optional powerTable)')
    .option('--kmin <k>', 'centre of the first k shell, h/Mpc', '0.01')
    .option('--kmax <k>', 'centre of the last k shell, h/Mpc', '0.15')
    .option('--dk <dk>', 'shell width, h/Mpc', '0.01')
    .option('--average <how>', 'bin averaging: centres, effective or continuous', 'continuous')
    .option('--triangles <file>', 'evaluate these triangles (k1 k2 k3 per line) instead of bins')
    .option('--nbar <density>', 'number density in (h/Mpc)^3 for the stochastic terms (omitted: none)')
    .option('--ell <list>', 'even multipoles, comma separated', '0,2')
    .option('--sigma-v <Mpc/h>', 'velocity dispersion of the fingers-of-god damping', '0')
    .option('--no-ir', 'switch off the IR resummation of the BAO wiggles')
    .option('--ir-averaged', 'damp the wiggles of each P by the line-of-sight average of the IR damping (an approximation; faster)')
    .option('--set <name=value...>', `model parameters (${TREE_BISPECTRUM_PARAMETERS.join(', ')})`, [])
    .option('--out <file>', 'write the CSV here instead of standard output')
    .action(
      action((configPath: string, opts: TreeBispectrumOptions) => {
        const spectrum = linearSpectrumOfConfig(readLinearTheoryConfig(configPath));
        const common = {
          spectrum,
          irResummation: opts.ir,
          irAngleAveraged: opts.irAveraged === true,
          velocityDispersion: numberOption('sigma-v', opts.sigmaV),
          multipoles: opts.ell.split(',').map((s) => numberOption('ell', s)),
          ...(opts.nbar === undefined ? {} : { numberDensity: numberOption('nbar', opts.nbar) }),
        };
        const params = parameterAssignments(opts.set, TREE_BISPECTRUM_PARAMETERS);
        if (opts.triangles !== undefined) {
          const model = new TreeBispectrumModel({
            ...common,
            triangles: parseTriangleListCsv(readText(opts.triangles), opts.triangles),
            trianglesSource: opts.triangles,
          });
          return write(opts.out, bispectrumMultipoleCsv(model, model.evaluate(params)));
        }
        const bins = enumerateTriangleBins(shellGrid(numberOption('kmin', opts.kmin), numberOption('kmax', opts.kmax), numberOption('dk', opts.dk)));
        const model = new TreeBispectrumModel({ ...common, bins, averaging: parseBinAveraging(opts.average, '--average') });
        write(opts.out, bispectrumMultipoleCsv(model, model.evaluate(params), triangleShapeClasses(bins)));
      }),
    );
}

function write(out: string | undefined, csv: string): void {
  if (out === undefined) process.stdout.write(csv);
  else writeFileSync(out, csv);
}
