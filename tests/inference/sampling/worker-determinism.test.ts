import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sampleEnsemble } from '../../../src/inference/sampling/sample-ensemble.js';
import { sampleIndependentChains } from '../../../src/inference/sampling/sample-independent-chains.js';
import { bandedCovariance } from './targets/gaussian.js';

const gaussian = {
  module: new URL('./targets/gaussian.ts', import.meta.url).href,
  exportName: 'gaussianTarget',
  options: { mean: [0, 1, 2], covariance: bandedCovariance([1, 2, 3], 0.5) },
};
const parameters = [
  { name: 'a', start: 0, scale: 1 },
  { name: 'b', start: 1, scale: 1, lower: -5 },
  { name: 'c', start: 2, scale: 1 },
];
const common = { parameters, target: gaussian, seed: 1234, maxSteps: 60, progress: 'off' as const, handleInterrupt: false };

describe('the same seed gives bit-identical chains for any number of workers', () => {
  it('stretch-move ensemble with 0 (this thread), 1, 2 and 4 workers', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-det-'));
    const texts: string[] = [];
    for (const workers of [0, 1, 2, 4]) {
      const r = await sampleEnsemble({ ...common, workers, walkers: 10, output: join(dir, `w${workers}`) });
      expect(r.steps).toBe(60);
      texts.push(readFileSync(r.files.chain, 'utf8'));
    }
    expect(texts[0].split('\n').length).toBe(1 + 60 * 10 + 1);
    for (const t of texts.slice(1)) expect(t).toBe(texts[0]);
  });

  it('independent chains on this thread and on 2 workers, and another seed differs', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-det-'));
    const a = await sampleIndependentChains({ ...common, workers: 0, output: join(dir, 'a') });
    const b = await sampleIndependentChains({ ...common, workers: 2, output: join(dir, 'b') });
    const c = await sampleIndependentChains({ ...common, workers: 0, seed: 1235, output: join(dir, 'c') });
    expect(readFileSync(b.files.chain, 'utf8')).toBe(readFileSync(a.files.chain, 'utf8'));
    expect(readFileSync(c.files.chain, 'utf8')).not.toBe(readFileSync(a.files.chain, 'utf8'));
  });
});
