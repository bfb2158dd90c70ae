import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeDemoData } from '../../../src/workflows/demo/demo-scenario.js';
import { writeFitReport } from '../../../src/workflows/fit/fit-report.js';
import { readRunConfig } from '../../../src/workflows/fit/run-config.js';
import { runJointFit } from '../../../src/workflows/fit/run-fit.js';
import { QUIET, writeSmallFitProblem } from './support/small-fit-problem.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-fit-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('joint fit workflow', () => {
  it('reproduces the same summary from the same config and seed, and writes a report with every figure', async () => {
    const config = readRunConfig(writeSmallFitProblem(dir));
    await runJointFit(config, QUIET);
    const first = readFileSync(join(config.output, 'summary.json'), 'utf8');
    const summary = await runJointFit(config, QUIET);
    expect(readFileSync(join(config.output, 'summary.json'), 'utf8')).toBe(first);
    expect(summary.parameters.slice(0, 2).map((r) => r.name)).toEqual(['b1', 'b2']);
    // dof = data points - sampled - analytically marginalised parameters.
    const triangles = readFileSync(join(dir, 'bundle', 'bispectrum.csv'), 'utf8').trim().split('\n').length - 1;
    expect(summary.bestFit.dof).toBe(12 + triangles - 2 - 1);
    const report = writeFitReport(config, summary);
    const html = readFileSync(report, 'utf8');
    expect((html.match(/<svg/g) ?? []).length).toBeGreaterThanOrEqual(5);
    expect(readdirSync(join(config.output, 'figures')).length).toBe(5);
  }, 120_000);

  it('the bundled demo data are exactly what the demo script writes', () => {
    const fresh = join(dir, 'demo');
    writeDemoData(fresh);
    const bundled = join(__dirname, '../../../data-demo');
    for (const f of ['measurement.json', 'power.csv', 'bispectrum.csv', 'covariance.csv', 'truth.json', 'fit.json']) {
      expect(readFileSync(join(fresh, f), 'utf8'), f).toBe(readFileSync(join(bundled, f), 'utf8'));
    }
  });
});
