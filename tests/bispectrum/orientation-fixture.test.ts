import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

interface Fixture {
  params: Record<string, number>;
  numberDensity: number;
  triangles: number[][];
  cases: { name: string; sigmaV: number; alphaPar: number; alphaPerp: number; B0B2: number[][] }[];
}

// Made by tests/fixtures/scipy/tree_bispectrum_orientation.py: explicit 3D vectors and scipy nquad over (mu1, phi).
const fixture = JSON.parse(
  readFileSync(new URL('../fixtures/scipy/tree_bispectrum_orientation.json', import.meta.url), 'utf8'),
) as Fixture;

describe('redshift-space B_0 and B_2 against a brute-force scipy orientation integral', () => {
  for (const c of fixture.cases) {
    it(`agrees to 1e-6 with default orientation nodes (${c.name}: sigma_v = ${c.sigmaV}, AP ${c.alphaPar}, ${c.alphaPerp})`, () => {
      const model = new TreeBispectrumModel({
        spectrum: analyticSpectrum(),
        triangles: fixture.triangles,
        numberDensity: fixture.numberDensity,
      });
      const b = model.evaluate({ ...fixture.params, alphaPar: c.alphaPar, alphaPerp: c.alphaPerp, bispSigmaV: c.sigmaV });
      const n = fixture.triangles.length;
      c.B0B2.forEach(([b0, b2], t) => {
        expect(Math.abs(b[t] / b0 - 1)).toBeLessThan(1e-6);
        expect(Math.abs(b[n + t] / b2 - 1)).toBeLessThan(1e-6);
      });
    });
  }
});
