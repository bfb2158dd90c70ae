import { writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { InputError } from '../../contracts/input-error.js';
import {
  GrowthHistory,
  backgroundCsv,
  backgroundOf,
  linearSpectrumCsv,
  linearSpectrumOfConfig,
  logSpacedWavenumbers,
  readLinearTheoryConfig,
} from '../../cosmology/index.js';
import { numberOption } from '../cli-options.js';
import { action } from '../run-command.js';

interface LinearOptions {
  kmin: string;
  kmax: string;
  points: string;
  out?: string;
  background?: string;
  z?: string;
}

function redshiftList(text: string): number[] {
  return text.split(',').map((t) => {
    const z = numberOption('z', t);
    if (!(z >= 0 && z <= 20)) throw new InputError(`--z: redshift ${z} must lie in [0, 20]`);
    return z;
  });
}

/** `treble linear <config>`: linear power (P_lin, P_nw, f, P_m) and the background (H, D_M, D_A, D, f) as CSV. */
export function registerLinearTheory(program: Command): void {
  program
    .command('linear')
    .description('write the linear power spectrum and background quantities of a config as CSV')
    .argument('<config>', 'linear-theory config (JSON: redshift, cosmology, optional powerTable)')
    .option('--kmin <k>', 'smallest k in h/Mpc', '1e-4')
    .option('--kmax <k>', 'largest k in h/Mpc', '1')
    .option('--points <n>', 'number of log-spaced k values', '200')
    .option('--out <file>', 'spectrum CSV file (default: standard output)')
    .option('--background <file>', 'also write z, H, D_M, D_A, D, f to this CSV file')
    .option('--z <list>', 'comma-separated redshifts of the background table (default: the config redshift)')
    .action(
      action((configPath: string, opts: LinearOptions) => {
        const config = readLinearTheoryConfig(configPath);
        const k = logSpacedWavenumbers(numberOption('kmin', opts.kmin), numberOption('kmax', opts.kmax), numberOption('points', opts.points));
        const spectrumText = linearSpectrumCsv(linearSpectrumOfConfig(config), k);
        if (opts.out) writeFileSync(opts.out, spectrumText);
        else process.stdout.write(spectrumText);
        if (opts.background) {
          const bg = backgroundOf(config.cosmology);
          const zs = opts.z === undefined ? [config.redshift] : redshiftList(opts.z);
          writeFileSync(opts.background, backgroundCsv(bg, new GrowthHistory(bg), zs));
        }
      }),
    );
}
