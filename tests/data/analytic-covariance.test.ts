import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { prepareCovariance, validateCovarianceOptions } from '../../src/data/covariance/covariance-choice.js';
import { binVolumeTriangleCount, symmetryFactor } from '../../src/data/covariance/gaussian-bispectrum-variance.js';
import { addGaussianPowerCovariance } from '../../src/data/covariance/gaussian-power-covariance.js';
import { continuousModeCount } from '../../src/data/covariance/mode-counts.js';
import type { MeasuredEntry } from '../../src/data/data-vector.js';
import { loadMeasurementBundle } from '../../src/data/measurement-bundle.js';
import { selectData } from '../../src/data/scale-cuts.js';
import { fixtures } from '../inference/likelihood/support/scipy-fixtures.js';
import { latticeShell } from '../../src/numerics/lattice-shell.js';
import { baseBundle, withMocks, writeBundle } from './support/write-bundle.js';

describe('analytic Gaussian covariance pieces', () => {
  it('P_l x P_l\' of one k bin matches the mu integral done by scipy quad (fixture from scipy)', () => {
    const g = fixtures.power_gaussian;
    const entries: MeasuredEntry[] = [0, 2, 4].map((ell) => ({ block: `P${ell}`, statistic: 'P', ell, k: [0.1], kEffective: [0.1], shells: [0], count: g.modes, bin: 0 }));
    const theory = Float64Array.from([0, 2, 4], (l) => g.multipoles[String(l)]);
    const out = new Float64Array(9);
    addGaussianPowerCovariance({ entries, theory, shotNoise: 1 / g.nbar, dk: 0.01, volume: 1e9, boxSize: undefined, modeCounts: 'measured' }, out);
    [0, 2, 4].forEach((l1, a) => [0, 2, 4].forEach((l2, b) => expect(out[a * 3 + b] / g.covariance[`${l1}${l2}`] - 1).toBeCloseTo(0, 12)));
  });

  it('counts continuum modes as 4 pi k^2 dk V / (2 pi)^3 and triangles as 8 pi^2 k1 k2 k3 dk^3 / k_f^6 (Scoccimarro 2004)', () => {
    expect(continuousModeCount(0.1, 0.01, 1e9)).toBeCloseTo((4 * Math.PI * 0.01 * 0.01 * 1e9) / (2 * Math.PI) ** 3, 6);
    const kf = (2 * Math.PI) / 1000;
    expect(binVolumeTriangleCount([0.1, 0.08, 0.05], 0.01, kf)).toBeCloseTo((8 * Math.PI ** 2 * 0.1 * 0.08 * 0.05 * 1e-6) / kf ** 6, 3);
    // On the closure edge c1 = c2 + c3 only about half of the bin volume closes.
    expect(binVolumeTriangleCount([0.1, 0.05, 0.05], 0.01, kf) / ((8 * Math.PI ** 2 * 0.1 * 0.05 * 0.05 * 1e-6) / kf ** 6)).toBeCloseTo(0.5, 12);
    expect([symmetryFactor([3, 3, 3]), symmetryFactor([3, 3, 1]), symmetryFactor([3, 1, 1]), symmetryFactor([3, 2, 1])]).toEqual([6, 2, 2, 1]);
  });
});

