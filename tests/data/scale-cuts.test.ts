import { describe, expect, it } from 'vitest';
import { loadMeasurementBundle } from '../../src/data/measurement-bundle.js';
import { selectData, selectMatrix, selectVector } from '../../src/data/scale-cuts.js';
import { baseBundle, writeBundle } from './support/write-bundle.js';

const bundle = loadMeasurementBundle(writeBundle(baseBundle()));
const entries = bundle.dataVector.entries;

describe('scale cuts', () => {
  it('keeps a k range per multipole', () => {
    const s = selectData(entries, { limits: { P0: { kMin: 0.03, kMax: 0.05 }, P2: { kMax: 0.03 } }, blocks: ['P0', 'P2'] });
    expect(s.entries.map((e) => `${e.block}@${e.k[0]}`)).toEqual(['P0@0.03', 'P0@0.04', 'P0@0.05', 'P2@0.02', 'P2@0.03']);
    expect(s.perBlock.B0).toEqual({ kept: 0, total: 10 });
  });

  it('cuts triangles on the largest side (kMax), the smallest side (kMin) and the shape k3/k1', () => {
    const largest = selectData(entries, { blocks: ['B0'], limits: { B0: { kMax: 0.05 } } });
    expect(largest.entries.every((e) => e.k[0] <= 0.05)).toBe(true);
    expect(largest.entries).toHaveLength(4);
    const smallest = selectData(entries, { blocks: ['B0'], limits: { B: { kMin: 0.05 } } });
    expect(smallest.entries.map((e) => e.k.join('/'))).toEqual(['0.05/0.05/0.05', '0.07/0.05/0.05', '0.07/0.07/0.05', '0.07/0.07/0.07']);
    const shape = selectData(entries, { blocks: ['B0'], limits: { B0: { minSideRatio: 0.6 } } });
    expect(shape.entries.every((e) => e.k[2] / e.k[0] >= 0.6)).toBe(true);
    expect(shape.entries.some((e) => e.k.join('/') === '0.07/0.05/0.03')).toBe(false);
    expect(shape.entries).toHaveLength(7);
  });

  it('lets a block entry override its statistic key by key, and compares effective wavenumbers on request', () => {
    const s = selectData(entries, { blocks: ['P0', 'P2'], limits: { P: { kMin: 0.03, kMax: 0.04 }, P2: { kMax: 0.06 } } });
    expect(s.entries.filter((e) => e.block === 'P2').map((e) => e.k[0])).toEqual([0.03, 0.04, 0.05, 0.06]);
    const eff = selectData(entries, { blocks: ['P0'], limits: { P0: { kMax: 0.04 } }, wavenumbers: 'effective' });
    // Effective k are centre + 0.001, so the 0.04 bin (k_eff = 0.041) goes.
    expect(eff.entries.map((e) => e.k[0])).toEqual([0.02, 0.03]);
  });

  it('refuses a cut that leaves no data, unknown blocks and bad limits', () => {
    expect(() => selectData(entries, { limits: { P: { kMax: 0.001 }, B: { kMax: 0.001 } } })).toThrow(/the scale cuts leave no data/);
    expect(() => selectData(entries, { blocks: ['P4'] })).toThrow(/cuts\.blocks: 'P4' is not in the data vector/);
    expect(() => selectData(entries, { limits: { P0: { kMin: 0.1, kMax: 0.05 } } })).toThrow(/kMin \(0\.1\) exceeds kMax \(0\.05\)/);
    expect(() => selectData(entries, { limits: { P0: { minSideRatio: 0.5 } } })).toThrow(/minSideRatio applies only to bispectrum/);
  });

  it('cuts vectors and matrices by the same indices', () => {
    const idx = Int32Array.from([0, 2]);
    expect([...selectVector(Float64Array.from([5, 6, 7]), idx)]).toEqual([5, 7]);
    expect([...selectMatrix(Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9]), 3, idx)]).toEqual([1, 3, 7, 9]);
  });
});
