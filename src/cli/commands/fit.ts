import type { Command } from 'commander';
import { writeFitReport } from '../../workflows/fit/fit-report.js';
import { readRunConfig } from '../../workflows/fit/run-config.js';
import { runJointFit } from '../../workflows/fit/run-fit.js';
import { countOption, progressModeOption } from '../cli-options.js';
import { action } from '../run-command.js';

/** `treble fit <config>`: the joint P + B posterior sampling of a run config, its summary and report. */
export function registerFit(program: Command): void {
  program
    .command('fit')
    .description('sample the joint P + B posterior of a run config (checkpointed, resumable), then write the summary, plots and HTML report')
    .argument('<config>', 'run config (JSON); see docs/run-config.md')
    .option('--resume', 'continue an interrupted run from its checkpoint in the output folder')
    .option('--fresh', 'delete an earlier run in the output folder first')
    .option('--workers <n>', 'worker threads (default: the config, else the core count; 0 = this thread)')
    .option('--progress <mode>', 'progress display: auto, bar, lines or off', 'auto')
    .option('--no-report', 'skip the plots and HTML report')
    .addHelpText('after', '\nOutputs in the config\'s output folder: chain.csv + chain.json (sidecar) + chain.state.json (checkpoint),\nsummary.json, summary.txt, figures/*.svg, report.html. Ctrl-C stops after the current step with a checkpoint.')
    .action(
      action(async (file: string, opts: { resume?: boolean; fresh?: boolean; workers?: string; progress: string; report: boolean }) => {
        const config = readRunConfig(file);
        const summary = await runJointFit(config, {
          resume: opts.resume,
          fresh: opts.fresh,
          workers: opts.workers === undefined ? undefined : countOption('workers', opts.workers),
          progress: progressModeOption(opts.progress),
        });
        process.stdout.write(summary.table);
        if (opts.report) process.stdout.write(`report: ${writeFitReport(config, summary)}\n`);
      }),
    );
}
