import type { Command } from 'commander';
import { writeFitReport } from '../../workflows/fit/fit-report.js';
import { readRunConfig } from '../../workflows/fit/run-config.js';
import { finishFit } from '../../workflows/fit/run-fit.js';
import { countOption } from '../cli-options.js';
import { action } from '../run-command.js';

/** `treble report <config>`: summary and report of a finished (or interrupted) sampling run; a missing run is refused by loadFinishedRun. */
export function registerReport(program: Command): void {
  program
    .command('report')
    .description('turn a finished or interrupted sampling run into its summary, plots and HTML report')
    .argument('<config>', 'the run config that made the run')
    .option('--workers <n>', 'worker threads for the best-fit search (default: the config, else the core count)')
    .action(
      action(async (file: string, opts: { workers?: string }) => {
        const config = readRunConfig(file);
        const summary = await finishFit(config, undefined, { workers: opts.workers === undefined ? undefined : countOption('workers', opts.workers) });
        process.stdout.write(summary.table);
        process.stdout.write(`report: ${writeFitReport(config, summary)}\n`);
      }),
    );
}
