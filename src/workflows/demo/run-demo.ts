import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { InputError } from '../../contracts/input-error.js';
import { writeFitReport } from '../fit/fit-report.js';
import type { FitSummary } from '../fit/fit-summary.js';
import { readRunConfig } from '../fit/run-config.js';
import { runJointFit } from '../fit/run-fit.js';
import type { ProgressMode } from '../../inference/sampling/progress-display.js';

/**
 * The README's first command: the joint fit of the bundled invented demo
 * (data-demo/fit.json), from scratch, then its report and a table of the
 * recovered parameters next to the truth.
 */
export async function runDemoFit(folder: string, options: { progress?: ProgressMode; workers?: number; log?: (line: string) => void } = {}): Promise<{ summary: FitSummary; report: string; recovery: string }> {
  const configPath = join(folder, 'fit.json');
  if (!existsSync(configPath)) throw new InputError(`${configPath}: the demo config is missing`, { hint: 'write the demo data with `treble make-demo`' });
  const config = readRunConfig(configPath);
  const summary = await runJointFit(config, { fresh: true, progress: options.progress, workers: options.workers, log: options.log });
  const report = writeFitReport(config, summary);
  return { summary, report, recovery: recoveryTable(summary) };
}

/** Each parameter with a truth: the truth, the posterior mean +- sd, the pull and whether the truth lies in the 95% interval. */
export function recoveryTable(summary: FitSummary): string {
  const rows = summary.parameters.filter((r) => r.truth !== null);
  const head = ['parameter', 'truth', 'recovered (mean ± sd)', '95% interval', 'pull', 'within 2σ'];
  const body = rows.map((r) => [
    r.name,
    Number((r.truth as number).toPrecision(4)).toString(),
    `${Number(r.mean.toPrecision(4))} ± ${Number(r.sd.toPrecision(2))}`,
    `[${Number(r.interval95[0].toPrecision(4))}, ${Number(r.interval95[1].toPrecision(4))}]`,
    r.pull === null ? '—' : r.pull.toFixed(2),
    r.truthWithin95 ? 'yes' : 'NO',
  ]);
  const widths = head.map((h, c) => Math.max(h.length, ...body.map((b) => b[c].length)));
  const line = (cells: string[]) => cells.map((x, c) => (c === 0 ? x.padEnd(widths[c]) : x.padStart(widths[c]))).join('  ');
  return `${[line(head), ...body.map(line)].join('\n')}\n`;
}
