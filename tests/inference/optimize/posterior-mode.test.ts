import { describe, expect, it } from 'vitest';
import { findPosteriorMode } from '../../../src/inference/optimize/find-posterior-mode.js';
import { bandedCovariance } from '../sampling/targets/gaussian.js';

const mean6 = [1, -2, 0.5, 3, 0, 10];
const gaussian = {
  module: new URL('../sampling/targets/gaussian.ts', import.meta.url).href,
  exportName: 'gaussianTarget',
  options: { mean: mean6, covariance: bandedCovariance([1, 2, 0.5, 3, 1, 0.1], 0.7) },
};
const parameters = mean6.map((m, i) => ({ name: `x${i}`, lower: m - 20, upper: m + 20 }));

describe('maximum a posteriori search', () => {
  it('finds the mode of a correlated 6-D Gaussian to 1e-6 from starts across the bounds', async () => {
    const r = await findPosteriorMode({ parameters, target: gaussian, seed: 3, starts: 4, workers: 0 });
    for (let i = 0; i < 6; i++) expect(Math.abs(r.best.theta[i] - mean6[i])).toBeLessThan(1e-6);
    expect(r.best.logPosterior).toBeCloseTo(0, 10);
    expect(r.agreeing).toBe(4);
  });

  it('finds the maximum of -Rosenbrock at (1, 1) to 1e-6 from starts drawn in [-2, 2]^2', async () => {
    const target = { module: new URL('../sampling/targets/rosenbrock.ts', import.meta.url).href, exportName: 'rosenbrockTarget' };
    const box = [
      { name: 'u', lower: -2, upper: 2 },
      { name: 'v', lower: -2, upper: 2 },
    ];
    const r = await findPosteriorMode({ parameters: box, target, seed: 1, starts: 4, workers: 0 });
    expect(Math.abs(r.best.theta[0] - 1)).toBeLessThan(1e-6);
    expect(Math.abs(r.best.theta[1] - 1)).toBeLessThan(1e-6);
  });

  it('gives the same climbs on 2 workers as on this thread, explicit starts first', async () => {
    const settings = { parameters, target: gaussian, seed: 5, starts: 2, startPoints: [[0, 0, 0, 0, 0, 0]] };
    const here = await findPosteriorMode({ ...settings, workers: 0 });
    const pooled = await findPosteriorMode({ ...settings, workers: 2 });
    expect(pooled.climbs).toEqual(here.climbs);
    expect(here.climbs[0].start).toEqual([0, 0, 0, 0, 0, 0]);
  });
});
