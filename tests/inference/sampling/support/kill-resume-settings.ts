import type { EnsembleSamplingSettings } from '../../../../src/inference/sampling/sample-ensemble.js';

/** The run of the kill-and-resume tests (output and resume left to the caller). */
export function killResumeSettings(busyMs: number): Omit<EnsembleSamplingSettings, 'output'> {
  return {
    parameters: [
      { name: 'a', start: 0, scale: 1 },
      { name: 'b', start: 0, scale: 1 },
      { name: 'c', start: 0, scale: 1 },
    ],
    target: {
      module: new URL('../targets/gaussian.ts', import.meta.url).href,
      exportName: 'gaussianTarget',
      options: { mean: [1, 2, 3], covariance: [[1, 0.5, 0], [0.5, 1, 0], [0, 0, 4]], busyMs },
    },
    seed: 31337,
    walkers: 16,
    workers: 0,
    maxSteps: 300,
    checkEvery: 50,
    checkpointSeconds: 0.05,
    progress: 'lines',
    progressSeconds: 0.5,
  };
}
