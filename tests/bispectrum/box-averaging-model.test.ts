import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { validateCosmology } from '../../src/cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology } from '../../src/cosmology/linear-power-from-cosmology.js';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';

const cacheDir = mkdtempSync(join(tmpdir(), 'treble-box-model-'));
afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));
const spectrum = linearPowerFromCosmology(validateCosmology({ h: 0.68, omegaB: 0.0224, omegaCdm: 0.12, ns: 0.965, sigma8: 0.81 }, {}), 0.5);
const bins = enumerateTriangleBins(shellGrid(0.02, 0.06, 0.01));
const params = { b1: 1.9, b2: 0.4, bG2: -0.3, f: 0.75, bispShotPower: 1.2, bispShotConst: 0.8 };

describe('bispectrum model averaged over the lattice of a periodic box', () => {
  const box = new TreeBispectrumModel({ spectrum, bins, numberDensity: 3e-4, averaging: 'box', boxSize: 1000, latticeCacheDir: cacheDir });

  it('template path equals the direct path to 1e-10 (same lattice triangles)', () => {
    const t = box.evaluate(params);
    const d = box.evaluateDirect(params);
    let worst = 0;
    for (let i = 0; i < t.length; i++) worst = Math.max(worst, Math.abs(t[i] - d[i]) / Math.abs(d[i % bins.size]));
    expect(worst).toBeLessThan(1e-10);
  });

  it('stays close to the continuous bin average in layout and size (rms of B_0 within 3% at 3-10 k_f)', () => {
    // docs/bispectrum-bin-averaging.md: the continuous average is within ~1% rms of the exact one at L = 1000 for 0.01-0.1 h/Mpc.
    const b = box.evaluate(params);
    const c = new TreeBispectrumModel({ spectrum, bins, numberDensity: 3e-4, averaging: 'continuous' }).evaluate(params);
    let ss = 0;
    for (let i = 0; i < bins.size; i++) ss += (b[i] / c[i] - 1) ** 2;
    const rms = Math.sqrt(ss / bins.size);
    expect(rms).toBeLessThan(0.03);
    expect(rms).toBeGreaterThan(0);
  });

  it('refuses averaging "box" without a box size', () => {
    expect(() => new TreeBispectrumModel({ spectrum, bins, averaging: 'box' })).toThrow(/boxSize/);
  });
});
