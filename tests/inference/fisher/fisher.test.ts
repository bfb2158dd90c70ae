import { readFileSync } from 'node:fs';
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { addFisher, fisherErrors, fixParameters, gaussianPriorFisher } from '../../../src/inference/fisher/fisher-algebra.js';
import { fisherMatrix, type PrecisionOperator } from '../../../src/inference/fisher/fisher-matrix.js';

const toy = JSON.parse(readFileSync(new URL('../../fixtures/numpy-fisher/linear_gaussian.json', import.meta.url), 'utf8')) as {
  A: number[][];
  m0: number[];
  C: number[][];
  fiducial: number[];
  fisher: number[][];
  marginalised: number[];
  conditional: number[];
};
const names = ['p0', 'p1', 'p2'];
const precision: PrecisionOperator = (v) => Float64Array.from(solve(new Matrix(toy.C), Matrix.columnVector(Array.from(v))).getColumn(0));
const linearModel = (p: Readonly<Record<string, number>>) =>
  Float64Array.from(toy.A.map((row, i) => toy.m0[i] + row.reduce((s, a, j) => s + a * p[names[j]], 0)));
const fiducial = Object.fromEntries(names.map((n, i) => [n, toy.fiducial[i]]));

describe('Fisher matrix', () => {
  it('reproduces the linear-Gaussian toy exactly (numpy fixture; Tegmark, Taylor & Heavens 1997 eq. 15)', () => {
    const f = fisherMatrix({ names, fiducial, model: linearModel, precision });
    expect(f.warnings).toEqual([]);
    for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) expect(f.matrix[a * 3 + b] / toy.fisher[a][b] - 1).toBeCloseTo(0, 9);
    const e = fisherErrors(f);
    for (let a = 0; a < 3; a++) {
      expect(e.marginalised[a] / toy.marginalised[a] - 1).toBeCloseTo(0, 9);
      expect(e.conditional[a] / toy.conditional[a] - 1).toBeCloseTo(0, 9);
    }
  });

  it('uses exact derivatives when given and agrees with finite differences on a linear model', () => {
    const column = (j: number) => Float64Array.from(toy.A.map((row) => row[j]));
    const f = fisherMatrix({ names, fiducial, model: linearModel, precision, exactDerivatives: { p1: column(1) } });
    expect(f.matrix[4] / toy.fisher[1][1] - 1).toBeCloseTo(0, 12);
  });

  it('warns, naming the parameter, when two step sizes disagree by more than 1%', () => {
    // m = exp(10 p) with a step of 0.1: central differences at h and h/2 differ by ~ (10h)^2/8 ~ 12%.
    const model = (p: Readonly<Record<string, number>>) => Float64Array.of(Math.exp(10 * p.x), p.y);
    const f = fisherMatrix({
      names: ['x', 'y'],
      fiducial: { x: 0, y: 1 },
      model,
      precision: (v) => Float64Array.from(v),
      steps: { x: 0.1, y: 0.01 },
    });
    expect(f.warnings.length).toBe(1);
    expect(f.warnings[0]).toMatch(/"x"/);
  });

  it('refuses a singular matrix and names the degenerate combination', () => {
    const model = (p: Readonly<Record<string, number>>) => Float64Array.of(p.a + p.b, 2 * (p.a + p.b), p.c);
    const f = fisherMatrix({ names: ['a', 'b', 'c'], fiducial: { a: 1, b: 1, c: 1 }, model, precision: (v) => Float64Array.from(v) });
    expect(() => fisherErrors(f)).toThrow(/combination.*\ba\b.*\bb\b|combination.*\bb\b.*\ba\b/);
    const g = fisherMatrix({ names: ['a', 'z'], fiducial: { a: 1, z: 1 }, model: (p) => Float64Array.of(p.a), precision: (v) => Float64Array.from(v) });
    expect(() => fisherErrors(g)).toThrow(/"z"/);
    // A derivative at rounding level (1e-14 of the signal) counts as no information.
    const r = fisherMatrix({ names: ['a', 'z'], fiducial: { a: 1, z: 1 }, model: (p) => Float64Array.of(p.a, 1 + 1e-14 * p.z), precision: (v) => Float64Array.from(v) });
    expect(r.warnings.join()).toMatch(/"z" changes the model by .* no information/);
    expect(() => fisherErrors(r)).toThrow(/do not constrain "z" at all/);
  });

  it('adds a Gaussian prior as inverse variances (1/sigma^2 = F + 1/sigma_prior^2 for one parameter)', () => {
    const f = fisherMatrix({ names: ['x'], fiducial: { x: 0 }, model: (p) => Float64Array.of(3 * p.x), precision: (v) => Float64Array.from(v) });
    const total = addFisher(f, gaussianPriorFisher({ x: 0.5 }));
    expect(fisherErrors(total).marginalised[0]).toBeCloseTo(1 / Math.sqrt(9 + 4), 12);
  });

  it('conditional errors equal the marginalised errors of the matrix with the others fixed', () => {
    const f = fisherMatrix({ names, fiducial, model: linearModel, precision });
    const sub = fixParameters(f, ['p2']);
    expect(fisherErrors(sub).marginalised[0] / toy.conditional[2] - 1).toBeCloseTo(0, 9);
  });
});
