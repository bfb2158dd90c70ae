import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Command } from 'commander';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { registerLinearTheory } from '../../src/cli/commands/linear-theory.js';
import { backgroundOf, GrowthHistory, linearPowerFromCosmology, readLinearTheoryConfig } from '../../src/cosmology/index.js';

const demoConfig = join('data-demo', 'demo-cosmology.json');

async function run(args: string[]): Promise<void> {
  const program = new Command().exitOverride();
  registerLinearTheory(program);
  await program.parseAsync(['node', 'treble', ...args]);
}

describe('treble linear', () => {
  afterEach(() => {
    process.exitCode = undefined;
    vi.restoreAllMocks();
  });

  it('writes the spectrum and background CSVs that the library computes', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-linear-'));
    try {
      const out = join(dir, 'p.csv');
      const bgOut = join(dir, 'bg.csv');
      await run(['linear', demoConfig, '--kmin', '0.01', '--kmax', '0.3', '--points', '7', '--out', out, '--background', bgOut, '--z', '0,1']);
      const lines = readFileSync(out, 'utf8').trimEnd().split('\n');
      expect(lines[0]).toBe('k,P_lin,P_nw,f,P_m');
      expect(lines).toHaveLength(8);
      const config = readLinearTheoryConfig(demoConfig);
      const lp = linearPowerFromCosmology(config.cosmology, config.redshift);
      const [k, p, pnw, f, pm] = lines[7].split(',').map(Number);
      expect(k).toBeCloseTo(0.3, 12);
      expect(p / lp.power(0.3)).toBeCloseTo(1, 8);
      expect(pnw / lp.powerNoWiggle(0.3)).toBeCloseTo(1, 8);
      expect(f / lp.growthRate(0.3)).toBeCloseTo(1, 8);
      expect(pm / lp.powerMatter(0.3)).toBeCloseTo(1, 8);
      const bg = readFileSync(bgOut, 'utf8').trimEnd().split('\n');
      expect(bg[0]).toBe('z,H,D_M,D_A,D,f');
      const [z, h, dm, da, d, rate] = bg[2].split(',').map(Number);
      const background = backgroundOf(config.cosmology);
      const growth = new GrowthHistory(background);
      expect(z).toBe(1);
      expect(h / background.hubble(1)).toBeCloseTo(1, 8);
      expect(dm / background.transverseDistance(1)).toBeCloseTo(1, 8);
      expect(da).toBeCloseTo(dm / 2, 5);
      expect(d / growth.factor(1)).toBeCloseTo(1, 8);
      expect(rate / growth.rate(1)).toBeCloseTo(1, 8);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('reads a power table named in the config, relative to the config file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-linear-'));
    try {
      const rows = Array.from({ length: 40 }, (_, i) => `${1e-3 * 1.2 ** i} ${1e4 * (1 + i) ** -1.5}`);
      writeFileSync(join(dir, 'pk.txt'), rows.join('\n'));
      const cosmology = readLinearTheoryConfig(demoConfig).cosmology;
      writeFileSync(join(dir, 'c.json'), JSON.stringify({ redshift: 0.5, cosmology, powerTable: 'pk.txt' }));
      const out = join(dir, 'p.csv');
      await run(['linear', join(dir, 'c.json'), '--kmin', '0.001', '--kmax', String(1e-3 * 1.2 ** 39), '--points', '40', '--out', out]);
      const lines = readFileSync(out, 'utf8').trimEnd().split('\n');
      expect(lines[0]).toBe('k,P_lin,P_nw,f');
      expect(Number(lines[1].split(',')[1])).toBeCloseTo(1e4, 4);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('reports a bad config on one line naming field and file, exit code 2', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treble-linear-'));
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    try {
      const file = join(dir, 'bad.json');
      writeFileSync(file, '{\n  "redshift": 0.5,\n  "cosmology": {"h": 0.7, "omegaB": 0.022, "omegaCdm": 0.12, "ns": 0.96, "lnAs": 3, "mNu": -0.1}\n}\n');
      await run(['linear', file]);
      expect(process.exitCode).toBe(2);
      expect(String(stderr.mock.calls[0][0])).toBe(`treble: cosmology.mNu (${file}:3) = -0.1 is out of range [0, 3] (sum of neutrino masses in eV)\n`);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
