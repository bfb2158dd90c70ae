import { describe, expect, it } from 'vitest';
import { continuumMeanK, continuumModeCount, latticeBinModes, PowerMultipoleModel } from '../../src/power/index.js';
import { latticeShell } from '../../src/numerics/lattice-shell.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const spectrum = analyticSpectrum();

describe('k-bin averaging', () => {
  it('counts the wavevectors of each shell and their mean k on a small lattice', () => {
    const L = 2 * Math.PI; // k_f = 1: shells [0.5, 1.5) and [1.5, 2.5)
    const modes = latticeBinModes(L, { kMin: 1, dk: 1, count: 2 });
    // |n|^2 = 1, 2 | 3, 4, 5, 6 hold 6, 12 | 8, 6, 24, 24 vectors (sums of three squares, OEIS A005875).
    expect(modes[0].modeCount).toBe(18);
    expect(modes[0].meanK).toBeCloseTo((6 * 1 + 12 * Math.SQRT2) / 18, 14);
    expect(modes[1].modeCount).toBe(62);
    expect(modes[1].meanK).toBeCloseTo((8 * Math.sqrt(3) + 6 * 2 + 24 * Math.sqrt(5) + 24 * Math.sqrt(6)) / 62, 14);
  });

  it('uses the shared half-open lattice shells and drops the zero vector', () => {
    const L = 500;
    const bins = { kMin: 0.01, dk: 0.02, count: 4 };
    const modes = latticeBinModes(L, bins);
    modes.forEach((b, i) => {
      const shell = latticeShell(L, 0.02 * i, 0.02 * (i + 1));
      expect(b.modeCount).toBe(i === 0 ? shell.count - 1 : shell.count);
      expect(b.multiplicity.reduce((s, m) => s + m, 0)).toBe(b.modeCount);
    });
  });

  it('reuses the enumeration for the same box and bins (it does not depend on the spectrum)', () => {
    const bins = { kMin: 0.02, dk: 0.02, count: 3 };
    expect(latticeBinModes(700, bins)).toBe(latticeBinModes(700, { ...bins }));
    expect(latticeBinModes(700, bins)).not.toBe(latticeBinModes(701, bins));
  });

  it('continuum mode count 4 pi (b^3 - a^3) / (3 k_f^3) matches the lattice for thick shells (common practice)', () => {
    const modes = latticeBinModes(3000, { kMin: 0.1, dk: 0.01, count: 1 });
    expect(Math.abs(modes[0].modeCount / continuumModeCount(3000, 0.095, 0.105) - 1)).toBeLessThan(0.01);
    expect(continuumModeCount(2 * Math.PI, 0, 1)).toBeCloseTo((4 * Math.PI) / 3, 14);
  });

  it('mode-weighted mean k of a continuous shell: (3/4)(b^4 - a^4)/(b^3 - a^3) (common practice)', () => {
    expect(continuumMeanK(0, 1)).toBeCloseTo(0.75, 15);
    const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.1, dk: 0.02, count: 1 }, nbar: 1e-3, averaging: { kind: 'mean-k' } });
    expect(model.entries[0].k[0]).toBeCloseTo((0.75 * (0.11 ** 4 - 0.09 ** 4)) / (0.11 ** 3 - 0.09 ** 3), 15);
    expect(model.entries[0].k[0]).toBeGreaterThan(0.1);
  });

  it('lattice average of an isotropic spectrum has no quadrupole (cubic symmetry of the lattice, common practice)', () => {
    const smooth = analyticSpectrum({ wiggles: false }); // no wiggles: nothing anisotropic from the IR damping
    const model = new PowerMultipoleModel({ spectrum: smooth, bins: { kMin: 0.03, dk: 0.02, count: 5 }, nbar: 1e-3, averaging: { kind: 'lattice', boxSize: 600 } });
    const out = model.evaluate({ b1: 2, f: 0, pStochConst: 0 });
    const modes = latticeBinModes(600, { kMin: 0.03, dk: 0.02, count: 5 });
    for (let i = 0; i < 5; i++) {
      let mean = 0;
      for (let g = 0; g < modes[i].k.length; g++) mean += (modes[i].multiplicity[g] * 4 * smooth.power(modes[i].k[g])) / modes[i].modeCount;
      expect(out[i] / mean - 1).toBeCloseTo(0, 12);
      expect(Math.abs(out[5 + i] / out[i])).toBeLessThan(1e-12);
    }
  });

  // P4 is left out: the lattice's own l = 4 (cubic) anisotropy leaks b1^2 P into it by several percent.
  it('lattice average approaches P0 and P2 at the mean k for a large box', () => {
    const smooth = analyticSpectrum({ wiggles: false });
    const bins = { kMin: 0.1, dk: 0.01, count: 2 };
    const onLattice = new PowerMultipoleModel({ spectrum: smooth, bins, nbar: 1e-3, averaging: { kind: 'lattice', boxSize: 2000 } });
    const atMeanK = new PowerMultipoleModel({ spectrum: smooth, bins, nbar: 1e-3, averaging: { kind: 'mean-k', boxSize: 2000 } });
    expect(Array.from(atMeanK.entries.map((e) => e.k[0]))).toEqual(Array.from(onLattice.entries.map((e) => e.k[0])));
    const p = { b1: 2, f: 0.7, pStochConst: 0 };
    const a = onLattice.evaluate(p);
    const b = atMeanK.evaluate(p);
    for (let e = 0; e < 4; e++) expect(Math.abs(a[e] / b[e] - 1)).toBeLessThan(0.005);
  });
});
