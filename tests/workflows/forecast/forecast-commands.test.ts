import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { runCliCaptured } from '../../support/run-cli-captured.js';
import { registerForecast } from '../../../src/cli/commands/forecast.js';
import { registerSensitivity } from '../../../src/cli/commands/sensitivity.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-forecast-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const run = (args: string[]): Promise<string> => runCliCaptured([registerForecast, registerSensitivity], args);

const config = {
  survey: { skyArea: 2000, bins: [{ zMin: 0.4, zMax: 0.6, nbar: 3e-4 }] },
  parameters: ['b1', 'b2', 'bG2'],
  power: { kMin: 0.01, kMax: 0.1, dk: 0.01 },
  bispectrum: { kMin: 0.02, kMax: 0.08, dk: 0.02 },
};

describe('treble forecast and treble sensitivity', () => {
  afterEach(() => {
    process.exitCode = undefined;
    vi.restoreAllMocks();
  });

  it('prints the forecast table with its assumptions and writes the ellipse plot', async () => {
    writeFileSync(join(dir, 'f.json'), JSON.stringify(config));
    const out = await run(['forecast', join(dir, 'f.json'), '--out', join(dir, 'out'), '--ellipse', 'b2,bG2']);
    expect(process.exitCode).toBeUndefined();
    expect(out).toMatch(/\| b1 \| [\d.]+ \| [\d.e-]+ \| [\d.e-]+ \| [\d.e-]+ \|/);
    expect(out).toMatch(/bias defaulted: bin 1: b1, b2, bG2/);
    // P0, P2, P4 on 10 k bins; B0 on shells n = 0..3 (centres 0.02 (n + 1)): bins i >= j >= l with
    // c_i - c_j - c_l < 1.5 dk, i.e. i - j - l <= 2: 1 + 3 + 6 + 9 = 19 (counted by hand).
    expect(out).toMatch(/; 30 P and 19 B data points/);
    expect(readFileSync(join(dir, 'out', 'ellipse-b2-bG2.svg'), 'utf8')).toMatch(/^<svg/);
    expect(JSON.parse(readFileSync(join(dir, 'out', 'forecast.json'), 'utf8')).sets.joint.names).toEqual(['b1', 'b2', 'bG2']);
  });

  it('writes one sensitivity map per parameter', async () => {
    const out = await run(['sensitivity', join(dir, 'f.json'), '--out', join(dir, 'maps'), '--parameters', 'b1,bG2']);
    expect(process.exitCode).toBeUndefined();
    expect(existsSync(join(dir, 'maps', 'sensitivity-bin1-bG2.svg'))).toBe(true);
    expect(out).toMatch(/bG2: .*equilateral [\d.]+%/);
  });

  it('exits 2 naming the bad key: non-positive density, unknown parameter', async () => {
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ ...config, survey: { bins: [{ zMin: 0.4, zMax: 0.6, nbar: 0, volume: 1e9 }] } }));
    expect(await run(['forecast', join(dir, 'bad.json')])).toMatch(/survey.bins\[0\].nbar must be a positive/);
    expect(process.exitCode).toBe(2);
    process.exitCode = undefined;
    writeFileSync(join(dir, 'bad2.json'), JSON.stringify({ ...config, parameters: ['b1', 'bQuux'] }));
    expect(await run(['forecast', join(dir, 'bad2.json')])).toMatch(/"bQuux" is neither a cosmology parameter nor read by the models/);
    expect(process.exitCode).toBe(2);
  });
});
