import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Command } from 'commander';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { registerPowerMultipoles } from '../../src/cli/commands/power-multipoles.js';

const config = join('data-demo', 'demo-cosmology.json');

async function run(args: string[]): Promise<void> {
  const program = new Command().exitOverride();
  registerPowerMultipoles(program);
  await program.parseAsync(['node', 'treble', 'multipoles', config, ...args]);
}

describe('treble multipoles', () => {
  afterEach(() => {
    process.exitCode = undefined;
    vi.restoreAllMocks();
  });

  it('writes k, P0, P2, P4 per bin as CSV', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-power-'));
    try {
      const out = join(dir, 'p.csv');
      await run(['--nbar', '3e-4', '--bins', '4', '--set', 'b1=2', 'pCt0=1', '--out', out]);
      const lines = readFileSync(out, 'utf8').trimEnd().split('\n');
      expect(lines[0]).toBe('k,P0,P2,P4');
      expect(lines).toHaveLength(5);
      const [k, p0, p2, p4] = lines[1].split(',').map(Number);
      expect(k).toBeCloseTo(0.01, 12);
      // Kaiser-like ordering on large scales for b1 = 2, f ~ 0.8 (common practice).
      expect(p0).toBeGreaterThan(p2);
      expect(p2).toBeGreaterThan(p4);
      expect(p4).toBeGreaterThan(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('reports bad input on one line with exit code 2', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    await run(['--nbar', '-1e-4']);
    expect(process.exitCode).toBe(2);
    expect(String(stderr.mock.calls[0][0])).toBe('treble: nbar must be a positive number density in (h/Mpc)^3, got -0.0001\n');
  });
});
