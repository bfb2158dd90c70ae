import type { Command } from 'commander';
import { runDemoFit } from '../../workflows/demo/run-demo.js';
import { findDemoFolder } from '../demo-folder.js';
import { countOption, progressModeOption } from '../cli-options.js';
import { action } from '../run-command.js';

/** `treble demo`: the README's first command — the joint fit of the bundled invented demo data. */
export function registerDemo(program: Command): void {
  program
    .command('demo')
    .description('joint P + B fit of the bundled invented demo data (data-demo/), then its report and the recovered parameters next to the truth')
    .option('--folder <dir>', 'demo folder written by `treble make-demo` (default: the bundled data-demo/)')
    .option('--workers <n>', 'worker threads (default: the core count)')
    .option('--progress <mode>', 'progress display: auto, bar, lines or off', 'auto')
    .action(
      action(async (opts: { folder?: string; workers?: string; progress: string }) => {
        const started = Date.now();
        const { summary, report, recovery } = await runDemoFit(opts.folder ?? findDemoFolder(), {
          progress: progressModeOption(opts.progress),
          workers: opts.workers === undefined ? undefined : countOption('workers', opts.workers),
        });
        const missed = summary.parameters.filter((r) => r.truth !== null && !r.truthWithin95).map((r) => r.name);
        process.stdout.write(`\n${summary.table}\nRecovered parameters against the truth of the invented scenario:\n${recovery}`);
        process.stdout.write(missed.length ? `truth outside the 95% interval for: ${missed.join(', ')}\n` : 'every truth lies within its 95% (2σ) interval\n');
        process.stdout.write(`report: ${report}\n(${((Date.now() - started) / 1000).toFixed(0)} s)\n`);
      }),
    );
}
