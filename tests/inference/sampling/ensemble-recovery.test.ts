import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sampleEnsemble } from '../../../src/inference/sampling/sample-ensemble.js';
import { sampleIndependentChains } from '../../../src/inference/sampling/sample-independent-chains.js';
import { momentsWithErrors } from './support/monte-carlo-error.js';
import { bandedCovariance } from './targets/gaussian.js';

const targets = new URL('./targets/', import.meta.url);
const mean6 = [1, -2, 0.5, 3, 0, 10];
const cov6 = bandedCovariance([1, 2, 0.5, 3, 1, 0.1], 0.7);
const gaussian = { module: new URL('gaussian.ts', targets).href, exportName: 'gaussianTarget', options: { mean: mean6, covariance: cov6 } };
const banana = { module: new URL('banana.ts', targets).href, exportName: 'bananaTarget', options: { s: 1, b: 1 } };
// Banana moments, exact (see targets/banana.ts): mean 0, Var x1 = 1, Var x2 = 1 + 2 b^2 s^4 = 3, Cov = 0.
const bananaMean = [0, 0];
const bananaCov = [
  [1, 0],
  [0, 3],
];

/** Every estimate within 5 Monte Carlo standard errors (derived from its own ESS) of the exact value. */
function expectMoments(result: Awaited<ReturnType<typeof sampleEnsemble>>, mean: number[], cov: number[][]): void {
  const m = momentsWithErrors(result.history, result.diagnostics.burnInSteps);
  for (let i = 0; i < mean.length; i++) {
    expect(Math.abs(m.means[i].value - mean[i]), `mean ${i}`).toBeLessThan(5 * m.means[i].error);
    for (let j = 0; j <= i; j++) expect(Math.abs(m.cov[i][j].value - cov[i][j]), `cov ${i},${j}`).toBeLessThan(5 * m.cov[i][j].error);
  }
  // The errors must be small enough for the check to mean something: ~ a few percent of each sd.
  for (let i = 0; i < mean.length; i++) expect(m.means[i].error).toBeLessThan(0.1 * Math.sqrt(cov[i][i]));
}

const common = { workers: 0, progress: 'off' as const, handleInterrupt: false };
const dir = () => mkdtempSync(join(tmpdir(), 'treble-sampling-'));

describe('stretch-move ensemble recovers known posteriors', () => {
  it('correlated 6-D Gaussian: means and covariances within ESS-derived errors', async () => {
    const parameters = mean6.map((m, i) => ({ name: `x${i}`, start: m, scale: Math.sqrt(cov6[i][i]) }));
    const r = await sampleEnsemble({ ...common, parameters, target: gaussian, output: join(dir(), 'g6'), seed: 6, walkers: 32, maxSteps: 6000, tauDrift: 0.05 });
    expect(r.stopReason).toBe('converged');
    expectMoments(r, mean6, cov6);
    // Stretch-move acceptance on a Gaussian sits well inside (0.2, 0.6) (common practice).
    expect(r.diagnostics.acceptance.mean).toBeGreaterThan(0.2);
    expect(r.diagnostics.acceptance.mean).toBeLessThan(0.6);
  });

  it('banana posterior: means and covariances within ESS-derived errors', async () => {
    const parameters = [
      { name: 'x1', start: 0, scale: 1 },
      { name: 'x2', start: 0, scale: 1 },
    ];
    const r = await sampleEnsemble({ ...common, parameters, target: banana, output: join(dir(), 'banana'), seed: 7, walkers: 32, maxSteps: 8000, tauDrift: 0.05 });
    expect(r.stopReason).toBe('converged');
    expectMoments(r, bananaMean, bananaCov);
  });
});

describe('independent adaptive-Metropolis chains recover known posteriors', () => {
  it('correlated 6-D Gaussian, converged by R-hat and ESS', async () => {
    const parameters = mean6.map((m, i) => ({ name: `x${i}`, start: m, scale: 2 * Math.sqrt(cov6[i][i]) }));
    const r = await sampleIndependentChains({ ...common, parameters, target: gaussian, output: join(dir(), 'am6'), seed: 8, chains: 4, maxSteps: 40_000, checkEvery: 1000 });
    expect(r.stopReason).toBe('converged');
    for (const p of r.diagnostics.parameters) expect(p.rhat).toBeLessThan(1.01);
    expectMoments(r, mean6, cov6);
  });

  it('banana posterior', async () => {
    const parameters = [
      { name: 'x1', start: 0, scale: 2 },
      { name: 'x2', start: 0, scale: 2 },
    ];
    const r = await sampleIndependentChains({ ...common, parameters, target: banana, output: join(dir(), 'amb'), seed: 9, maxSteps: 60_000, checkEvery: 1000 });
    expect(r.stopReason).toBe('converged');
    expectMoments(r, bananaMean, bananaCov);
  });
});
