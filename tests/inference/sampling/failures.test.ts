import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/contracts/input-error.js';
import { sampleEnsemble } from '../../../src/inference/sampling/sample-ensemble.js';
import { SamplingHaltedError } from '../../../src/inference/sampling/sampling-halted-error.js';

const failing = new URL('./targets/failing.ts', import.meta.url).href;
const parameters = [
  { name: 'x0', start: 0, scale: 1 },
  { name: 'x1', start: 0, scale: 1 },
];
const common = { parameters, seed: 99, walkers: 8, maxSteps: 200, progress: 'off' as const, handleInterrupt: false, checkpointSeconds: 0.05 };
const dir = () => mkdtempSync(join(tmpdir(), 'treble-fail-'));

async function halted(run: Promise<unknown>): Promise<SamplingHaltedError> {
  const err = await run.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(SamplingHaltedError);
  return err as SamplingHaltedError;
}

function checkpointedSteps(stem: string): number {
  const state = JSON.parse(readFileSync(`${stem}.state.json`, 'utf8')) as { steps: number; chainBytes: number };
  expect(readFileSync(`${stem}.csv`).length).toBe(state.chainBytes); // rows and state agree
  return state.steps;
}

describe('failures of the log-posterior and of workers', () => {
  it('a log-posterior that throws stops the run with the count, the message and the point, keeping the checkpoint', async () => {
    const stem = join(dir(), 'throws');
    const target = { module: failing, exportName: 'throwingTarget', options: { above: 1.5 } };
    const err = await halted(sampleEnsemble({ ...common, workers: 0, target, output: stem, maxLikelihoodErrors: 2 }));
    const thrown = Number(/threw on (\d+) of \d+ evaluations \(limit maxLikelihoodErrors = 2\)/.exec(err.message)?.[1]);
    expect(thrown).toBeGreaterThan(2);
    expect(err.message).toMatch(/first error: "model undefined for x0 = 1\.[5-9]\d*" at x0=1\.[5-9]\d*, x1=/);
    expect(err.message).toContain(`${stem}.state.json is intact`);
    const steps = checkpointedSteps(stem);
    expect(steps).toBeGreaterThan(0);
    const sidecar = JSON.parse(readFileSync(`${stem}.json`, 'utf8')) as { status: string; failures: { thrown: number } };
    expect(sidecar.status).toBe('halted');
    expect(sidecar.failures.thrown).toBeLessThanOrEqual(2); // the failed step is not counted: it is redone on resume
    // Resuming with a higher limit continues from the checkpoint to the end.
    const r = await sampleEnsemble({ ...common, workers: 0, target, output: stem, maxLikelihoodErrors: 1000, resume: true });
    expect(r.steps).toBe(200);
    expect(r.failures.thrown).toBeGreaterThan(2);
    expect(r.failures.firstError?.message).toMatch(/^model undefined/);
  });

  it('NaN counts as zero probability: counted, never accepted, and the run goes on', async () => {
    const target = { module: failing, exportName: 'nanTarget', options: { above: 1 } };
    const r = await sampleEnsemble({ ...common, workers: 0, target, output: join(dir(), 'nan') });
    expect(r.steps).toBe(200);
    expect(r.failures.nan).toBeGreaterThan(0);
    expect(r.failures.thrown).toBe(0);
    for (let s = 0; s < r.history.steps; s++) for (let m = 0; m < 8; m++) expect(r.history.row(s, m)[1]).toBeLessThanOrEqual(1);
  });

  it('a worker that dies is replaced and the chain is the one an undisturbed run gives', async () => {
    const d = dir();
    const target = { module: failing, exportName: 'crashingTarget', options: { after: 300, marker: join(d, 'marker') } };
    const r = await sampleEnsemble({ ...common, workers: 1, target, output: join(d, 'crash-once') });
    expect(existsSync(join(d, 'marker'))).toBe(true);
    expect(r.workerRestarts).toBe(1);
    const calm = await sampleEnsemble({ ...common, workers: 0, target: { module: failing, exportName: 'nanTarget', options: { above: 1e9 } }, output: join(d, 'calm') });
    expect(readFileSync(r.files.chain, 'utf8')).toBe(readFileSync(calm.files.chain, 'utf8'));
  });

  it('a worker that keeps dying stops the run cleanly with its checkpoint intact', async () => {
    const stem = join(dir(), 'crash');
    const target = { module: failing, exportName: 'crashingTarget', options: { after: 300 } };
    const err = await halted(sampleEnsemble({ ...common, workers: 1, workerRestarts: 0, target, output: stem }));
    expect(err.message).toMatch(/sampling worker exited with code 3 while evaluating 4 point\(s\)/);
    expect(err.message).toContain('limit workerRestarts = 0');
    expect(err.checkpoint).toBe(`${stem}.state.json`);
    // 300 calls: 8 starting points, then 8 per step, so the crash comes during step 37.
    expect(checkpointedSteps(stem)).toBe(36);
  });

  it('bad settings are InputErrors naming the field', async () => {
    const target = { module: failing, exportName: 'nanTarget', options: { above: 1 } };
    const out = join(dir(), 'bad');
    await expect(sampleEnsemble({ ...common, workers: 0, target, output: out, walkers: 5 })).rejects.toThrow(/^walkers must be an even integer/);
    await expect(sampleEnsemble({ ...common, workers: 0, target, output: out, seed: -1 })).rejects.toThrow(/^seed must be/);
    await expect(sampleEnsemble({ ...common, workers: 0, target: { ...target, exportName: 'nope' }, output: out })).rejects.toThrow(/^target\.exportName: .* has no function export "nope"/);
    await expect(sampleEnsemble({ ...common, workers: 0, target, output: out, parameters: [{ name: 'x', lower: 0 }] })).rejects.toThrow(/^parameters\[0\] needs start and scale/);
    await expect(sampleEnsemble({ ...common, workers: 0, target, output: out, parameters: [...parameters, { name: 'x0', lower: 0, upper: 1 }] })).rejects.toThrow(InputError);
  });
});