describe('covariance choices', () => {
  const bundle = loadMeasurementBundle(writeBundle(baseBundle()));
  const all = selectData(bundle.dataVector.entries);
  const theory = Float64Array.from(bundle.dataVector.values);

  it('Gaussian: block-diagonal in k bins and triangles, P x B zero by default, the leading term on request', () => {
    const o = { source: 'gaussian', modeCounts: 'continuous', triangleCounts: 'bin-volume' } as const;
    expect(validateCovarianceOptions(o)).toEqual(o);
    const c = prepareCovariance(o, { bundle, selection: all, theory, freeParameters: 3 });
    const n = c.size;
    expect(n).toBe(20);
    expect(c.matrix[0 * n + 5]).not.toBe(0); // P0 x P2 of the same k bin
    expect(c.matrix[0 * n + 6]).toBe(0); // P0 x P2 of different k bins
    expect(c.matrix[0 * n + 10]).toBe(0); // P0 x B0
    expect(c.matrix[10 * n + 11]).toBe(0); // different triangles
    expect(c.description.text).toMatch(/analytic Gaussian .*modeCounts = continuous; triangleCounts = bin-volume; crossPowerBispectrum = none/);
    const cross = prepareCovariance({ ...o, crossPowerBispectrum: 'leading', shotNoise: 'add' }, { bundle, selection: all, theory, freeParameters: 3 });
    // P0 at k = 0.03 and the equilateral bin (0.03, 0.03, 0.03): three sides in the shell,
    // Cov = 2 (P0 + 1/nbar) B0 * 3 / N_k (Sefusatti et al. 2006, from memory).
    const e = bundle.dataVector.entries;
    const p = e.findIndex((x) => x.block === 'P0' && Math.abs(x.k[0] - 0.03) < 1e-9);
    const t = e.findIndex((x) => x.block === 'B0' && x.k.every((k) => Math.abs(k - 0.03) < 1e-9));
    const nk = continuousModeCount(0.03, 0.01, 1e9);
    expect(cross.matrix[p * n + t]).toBeCloseTo((2 * (theory[p] + 1 / 3e-4) * theory[t] * 3) / nk, 6);
    expect(cross.matrix[t * n + p]).toBe(cross.matrix[p * n + t]);
    // Shot noise in the model (default): P0 enters as it is.
    const inTheory = prepareCovariance({ ...o, crossPowerBispectrum: 'leading' }, { bundle, selection: all, theory, freeParameters: 3 });
    expect(inTheory.matrix[p * n + t]).toBeCloseTo((2 * theory[p] * theory[t] * 3) / nk, 6);
  });

  it('takes the exact lattice triangle counts of the box on request (brute-force enumeration of the box vectors)', () => {
    const measured = prepareCovariance({ source: 'gaussian' }, { bundle, selection: all, theory, freeParameters: 0 });
    const lattice = prepareCovariance({ source: 'gaussian', triangleCounts: 'lattice' }, { bundle, selection: all, theory, freeParameters: 0 });
    const n = 20;
    // Ordered triples q1 + q2 + q3 = 0 with q_a in the half-open shells of the bin, by brute force.
    const count = (k: number[]) => {
      const shells = k.map((c) => latticeShell(1000, c - 0.01, c + 0.01));
      const side = 129;
      const at = (x: number, y: number, z: number) => ((x + 64) * side + (y + 64)) * side + (z + 64);
      const third = new Uint8Array(side ** 3);
      const v3 = shells[2].vectors;
      for (let v = 0; v < shells[2].count; v++) third[at(v3[3 * v], v3[3 * v + 1], v3[3 * v + 2])] = 1;
      const [v1, v2] = [shells[0].vectors, shells[1].vectors];
      let total = 0;
      for (let a = 0; a < shells[0].count; a++) {
        for (let b = 0; b < shells[1].count; b++) {
          const x = -v1[3 * a] - v2[3 * b];
          const y = -v1[3 * a + 1] - v2[3 * b + 1];
          const z = -v1[3 * a + 2] - v2[3 * b + 2];
          if (Math.abs(x) <= 64 && Math.abs(y) <= 64 && Math.abs(z) <= 64) total += third[at(x, y, z)];
        }
      }
      return total;
    };
    for (const k of [[0.05, 0.05, 0.03], [0.07, 0.05, 0.03]]) {
      const i = bundle.dataVector.entries.findIndex((e) => e.block === 'B0' && e.k.every((x, s) => Math.abs(x - k[s]) < 1e-9));
      const e = bundle.dataVector.entries[i];
      const latticeCount = (e.count * measured.matrix[i * n + i]) / lattice.matrix[i * n + i];
      expect(latticeCount).toBeCloseTo(count(k), 6);
    }
  });

  it('is cut with the data before it is factorised', () => {
    const cut = selectData(bundle.dataVector.entries, { blocks: ['P0', 'B0'], limits: { P0: { kMax: 0.04 } } });
    const full = prepareCovariance({ source: 'gaussian' }, { bundle, selection: all, theory, freeParameters: 0 });
    const part = prepareCovariance({ source: 'gaussian' }, { bundle, selection: cut, theory, freeParameters: 0 });
    expect(part.size).toBe(cut.indices.length);
    cut.indices.forEach((i, a) => cut.indices.forEach((j, b) => expect(part.matrix[a * part.size + b]).toBe(full.matrix[i * 20 + j])));
  });

  it('mocks: Hartlap factor on the precision and the Percival et al. factors in the description', () => {
    const b = loadMeasurementBundle(writeBundle(withMocks(baseBundle(), 40)));
    const c = prepareCovariance({ source: 'mocks', treatment: 'hartlap' }, { bundle: b, selection: all, freeParameters: 4 });
    expect(c.form).toEqual({ kind: 'gaussian', precisionFactor: (40 - 20 - 2) / 39 });
    expect(c.description.details.percivalM1).toBeGreaterThan(1);
    expect(c.description.text).toMatch(/hartlapFactor = 0\.461538/);
    const t = prepareCovariance({ source: 'mocks', treatment: 't-distribution' }, { bundle: b, selection: all, freeParameters: 4 });
    expect(t.form).toEqual({ kind: 't-distribution', realisations: 40 });
  });

  it('matrix file: refused when its header does not follow the data-vector blocks', () => {
    const files = baseBundle();
    const header = bundle.dataVector.entries.map((e, i) => (i === 12 ? 'P2 k=0.1' : `${e.block} #${i}`));
    const rows = bundle.dataVector.entries.map((_, i) => bundle.dataVector.entries.map((__, j) => (i === j ? 1 : 0)).join(','));
    files.files['cov.csv'] = [header.join(','), ...rows].join('\n');
    const dir = writeBundle(files);
    const b = loadMeasurementBundle(dir);
    expect(() => prepareCovariance({ source: 'matrix', file: 'cov.csv' }, { bundle: b, selection: all, freeParameters: 0 })).toThrow(/cov\.csv:1: column 13 is headed 'P2 k=0\.1' but data-vector entry 13 belongs to block B0/);
    writeFileSync(join(dir, 'cov.csv'), [header.slice(0, 19).join(','), ...rows.slice(0, 19).map((r) => r.split(',').slice(0, 19).join(','))].join('\n'));
    expect(() => prepareCovariance({ source: 'matrix', file: 'cov.csv' }, { bundle: b, selection: all, freeParameters: 0 })).toThrow(/a 19 x 19 matrix does not match the data vector of 20 entries/);
  });

  it('validates the options by key', () => {
    expect(() => validateCovarianceOptions({ source: 'mock' })).toThrow(/covariance\.source must be matrix, mocks or gaussian/);
    expect(() => validateCovarianceOptions({ source: 'mocks' })).toThrow(/covariance\.treatment must be one of hartlap, t-distribution/);
    expect(() => validateCovarianceOptions({ source: 'gaussian', modeCounts: 'exact', file: 'x' })).toThrow(/covariance\.file is not a key of source "gaussian"[\s\S]*covariance\.modeCounts must be one of/);
  });
});
