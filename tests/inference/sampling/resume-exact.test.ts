import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sampleIndependentChains } from '../../../src/inference/sampling/sample-independent-chains.js';

const target = { module: new URL('./targets/banana.ts', import.meta.url).href, exportName: 'bananaTarget', options: { s: 1, b: 1 } };
const parameters = [
  { name: 'x1', start: 0, scale: 1 },
  { name: 'x2', start: 0, scale: 1 },
];

describe('adaptive-Metropolis chains resume exactly', () => {
  it('a run stopped at 150 steps and resumed to 400 equals a run of 400 (adaptation starts at 100)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-am-'));
    const settings = { parameters, target, seed: 77, workers: 0, adaptAfter: 100, progress: 'off' as const, handleInterrupt: false };
    await sampleIndependentChains({ ...settings, output: join(dir, 'split'), maxSteps: 150 });
    const resumed = await sampleIndependentChains({ ...settings, output: join(dir, 'split'), maxSteps: 400, resume: true });
    const straight = await sampleIndependentChains({ ...settings, output: join(dir, 'straight'), maxSteps: 400 });
    expect(resumed.steps).toBe(400);
    expect(readFileSync(resumed.files.chain, 'utf8')).toBe(readFileSync(straight.files.chain, 'utf8'));
    expect(resumed.diagnostics).toEqual(straight.diagnostics);
  });
});
