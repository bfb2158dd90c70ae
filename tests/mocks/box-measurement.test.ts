import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadMeasurementBundle } from '../../src/data/measurement-bundle.js';
import { writeMeasurementBundle } from '../../src/data/write-measurement-bundle.js';
import { fundamentalFrequency } from '../../src/numerics/lattice-shell.js';
import { boxBundle, measureBox, type BoxMeasurementPlan } from '../../src/mocks/box-measurement.js';
import { gaussianFieldSpectrum } from '../../src/mocks/gaussian-field.js';

const folder = mkdtempSync(join(tmpdir(), 'treble-mocks-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('box measurement as a measurement bundle', () => {
  it('writes a bundle the likelihood reader loads with the same values, counts and bins', () => {
    const mesh = { n: 16, boxSize: 500 };
    const kf = fundamentalFrequency(mesh.boxSize);
    const plan: BoxMeasurementPlan = { mesh, power: { kMin: kf, kMax: 7 * kf, dk: kf }, bispectrum: { kMin: 2 * kf, kMax: 6 * kf, dk: 2 * kf } };
    const m = measureBox(gaussianFieldSpectrum(mesh, (k) => 1e4 / (1 + (k / 0.05) ** 2), 3), plan);
    writeMeasurementBundle(folder, boxBundle(m, { redshift: 0.5, numberDensity: 1e-3, fiducialCosmology: { h: 0.7 } }));
    const back = loadMeasurementBundle(folder);
    expect(back.metadata.boxSize).toBe(500);
    expect(back.metadata.lineOfSight).toBe('z-axis');
    expect(back.power?.multipoles).toEqual([0, 2, 4]);
    expect(Array.from(back.power?.values[1] ?? [])).toEqual(Array.from(m.power.p2));
    expect(Array.from(back.power?.counts ?? [])).toEqual(Array.from(m.power.modes));
    const b = m.bispectrum;
    expect(b).toBeDefined();
    expect(back.bispectrum?.size).toBe(b?.bins.size);
    expect(Array.from(back.bispectrum?.counts ?? [])).toEqual(Array.from(b?.counts ?? []));
    expect(Array.from(back.bispectrum?.values[0] ?? [])).toEqual(Array.from(b?.b0 ?? []));
    expect(Array.from(back.bispectrum?.shells ?? [])).toEqual(Array.from(b?.bins.indices ?? []));
  });
});
