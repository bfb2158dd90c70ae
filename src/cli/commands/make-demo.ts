import { resolve } from 'node:path';
import type { Command } from 'commander';
import { DEMO_SCENARIO, writeDemoData } from '../../workflows/demo/demo-scenario.js';
import { action } from '../run-command.js';

/** `treble make-demo [folder]`: (re)write the invented demo data set and its run config. */
export function registerMakeDemo(program: Command): void {
  program
    .command('make-demo')
    .description('write the invented demo data (measurement bundle, covariance, truth, run config) into a folder')
    .argument('[folder]', 'where to write', 'data-demo')
    .action(
      action((folder: string) => {
        const { entries } = writeDemoData(resolve(folder));
        process.stdout.write(`${DEMO_SCENARIO}\nwrote ${entries} data-vector entries, covariance, truth.json and fit.json to ${resolve(folder)}\n`);
      }),
    );
}
