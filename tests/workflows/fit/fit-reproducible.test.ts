import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { validateCosmology } from '../../../src/cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology } from '../../../src/cosmology/linear-power-from-cosmology.js';
import { writeMeasurementBundle } from '../../../src/data/write-measurement-bundle.js';
import { writeDemoData } from '../../../src/workflows/demo/demo-scenario.js';
import { writeFitReport } from '../../../src/workflows/fit/fit-report.js';
import { readRunConfig } from '../../../src/workflows/fit/run-config.js';
import { runJointFit } from '../../../src/workflows/fit/run-fit.js';
import { syntheticBundle } from '../../../src/workflows/synthetic/synthetic-bundle.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-fit-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const cosmology = { h: 0.68, omegaB: 0.0224, omegaCdm: 0.12, ns: 0.965, sigma8: 0.81 };

function writeSmallProblem(): string {
  const spectrum = linearPowerFromCosmology(validateCosmology(cosmology, {}), 0.5);
  const spec = { redshift: 0.5, numberDensity: 5e-4, surveyVolume: 2e9, fiducialCosmology: cosmology, power: { kMin: 0.02, dk: 0.02, count: 6, multipoles: [0, 2] }, bispectrum: { kMin: 0.02, kMax: 0.08, dk: 0.02 } };
  const s = syntheticBundle(spec, { spectrum, parameters: { b1: 1.7, b2: 0.2, bG2: -0.2 }, noiseSeed: 3 });
  const folder = join(dir, 'bundle');
  writeMeasurementBundle(folder, { ...spec, lineOfSight: 'midpoint', power: s.bundle.power, bispectrum: s.bundle.bispectrum, covariance: { matrix: s.covariance!, size: s.truth.length } });
  const config = {
    title: 'small reproducibility check',
    measurement: 'bundle',
    covariance: { source: 'matrix' },
    cosmology: { mode: 'fixed-template' },
    parameters: {
      alphaPar: { value: 1 },
      alphaPerp: { value: 1 },
      templateAmplitude: { value: 1 },
      fsigma8: { value: 0.5 },
      b1: { prior: { kind: 'uniform', min: 1, max: 3 }, start: 1.7 },
      b2: { prior: { kind: 'uniform', min: -3, max: 3 }, start: 0 },
      bG2: { value: -0.2 },
      pStochConst: { prior: { kind: 'gaussian', mean: 1, sigma: 1 }, marginalise: true },
    },
    sampler: { seed: 5, walkers: 8, maxSteps: 40, checkEvery: 20, workers: 0 },
    peak: { starts: 1 },
    output: 'run',
  };
  const file = join(dir, 'fit.json');
  writeFileSync(file, JSON.stringify(config));
  return file;
}

describe('joint fit workflow', () => {
  it('reproduces the same summary from the same config and seed, and writes a report with every figure', async () => {
    const config = readRunConfig(writeSmallProblem());
    const quiet = { fresh: true, progress: 'off' as const, log: () => undefined };
    await runJointFit(config, quiet);
    const first = readFileSync(join(config.output, 'summary.json'), 'utf8');
    const summary = await runJointFit(config, quiet);
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
