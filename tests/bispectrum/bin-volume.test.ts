import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { centreTriangleNodes, effectiveTriangleNodes } from '../../src/bispectrum/bin-averaging.js';
import { continuousBinNodes } from '../../src/bispectrum/continuous-bin-nodes.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';

// Made by tests/fixtures/scipy/triangle_bin_volume.py (scipy nquad, triangle inequality as variable limits).
const fixture = JSON.parse(readFileSync(new URL('../fixtures/scipy/triangle_bin_volume.json', import.meta.url), 'utf8')) as {
  kMin: number;
  dk: number;
  bins: { bin: number[]; k1: number; k2: number; k3: number; cos12: number }[];
};

describe('continuous bin-volume quadrature', () => {
  const bins = enumerateTriangleBins(shellGrid(fixture.kMin, 0.1, fixture.dk));
  const find = (ijl: number[]) => {
    for (let b = 0; b < bins.size; b++) {
      if (bins.indices[3 * b] === ijl[0] && bins.indices[3 * b + 1] === ijl[1] && bins.indices[3 * b + 2] === ijl[2]) return b;
    }
    throw new Error(`bin ${ijl} not enumerated`);
  };

  it('matches scipy k1 k2 k3-weighted means over the closing volume, including cut bins, to 1e-8', () => {
    const nodes = continuousBinNodes(bins, 6);
    for (const row of fixture.bins) {
      const b = find(row.bin);
      let k1 = 0;
      let k2 = 0;
      let k3 = 0;
      let c12 = 0;
      for (let n = nodes.start[b]; n < nodes.start[b + 1]; n++) {
        const w = nodes.weight[n];
        k1 += w * nodes.k1[n];
        k2 += w * nodes.k2[n];
        k3 += w * nodes.k3[n];
        c12 += (w * (nodes.k3[n] ** 2 - nodes.k1[n] ** 2 - nodes.k2[n] ** 2)) / (2 * nodes.k1[n] * nodes.k2[n]);
      }
      expect(Math.abs(k1 / row.k1 - 1)).toBeLessThan(1e-8);
      expect(Math.abs(k2 / row.k2 - 1)).toBeLessThan(1e-8);
      expect(Math.abs(k3 / row.k3 - 1)).toBeLessThan(1e-8);
      expect(Math.abs(c12 - row.cos12)).toBeLessThan(1e-8);
    }
  });

  it('places every node inside its bin and on a closing triangle; weights sum to 1', () => {
    const nodes = continuousBinNodes(bins, 3);
    const h = bins.shells.dk / 2;
    for (let b = 0; b < bins.size; b++) {
      let sum = 0;
      for (let n = nodes.start[b]; n < nodes.start[b + 1]; n++) {
        const [k1, k2, k3] = [nodes.k1[n], nodes.k2[n], nodes.k3[n]];
        expect(Math.abs(k1 - bins.centres[3 * b])).toBeLessThanOrEqual(h);
        expect(Math.abs(k2 - bins.centres[3 * b + 1])).toBeLessThanOrEqual(h);
        expect(Math.abs(k3 - bins.centres[3 * b + 2])).toBeLessThanOrEqual(h);
        expect(k3).toBeGreaterThanOrEqual(Math.abs(k1 - k2));
        expect(k3).toBeLessThanOrEqual(k1 + k2);
        sum += nodes.weight[n];
      }
      expect(sum).toBeCloseTo(1, 13);
    }
  });

  it('effective wavenumbers of a bin without cuts are c + dk^2/(12 c) per side (exact mean of k under the weight k)', () => {
    const b = find([9, 5, 5]);
    const eff = effectiveTriangleNodes(bins);
    const c = [bins.centres[3 * b], bins.centres[3 * b + 1], bins.centres[3 * b + 2]];
    const dk = bins.shells.dk;
    expect(eff.k1[b]).toBeCloseTo(c[0] + (dk * dk) / (12 * c[0]), 14);
    expect(eff.k2[b]).toBeCloseTo(c[1] + (dk * dk) / (12 * c[1]), 14);
  });

  it('evaluates bins whose centres do not close at the flattened triangle (c2 + c3, c2, c3)', () => {
    const b = find([4, 1, 1]); // centres 0.05, 0.02, 0.02
    const nodes = centreTriangleNodes(bins);
    expect(nodes.k1[b]).toBeCloseTo(0.04, 15);
    expect(nodes.k2[b]).toBeCloseTo(0.02, 15);
  });
});
