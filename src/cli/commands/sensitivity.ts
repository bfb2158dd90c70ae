import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Command } from 'commander';
import { renderSensitivityMapsSvg, SENSITIVITY_DEFAULT_PARAMETERS } from '../../workflows/forecast/bispectrum-sensitivity.js';
import { surveySensitivity } from '../../workflows/forecast/survey-sensitivity.js';
import { action } from '../run-command.js';
import { readConfigJson } from './forecast.js';

interface SensitivityOptions {
  out: string;
  parameters: string;
}

/** `treble sensitivity <config>`: maps of dB0/dtheta over triangle shapes, per redshift bin of a forecast config. */
export function registerSensitivity(program: Command): void {
  program
    .command('sensitivity')
    .description('maps of the B0 derivative per parameter over triangle shapes (SVG), with the Fisher-information share of each shape class')
    .argument('<config>', 'forecast config (JSON); its bispectrum bins are mapped')
    .requiredOption('--out <dir>', 'folder for the SVG maps')
    .option('--parameters <list>', 'comma-separated parameters', SENSITIVITY_DEFAULT_PARAMETERS.join(','))
    .action(
      action((configPath: string, opts: SensitivityOptions) => {
        const perBin = surveySensitivity(readConfigJson(configPath), opts.parameters.split(','));
        mkdirSync(opts.out, { recursive: true });
        perBin.forEach((s, i) => {
          for (const [name, svg] of Object.entries(renderSensitivityMapsSvg(s, `bin ${i + 1}, B0 sensitivity`))) writeFileSync(join(opts.out, `sensitivity-bin${i + 1}-${name}.svg`), svg);
          process.stdout.write(`bin ${i + 1}: Fisher-information share of each shape class (B0 alone)\n`);
          for (const m of s.maps) process.stdout.write(`  ${m.name}: ${Object.entries(m.informationByClass).map(([c, v]) => `${c} ${(100 * v).toFixed(1)}%`).join(', ')}\n`);
        });
        process.stderr.write(`wrote ${perBin.length * perBin[0].maps.length} maps to ${opts.out}\n`);
      }),
    );
}
