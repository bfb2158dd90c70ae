import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/contracts/input-error.js';
import { bispectrumMultipoleCsv, parseTriangleListCsv } from '../../src/bispectrum/bispectrum-csv.js';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

describe('bispectrum CSV', () => {
  it('reads triangle lists with header, comments, commas or spaces', () => {
    expect(parseTriangleListCsv('k1,k2,k3\n# note\n0.1,0.08,0.05\n0.06 0.06 0.06\n', 'tri.csv')).toEqual([
      [0.1, 0.08, 0.05],
      [0.06, 0.06, 0.06],
    ]);
  });

  it('names the file and line of a bad row', () => {
    expect(() => parseTriangleListCsv('0.1,0.08,0.05\n0.1,x,0.05\n', 'tri.csv')).toThrow(InputError);
    expect(() => parseTriangleListCsv('0.1,0.08,0.05\n0.1,x,0.05\n', 'tri.csv')).toThrow(/tri\.csv:2/);
    expect(() => parseTriangleListCsv('0.1,0.08\n', 'tri.csv')).toThrow(/tri\.csv:1: expected three numbers/);
  });

  it('writes one row per triangle with the model values in multipole columns', () => {
    const triangles = [
      [0.1, 0.08, 0.05],
      [0.06, 0.06, 0.06],
    ];
    const model = new TreeBispectrumModel({ spectrum: analyticSpectrum(), triangles, multipoles: [0, 2] });
    const values = model.evaluate({ b1: 2 });
    const lines = bispectrumMultipoleCsv(model, values).trim().split('\n');
    expect(lines[0]).toBe('k1,k2,k3,B0,B2');
    expect(lines.length).toBe(3);
    const cells = lines[2].split(',').map(Number);
    expect(cells.slice(0, 3)).toEqual([0.06, 0.06, 0.06]);
    expect(Math.abs(cells[3] / values[1] - 1)).toBeLessThan(1e-9);
    expect(Math.abs(cells[4] / values[3] - 1)).toBeLessThan(1e-9);
  });
});
