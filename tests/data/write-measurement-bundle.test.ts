import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readCovarianceMatrix } from '../../src/data/covariance/matrix-file.js';
import { loadMeasurementBundle } from '../../src/data/measurement-bundle.js';
import { writeMeasurementBundle } from '../../src/data/write-measurement-bundle.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-bundle-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('writing a measurement bundle', () => {
  it('round-trips through the reader with identical values', () => {
    const p0 = [1234.5678901234567, 987.6, 55.5];
    const b0 = [1.2345678e8, 9.87e7];
    writeMeasurementBundle(dir, {
      redshift: 0.9,
      numberDensity: 3e-4,
      lineOfSight: 'z-axis',
      boxSize: 2000,
      fiducialCosmology: { h: 0.7 },
      power: { centres: [0.01, 0.02, 0.03], effective: [0.0101, 0.0199, 0.03], counts: [10, 40, 90], dk: 0.01, multipoles: [0, 2], values: [p0, [1, 2, 3]] },
      bispectrum: {
        centres: [0.02, 0.01, 0.01, 0.02, 0.02, 0.01],
        effective: [0.02, 0.01, 0.01, 0.021, 0.0199, 0.0101],
        counts: [100, 200],
        dk: 0.01,
        multipoles: [0],
        values: [b0],
      },
      covariance: { matrix: Array.from({ length: 64 }, (_, i) => (i % 9 === 0 ? 1 + i : 0)), size: 8 },
    });
    const bundle = loadMeasurementBundle(dir);
    expect(bundle.metadata.boxSize).toBe(2000);
    expect(Array.from(bundle.dataVector.values)).toEqual([...p0, 1, 2, 3, ...b0]);
    expect(bundle.dataVector.entries.map((e) => e.block)).toEqual(['P0', 'P0', 'P0', 'P2', 'P2', 'P2', 'B0', 'B0']);
    expect(bundle.dataVector.entries[7].kEffective).toEqual([0.021, 0.0199, 0.0101]);
    expect(bundle.metadata.covarianceMatrix).toBe('covariance.csv');
    const cov = readCovarianceMatrix(join(dir, 'covariance.csv'), 'covariance.csv', bundle.dataVector.entries);
    expect(cov[9]).toBe(10);
    expect(cov[1]).toBe(0);
  });
});
