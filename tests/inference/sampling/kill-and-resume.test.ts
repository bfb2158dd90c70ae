import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { sampleEnsemble } from '../../../src/inference/sampling/sample-ensemble.js';
import { killResumeSettings } from './support/kill-resume-settings.js';

const child = fileURLToPath(new URL('./support/kill-resume-run.ts', import.meta.url));
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Start the child run; once its first checkpoint exists, wait `delayMs` and send `signal`. */
async function runAndSignal(stem: string, signal: NodeJS.Signals, delayMs: number) {
  const proc = spawn(process.execPath, ['--import', 'tsx', child, stem, '1'], { stdio: ['ignore', 'pipe', 'pipe'] });
  let stdout = '';
  let stderr = '';
  proc.stdout.on('data', (d) => (stdout += d));
  proc.stderr.on('data', (d) => (stderr += d));
  let exited = false;
  const ended = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    proc.on('exit', (code, sig) => {
      exited = true;
      resolve({ code, signal: sig });
    }),
  );
  while (!existsSync(`${stem}.state.json`) && !exited) await sleep(20);
  expect(exited, `child ended before its first checkpoint: ${stderr}`).toBe(false);
  await sleep(delayMs);
  proc.kill(signal);
  return { ...(await ended), stdout, stderr };
}

function checkpoint(stem: string): { steps: number; chainBytes: number } {
  return JSON.parse(readFileSync(`${stem}.state.json`, 'utf8')) as { steps: number; chainBytes: number };
}

async function uninterrupted(dir: string): Promise<string> {
  const r = await sampleEnsemble({ ...killResumeSettings(0), output: join(dir, 'reference'), progress: 'off', handleInterrupt: false });
  expect(r.steps).toBe(300);
  return readFileSync(r.files.chain, 'utf8');
}

describe('interrupted runs resume to the chain of an uninterrupted run', () => {
  it('kill -9 at a random moment, resume, and the chain equals the uninterrupted one', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-kill-'));
    const stem = join(dir, 'run');
    const delay = 50 + Math.floor(Math.random() * 700); // a random moment after the first checkpoint
    const ended = await runAndSignal(stem, 'SIGKILL', delay);
    expect(ended.signal, `child ended by itself (delay ${delay} ms): ${ended.stderr}`).toBe('SIGKILL');
    const saved = checkpoint(stem);
    expect(saved.steps).toBeLessThan(300);
    // Resume (here in-process, same seed) and compare with a run never interrupted.
    const r = await sampleEnsemble({ ...killResumeSettings(0), output: stem, resume: true, progress: 'off', handleInterrupt: false });
    expect(r.steps).toBe(300);
    expect(readFileSync(r.files.chain, 'utf8')).toBe(await uninterrupted(dir));
  });

  it('Ctrl-C (SIGINT) writes a final checkpoint matching the chain file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-int-'));
    const stem = join(dir, 'run');
    const ended = await runAndSignal(stem, 'SIGINT', 200);
    expect(ended.code, ended.stderr).toBe(0);
    expect(JSON.parse(ended.stdout).stopReason).toBe('interrupted');
    expect(ended.stderr).toMatch(/\| interrupted\n$/);
    const saved = checkpoint(stem);
    expect(JSON.parse(ended.stdout).steps).toBe(saved.steps); // nothing made after the final checkpoint
    expect(readFileSync(`${stem}.csv`).length).toBe(saved.chainBytes);
    expect(JSON.parse(readFileSync(`${stem}.json`, 'utf8')).status).toBe('interrupted');
    const r = await sampleEnsemble({ ...killResumeSettings(0), output: stem, resume: true, progress: 'off', handleInterrupt: false });
    expect(readFileSync(r.files.chain, 'utf8')).toBe(await uninterrupted(dir));
  });
});
