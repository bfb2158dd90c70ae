import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/contracts/input-error.js';
import { parseShapeClass, binsOfShapes } from '../../src/bispectrum/shape-classes.js';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { userTriangleNodes } from '../../src/bispectrum/user-triangles.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const spectrum = analyticSpectrum();
const bins = enumerateTriangleBins(shellGrid(0.02, 0.06, 0.02));

function inputError(fn: () => unknown, pattern: RegExp): void {
  expect(fn).toThrow(InputError);
  expect(fn).toThrow(pattern);
}

describe('bad bispectrum input gets a one-line InputError naming the problem', () => {
  it('triangle lists that cannot close, name the row', () => {
    inputError(() => userTriangleNodes([[0.1, 0.05, 0.04], [0.1, 0.06, 0.03]], 'tri.csv'), /tri\.csv: row 1 .*cannot close/);
    inputError(() => userTriangleNodes([[0.1, -0.05, 0.06]]), /row 1 .*positive/);
    inputError(() => userTriangleNodes([[0.1, 0.05]]), /row 1 has 2 values/);
  });

  it('wavenumbers outside the linear table (including after AP)', () => {
    const short = analyticSpectrum({ kMax: 0.05 });
    inputError(() => new TreeBispectrumModel({ spectrum: short, bins }).evaluate({}), /outside the linear spectrum's range/);
    const ok = analyticSpectrum({ kMax: 0.0701 });
    const model = new TreeBispectrumModel({ spectrum: ok, bins, averaging: 'centres' });
    expect(model.evaluate({}).length).toBe(2 * bins.size);
    inputError(() => model.evaluate({ alphaPerp: 0.8 }), /after AP/);
  });

  it('non-positive dk', () => {
    inputError(() => shellGrid(0.01, 0.1, 0), /dk must be positive/);
    inputError(() => shellGrid(0.01, 0.1, -0.01), /dk must be positive/);
  });

  it('negative number density and other settings', () => {
    inputError(() => new TreeBispectrumModel({ spectrum, bins, numberDensity: -1e-4 }), /numberDensity must be positive/);
    inputError(() => new TreeBispectrumModel({ spectrum, bins, velocityDispersion: -2 }), /velocityDispersion/);
    inputError(() => new TreeBispectrumModel({ spectrum, bins, multipoles: [0, 1] }), /1 is not an even/);
    inputError(() => new TreeBispectrumModel({ spectrum, bins, averaging: 'middle' as never }), /unknown bin averaging "middle"/);
    inputError(() => new TreeBispectrumModel({ spectrum }), /exactly one of bins and triangles/);
  });

  it('unknown shape names', () => {
    inputError(() => parseShapeClass('folded', 'cuts.shapes'), /cuts\.shapes: unknown shape class "folded"/);
    inputError(() => binsOfShapes(bins, ['equilateral', 'obtuse']), /unknown shape class "obtuse"/);
  });
});
