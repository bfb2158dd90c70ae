import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { Command } from 'commander';
import { runScanFromConfig } from '../../workflows/scale-cuts/scan-config.js';
import { renderScanShiftPlotSvg, renderScanTable } from '../../workflows/scale-cuts/scan-report.js';
import { action } from '../run-command.js';
import { readConfigJson } from './forecast.js';

/** `treble scan <config>`: scale-cut scan of a measurement bundle. */
export function registerScaleCutScan(program: Command): void {
  program
    .command('scan')
    .description('scale-cut scan: best fit per k_max, shifts in sigma, chi2/dof, p-value and chi2 per shape class, first flagged k_max')
    .argument('<config>', 'scan config (JSON: bundle, parameters, covariance, statistic, kMax, ...)')
    .option('--out <dir>', 'write scan.md, scan.json and scan-shifts.svg here (and, in sampling mode, the chains under chains/)')
    .action(
      action(async (configPath: string, opts: { out?: string }) => {
        const scan = await runScanFromConfig(readConfigJson(configPath), dirname(configPath), opts.out && join(opts.out, 'chains'));
        const table = renderScanTable(scan);
        process.stdout.write(table);
        if (!opts.out) return;
        mkdirSync(opts.out, { recursive: true });
        writeFileSync(join(opts.out, 'scan.md'), table);
        writeFileSync(join(opts.out, 'scan.json'), `${JSON.stringify({ format: 'treble-scale-cut-scan-1', ...scan }, null, 2)}\n`);
        writeFileSync(join(opts.out, 'scan-shifts.svg'), renderScanShiftPlotSvg(scan));
        process.stderr.write(`wrote ${opts.out}/scan.md, scan.json, scan-shifts.svg\n`);
      }),
    );
}
