import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Command } from 'commander';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { registerMockBox } from '../../src/cli/commands/mock-box.js';
import { loadMeasurementBundle } from '../../src/data/measurement-bundle.js';
import { readMeshField } from '../../src/mocks/field-file.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-mockbox-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(args: string[]): Promise<void> {
  const program = new Command().exitOverride();
  registerMockBox(program);
  await program.parseAsync(['node', 'treble', ...args]);
}

const recipe = {
  mesh: { n: 16, boxSize: 800 },
  redshift: 1,
  seed: 5,
  order: 'second',
  cosmology: { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044 },
  bias: { b1: 2, b2: 0.5, bG2: -0.29 },
  noise: { kind: 'gaussian', numberDensity: 1e-3 },
};

describe('treble mock-box and measure-box', () => {
  afterEach(() => {
    process.exitCode = undefined;
    vi.restoreAllMocks();
  });

  it('makes a mock field and measures it into a bundle the likelihood reads', async () => {
    vi.spyOn(process.stdout, 'write').mockImplementation(() => true);
    const recipePath = join(dir, 'recipe.json');
    writeFileSync(recipePath, JSON.stringify(recipe));
    const field = join(dir, 'mock.json');
    await run(['mock-box', recipePath, '--out', field]);
    expect(readMeshField(field).about.seed).toBe(5);
    const bundle = join(dir, 'bundle');
    await run(['measure-box', '--field', field, '--out', bundle, '--bisp-kmax', '0.04', '--shot-noise', '1000']);
    expect(process.exitCode).toBeUndefined();
    const b = loadMeasurementBundle(bundle);
    expect(b.metadata.numberDensity).toBe(1e-3);
    expect(b.metadata.redshift).toBe(1);
    expect(b.power?.size).toBe(3); // centres 2, 4, 6 k_f below the Nyquist 8 k_f
    expect(b.metadata.fiducialCosmology.h).toBe(0.6736);
    expect(b.bispectrum?.size).toBe(4); // shells 2 and 4 k_f: (0,0,0), (1,0,0), (1,1,0), (1,1,1)
  });

  it('bad input exits 2 with one line naming the problem', async () => {
    const err = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    await run(['measure-box', '--out', join(dir, 'x')]);
    expect(process.exitCode).toBe(2);
    expect(String(err.mock.calls[0][0])).toMatch(/exactly one of --field and --particles/);
  });
});
