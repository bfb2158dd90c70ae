import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { version } from '../../../src/io/package-version.js';
import { ProgressDisplay } from '../../../src/inference/sampling/progress-display.js';
import { sampleEnsemble } from '../../../src/inference/sampling/sample-ensemble.js';
import type { ChainSidecar } from '../../../src/inference/sampling/sidecar.js';

class Capture extends Writable {
  text = '';
  isTTY = false;
  override _write(chunk: Buffer, _enc: string, done: () => void) {
    this.text += chunk.toString();
    done();
  }
}

const target = { module: new URL('./targets/banana.ts', import.meta.url).href, exportName: 'bananaTarget', options: { s: 1, b: 0.5 } };
const parameters = [
  { name: 'x1', start: 0, scale: 1, lower: -10, upper: 10 },
  { name: 'x2', start: 0, scale: 1 },
];

describe('chain file, sidecar and progress lines', () => {
  it('writes the header, one row per walker and step, and a sidecar describing the run', async () => {
    const stem = join(mkdtempSync(join(tmpdir(), 'treble-files-')), 'run');
    const stream = new Capture();
    const priors = { x1: { uniform: [-10, 10] } };
    const r = await sampleEnsemble({ parameters, target, output: stem, seed: 5, walkers: 8, workers: 0, maxSteps: 250, checkEvery: 50, priors, progress: 'auto', progressStream: stream, progressSeconds: 0, handleInterrupt: false });
    const lines = readFileSync(`${stem}.csv`, 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('step,walker,logPosterior,x1,x2');
    expect(lines.length).toBe(1 + 250 * 8);
    expect(lines[1].startsWith('1,0,')).toBe(true);
    expect(lines.at(-1)?.startsWith('250,7,')).toBe(true);
    // Numbers read back are the sampled doubles.
    expect(Number(lines.at(-1)?.split(',')[3])).toBe(r.history.row(249, 7)[1]);
    const kept = r.history.points(r.diagnostics.burnInSteps);
    expect(kept.length).toBe((250 - r.diagnostics.burnInSteps) * 8 * 2);
    expect(kept.slice(-2)).toEqual(Float64Array.from(lines.at(-1)!.split(',').slice(3).map(Number)));
    const sidecar = JSON.parse(readFileSync(`${stem}.json`, 'utf8')) as ChainSidecar;
    expect(sidecar.software).toEqual({ name: 'treble', version });
    expect(sidecar.status).toBe('max-steps');
    expect(sidecar.seed).toBe(5);
    expect(sidecar.priors).toEqual(priors);
    expect(sidecar.parameters[0]).toEqual({ name: 'x1', lower: -10, upper: 10, start: 0, scale: 1 });
    expect(sidecar.parameters[1].upper).toBeNull();
    expect(sidecar.sampler).toMatchObject({ method: 'stretch-move-ensemble', walkers: 8, stretch: 2, tauMultiple: 50 });
    expect(sidecar.steps).toBe(250);
    expect(sidecar.diagnostics?.parameters.map((p) => p.name)).toEqual(['x1', 'x2']);
    expect(sidecar.diagnostics?.burnInSteps).toBe(r.diagnostics.burnInSteps);
    // Not a terminal: plain lines, the last one with the outcome.
    const progress = stream.text.trimEnd().split('\n');
    expect(stream.text).not.toContain('\r');
    expect(progress.at(-1)).toMatch(/^step 250\/250 \| acceptance 0\.\d{3} \| tau \d+\.\d \| ETA 0s \| max-steps$/);
  });

  it('refuses to overwrite a run, and to resume with another seed', async () => {
    const stem = join(mkdtempSync(join(tmpdir(), 'treble-files-')), 'run');
    const settings = { parameters, target, output: stem, seed: 5, walkers: 8, workers: 0, maxSteps: 20, progress: 'off' as const, handleInterrupt: false };
    await sampleEnsemble(settings);
    await expect(sampleEnsemble(settings)).rejects.toThrow(/^output: .*run\.state\.json exists; set resume/);
    await expect(sampleEnsemble({ ...settings, seed: 6, resume: true })).rejects.toThrow(/^seed: 6 differs from the checkpointed run's 5/);
    const more = await sampleEnsemble({ ...settings, maxSteps: 30, resume: true });
    expect(more.steps).toBe(30);
  });

  it('an abort signal ends a run on this thread with a final checkpoint', async () => {
    const stem = join(mkdtempSync(join(tmpdir(), 'treble-files-')), 'run');
    const r = await sampleEnsemble({ parameters, target, output: stem, seed: 5, walkers: 8, workers: 0, maxSteps: 10_000_000, tauMultiple: 1e9, progress: 'off', handleInterrupt: false, signal: AbortSignal.timeout(300) });
    expect(r.stopReason).toBe('interrupted');
    expect(r.steps).toBeGreaterThan(0);
    const state = JSON.parse(readFileSync(`${stem}.state.json`, 'utf8')) as { steps: number; chainBytes: number };
    expect(state.steps).toBe(r.steps);
    expect(readFileSync(`${stem}.csv`).length).toBe(state.chainBytes);
  });

  it('on a terminal the status line is redrawn in place', () => {
    const stream = new Capture();
    stream.isTTY = true;
    const display = new ProgressDisplay('auto', stream, 30);
    display.update({ step: 10, maxSteps: 100, acceptance: 0.4, note: 'tau 3.0', expectedSteps: 150 });
    display.finish({ step: 20, maxSteps: 100, acceptance: 0.4, note: 'tau 3.0', expectedSteps: 150 }, 'converged');
    expect(stream.text).toMatch(/^\rstep 10\/100 \| acceptance 0\.400 \| tau 3\.0 \| ETA \S+\x1b\[K\rstep 20\/100 .* \| converged\x1b\[K\n$/);
  });
});
