import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { runCliCaptured } from '../../support/run-cli-captured.js';
import { registerScaleCutScan } from '../../../src/cli/commands/scale-cut-scan.js';
import { writeMeasurementBundle } from '../../../src/data/write-measurement-bundle.js';
import { PLANCK, scanFixture, TRUTH } from './scan-fixture.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-scan-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const run = (args: string[]): Promise<string> => runCliCaptured([registerScaleCutScan], args);

describe('treble scan', () => {
  afterEach(() => {
    process.exitCode = undefined;
    vi.restoreAllMocks();
  });

  it('scans a bundle on disk, prints the table and writes the table, JSON and the shift plot', async () => {
    const { bundle } = scanFixture({ distort: (k) => 1 + (k[0] ** 2 + k[1] ** 2 + k[2] ** 2) / (3 * 0.3 ** 2) });
    const table = (t: NonNullable<typeof bundle.power>) => ({ centres: t.centres, effective: t.effective, counts: t.counts, dk: t.dk, multipoles: t.multipoles, values: t.values });
    writeMeasurementBundle(join(dir, 'bundle'), { redshift: 0.5, numberDensity: 4e-4, lineOfSight: 'midpoint', surveyVolume: 2e9, fiducialCosmology: PLANCK, power: table(bundle.power!), bispectrum: table(bundle.bispectrum!) });
    const config = {
      bundle: 'bundle',
      parameters: { b1: { prior: { kind: 'uniform', min: 1, max: 3 } }, b2: { prior: { kind: 'flat' }, marginalise: true }, bG2: { prior: { kind: 'flat' }, marginalise: true }, bispShotPower: { prior: { kind: 'flat' }, marginalise: true } },
      covariance: { source: 'gaussian' },
      kMax: [0.06, 0.1, 0.16],
      cuts: { limits: { P: { kMax: 0.1 } } },
      truth: TRUTH,
    };
    writeFileSync(join(dir, 'scan.json'), JSON.stringify(config));
    const out = await run(['scan', join(dir, 'scan.json'), '--out', join(dir, 'out')]);
    expect(process.exitCode).toBeUndefined();
    expect(out).toMatch(/\| 0\.16 \| \d+ \|.*b1 shifted by/);
    expect(out).toMatch(/First flagged k_max: 0\.16 h\/Mpc/);
    expect(out).toMatch(/no super-sample or non-Gaussian terms/);
    expect(readFileSync(join(dir, 'out', 'scan-shifts.svg'), 'utf8')).toMatch(/^<svg/);
    expect(JSON.parse(readFileSync(join(dir, 'out', 'scan.json'), 'utf8')).firstFlagged).toBe(0.16);
  });

  it('sampling mode: a short ensemble run per cut, shifts in posterior standard deviations', async () => {
    const config = JSON.parse(readFileSync(join(dir, 'scan.json'), 'utf8'));
    writeFileSync(join(dir, 'scan-mcmc.json'), JSON.stringify({ ...config, kMax: [0.06, 0.16], mode: 'sampling', sampling: { seed: 3, walkers: 8, maxSteps: 400, workers: 0 } }));
    const out = await run(['scan', join(dir, 'scan-mcmc.json'), '--out', join(dir, 'out-mcmc')]);
    expect(process.exitCode).toBeUndefined();
    const scan = JSON.parse(readFileSync(join(dir, 'out-mcmc', 'scan.json'), 'utf8'));
    expect(scan.mode).toBe('sampling');
    expect(out).toMatch(/posterior standard deviations/);
    // One chain per cut; the conservative cut is unbiased, the widest one flagged as in fast mode.
    expect(existsSync(join(dir, 'out-mcmc', 'chains', 'scan-kmax-0.16.csv'))).toBe(true);
    expect(Math.abs(scan.steps[0].shift.b1)).toBeLessThan(0.5);
    expect(scan.firstFlagged).toBe(0.16);
  });

  it('lists every config problem at once and exits 2', async () => {
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ bundle: '', kMax: [0.1, -1], statistic: 'Q', covariance: { source: 'nope' }, extra: 1 }));
    const out = await run(['scan', join(dir, 'bad.json')]);
    expect(process.exitCode).toBe(2);
    for (const key of ['extra is not a scan key', 'bundle must be', 'parameters must be', 'covariance.source', 'statistic must be', 'kMax must be']) expect(out).toContain(key);
    expect(existsSync(join(dir, 'out-bad'))).toBe(false);
  });
});
