import type { Command } from 'commander';
import { findBestFit } from '../../workflows/fit/best-fit.js';
import { readRunConfig } from '../../workflows/fit/run-config.js';
import { countOption } from '../cli-options.js';
import { action } from '../run-command.js';

/** `treble peak <config>`: the quick best fit (maximum a posteriori) of a run config, without sampling. */
export function registerPeak(program: Command): void {
  program
    .command('peak')
    .description('quick best fit of a run config: the posterior maximum from several optimiser starts, with chi-square and p-value')
    .argument('<config>', 'run config (JSON); see docs/run-config.md')
    .option('--workers <n>', 'worker threads (default: the config, else the core count; 0 = this thread)')
    .option('--json', 'print the result as JSON')
    .action(
      action(async (file: string, opts: { workers?: string; json?: boolean }) => {
        const best = await findBestFit(readRunConfig(file), { workers: opts.workers === undefined ? undefined : countOption('workers', opts.workers) });
        if (opts.json) {
          process.stdout.write(`${JSON.stringify(best, null, 2)}\n`);
          return;
        }
        const lines = best.assumptions.map((a) => `${a.key}: ${a.value}`);
        lines.push('', 'best fit:');
        for (const [k, v] of Object.entries(best.values)) lines.push(`  ${k.padEnd(18)} ${Number(v.toPrecision(6))}`);
        for (const [k, v] of Object.entries(best.marginalised)) lines.push(`  ${k.padEnd(18)} ${Number(v.toPrecision(6))}  (marginalised analytically)`);
        lines.push(`chi2 = ${best.chi2.toFixed(2)} for ${best.dof} dof, p = ${best.pValue.toPrecision(3)}; ${best.startsAgreeing} of ${best.starts} starts reached this maximum`);
        process.stdout.write(`${lines.join('\n')}\n`);
      }),
    );
}
