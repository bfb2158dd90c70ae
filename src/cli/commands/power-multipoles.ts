import { writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { InputError } from '../../contracts/input-error.js';
import { linearSpectrumOfConfig, readLinearTheoryConfig } from '../../cosmology/index.js';
import { PowerMultipoleModel, POWER_PARAMETER_NAMES, powerMultipoleCsv, type PowerBinAveraging } from '../../power/index.js';
import { numberOption, parameterAssignments } from '../cli-options.js';
import { action } from '../run-command.js';

interface MultipoleOptions {
  kmin: string;
  dk: string;
  bins: string;
  nbar: string;
  ell: string;
  average: string;
  box?: string;
  muNodes: string;
  set: string[];
  out?: string;
}

function averagingOf(opts: MultipoleOptions): PowerBinAveraging {
  const box = opts.box === undefined ? undefined : numberOption('box', opts.box);
  if (opts.average === 'centre') return { kind: 'centre' };
  if (opts.average === 'mean-k') return box === undefined ? { kind: 'mean-k' } : { kind: 'mean-k', boxSize: box };
  if (opts.average === 'lattice') {
    if (box === undefined) throw new InputError('--average lattice needs --box <side in Mpc/h>');
    return { kind: 'lattice', boxSize: box };
  }
  throw new InputError(`--average must be centre, mean-k or lattice, got "${opts.average}"`);
}

/** `treble multipoles <config>`: P0, P2, P4 per k bin of a linear-theory config, as CSV. */
export function registerPowerMultipoles(program: Command): void {
  program
    .command('multipoles')
    .description('power-spectrum multipoles P_l(k) per k bin for the cosmology of a linear-theory config, as CSV')
    .argument('<config>', 'linear-theory config (JSON: redshift, cosmology, optional powerTable)')
    .requiredOption('--nbar <density>', 'mean number density in (h/Mpc)^3 (Poisson shot noise 1/nbar)')
    .option('--kmin <k>', 'centre of the first k bin, h/Mpc', '0.01')
    .option('--dk <dk>', 'bin width, h/Mpc', '0.01')
    .option('--bins <n>', 'number of k bins', '40')
    .option('--ell <list>', 'multipole orders, comma separated', '0,2,4')
    .option('--average <how>', 'k-bin averaging: centre, mean-k or lattice', 'centre')
    .option('--box <L>', 'box side in Mpc/h for mean-k over lattice modes or lattice averaging')
    .option('--mu-nodes <n>', 'Gauss-Legendre nodes on mu in [0, 1]', '12')
    .option('--set <name=value...>', `model parameters (${POWER_PARAMETER_NAMES.join(', ')})`, [])
    .option('--out <file>', 'write the CSV here instead of standard output')
    .action(
      action((configPath: string, opts: MultipoleOptions) => {
        const model = new PowerMultipoleModel({
          spectrum: linearSpectrumOfConfig(readLinearTheoryConfig(configPath)),
          bins: { kMin: numberOption('kmin', opts.kmin), dk: numberOption('dk', opts.dk), count: numberOption('bins', opts.bins) },
          nbar: numberOption('nbar', opts.nbar),
          multipoles: opts.ell.split(',').map((s) => numberOption('ell', s)),
          averaging: averagingOf(opts),
          muNodes: numberOption('mu-nodes', opts.muNodes),
        });
        const csv = powerMultipoleCsv(model, model.evaluate(parameterAssignments(opts.set, POWER_PARAMETER_NAMES)));
        if (opts.out === undefined) process.stdout.write(csv);
        else writeFileSync(opts.out, csv);
      }),
    );
}
