import { describe, expect, it } from 'vitest';
import { PowerMultipoleModel, powerMultipoleCsv } from '../../src/power/index.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

describe('multipole CSV table', () => {
  it('writes one row per bin with the model values in multipole order', () => {
    const model = new PowerMultipoleModel({ spectrum: analyticSpectrum(), bins: { kMin: 0.05, dk: 0.05, count: 3 }, nbar: 1e-3, multipoles: [0, 4] });
    const values = model.evaluate({ b1: 2 });
    const lines = powerMultipoleCsv(model, values).trimEnd().split('\n');
    expect(lines[0]).toBe('k,P0,P4');
    expect(lines).toHaveLength(4);
    const row = lines[2].split(',').map(Number);
    expect(row[0]).toBeCloseTo(0.1, 12);
    expect(row[1] / values[1] - 1).toBeCloseTo(0, 9);
    expect(row[2] / values[4] - 1).toBeCloseTo(0, 9);
  });
});
