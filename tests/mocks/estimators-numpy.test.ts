import { describe, expect, it } from 'vitest';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { RealFourier3d } from '../../src/numerics/fft-3d.js';
import { fundamentalFrequency } from '../../src/numerics/lattice-shell.js';
import { triangleGeometryByFft, measureBispectrumMultipoles } from '../../src/mocks/bispectrum-multipoles.js';
import { measurePowerMultipoles } from '../../src/mocks/power-multipoles.js';
import { binsNeedingShift } from '../../src/mocks/triangle-sums.js';
import { numpyMockFixture } from './numpy-fixture.js';

// Reference: numpy.fft.fftn and brute-force mode and triangle sums,
// tests/fixtures/numpy-mocks/estimators.py.
const fx = numpyMockFixture.field;
const mesh = { n: fx.n, boxSize: fx.boxSize };
const kf = fundamentalFrequency(fx.boxSize);
const shells = shellGrid(fx.kMinOverKf * kf, (fx.kMinOverKf + 2 * fx.dkOverKf) * kf, fx.dkOverKf * kf);
const spectrum = new RealFourier3d(fx.n).forward(Float64Array.from(fx.values));

describe('FFT estimators against numpy brute force on a 16^3 field', () => {
  it('P_0, P_2, P_4, mode counts and mean k per shell', () => {
    const p = measurePowerMultipoles(spectrum, mesh, shells);
    expect(p.centres.length).toBe(fx.power.length);
    fx.power.forEach((ref, s) => {
      expect(p.modes[s]).toBe(ref.modes);
      expect(p.meanK[s]).toBeCloseTo(ref.meanK, 12);
      expect(p.p0[s] / ref.P0).toBeCloseTo(1, 10);
      expect(p.p2[s] / ref.P2).toBeCloseTo(1, 10);
      expect(p.p4[s] / ref.P4).toBeCloseTo(1, 10);
    });
  });

  it('needs the shifted sums exactly for the bins whose upper edges sum to n k_f or more', () => {
    // Upper edges 3, 5, 7 k_f on a 16 mesh: (2,1,1) and (2,2,0) sum to 17, (2,2,1) to 19, (2,2,2) to 21 k_f.
    const need = binsNeedingShift(mesh, enumerateTriangleBins(shells));
    const flagged = fx.triangles.filter((_, b) => need[b] === 1).map((t) => t.bin.join(''));
    expect(flagged).toEqual(['211', '220', '221', '222']);
  });

  it('triangle counts and mean side lengths equal the brute-force enumeration', () => {
    const bins = enumerateTriangleBins(shells);
    const { counts, effective } = triangleGeometryByFft(mesh, bins);
    expect(bins.size).toBe(fx.triangles.length);
    fx.triangles.forEach((ref, b) => {
      expect(Array.from(bins.indices.subarray(3 * b, 3 * b + 3))).toEqual(ref.bin);
      expect(counts[b]).toBe(ref.count);
      for (let a = 0; a < 3; a++) expect(effective[3 * b + a] / ref.kEffective[a]).toBeCloseTo(1, 10);
    });
  });

  it('B_0 and B_2 equal the brute-force triangle sums', () => {
    const bins = enumerateTriangleBins(shells);
    const m = measureBispectrumMultipoles(spectrum, mesh, bins);
    fx.triangles.forEach((ref, b) => {
      expect(Math.abs(m.b0[b] - ref.B0)).toBeLessThan(1e-9 * Math.abs(ref.B0) + 1e-6);
      expect(Math.abs(m.b2[b] - ref.B2)).toBeLessThan(1e-9 * Math.abs(ref.B2) + 1e-6);
    });
  });
});
