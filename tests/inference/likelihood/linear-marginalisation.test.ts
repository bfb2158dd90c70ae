import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { choleskyFactor, solveLower } from '../../../src/data/covariance/cholesky-factor.js';
import { marginaliseGaussian, type LinearPrior } from '../../../src/inference/likelihood/linear-marginalisation.js';
import { gaussLegendreOn } from '../../../src/numerics/gauss-legendre.js';
import { DenseGaussian, randomCovariance, randomVector } from './support/dense-reference.js';
import { ToyModel, powerEntries } from './support/toy-models.js';

// Acceptance: analytic marginalisation over linear parameters (Taylor & Kitching 2010,
// MNRAS 408, 865) equals brute-force numerical integration of L(theta) pi(theta) over
// the linear parameters, to 1e-6 in log-likelihood differences.

const N = 14;
const entries = powerEntries('P0', 0.02, 0.01, N);
const cov = randomCovariance(N, 11, 0.5);
const dense = new DenseGaussian(cov, N);
const factor = choleskyFactor(cov, N);

function analytic(model: ToyModel, nonlinear: Record<string, number>, data: Float64Array, priors: LinearPrior[]) {
  const part = model.linearPart(nonlinear, model.linearParameterNames);
  const r = solveLower(factor, Float64Array.from(data, (v, i) => v - part.offset[i]));
  const cols = part.columns.map((c) => solveLower(factor, c));
  return marginaliseGaussian(r, cols, 1, priors, factor.logDet, model.linearParameterNames);
}

/** ln of int prod_j dtheta_j N(d; m(theta), C) pi(theta) on a tensor Gauss–Legendre grid. */
function bruteForce(model: ToyModel, nonlinear: Record<string, number>, data: Float64Array, priors: LinearPrior[], nodes: number): number {
  const names = model.linearParameterNames;
  const p = names.length;
  // Integration box: centre and widths from the normal equations solved by ml-matrix.
  const part = model.linearPart(nonlinear, names);
  const A = new Matrix(N, p);
  part.columns.forEach((c, j) => c.forEach((v, i) => A.set(i, j, v)));
  const F = A.transpose().mmul(dense.precision).mmul(A);
  const b = A.transpose().mmul(dense.precision).mmul(Matrix.columnVector(Array.from(data, (v, i) => v - part.offset[i])));
  priors.forEach((pr, j) => {
    if (pr.sigma !== Infinity) {
      F.set(j, j, F.get(j, j) + 1 / pr.sigma ** 2);
      b.set(j, 0, b.get(j, 0) + pr.mean / pr.sigma ** 2);
    }
  });
  const centre = solve(F, b).to1DArray();
  const width = solve(F, Matrix.eye(p, p)).diag().map((v) => 8 * Math.sqrt(v));
  const rules = centre.map((c, j) => gaussLegendreOn(nodes, c - width[j], c + width[j]));
  const logPrior = (theta: number[]) => {
    let s = 0;
    for (let j = 0; j < p; j++) {
      const pr = priors[j];
      if (pr.sigma !== Infinity) s -= 0.5 * ((theta[j] - pr.mean) / pr.sigma) ** 2 + Math.log(pr.sigma * Math.sqrt(2 * Math.PI));
    }
    return s;
  };
  // Log-sum-exp over the grid, shifted by the value at the centre.
  // The model at theta from model.evaluate alone: the base at theta = 0 plus the
  // response to each unit theta_j (exact for a model linear in theta).
  const zero = Object.fromEntries(names.map((n) => [n, 0]));
  const base = model.evaluate({ ...nonlinear, ...zero });
  const unit = names.map((n) => model.evaluate({ ...nonlinear, ...zero, [n]: 1 }).map((v, i) => v - base[i]));
  const m = new Float64Array(N);
  const at = (theta: number[]) => {
    for (let i = 0; i < N; i++) {
      let v = base[i];
      for (let j = 0; j < p; j++) v += theta[j] * unit[j][i];
      m[i] = v;
    }
    return dense.logDensityFast(data, m) + logPrior(theta);
  };
  const ref = at(centre);
  let sum = 0;
  const idx = new Array(p).fill(0);
  const theta = new Array(p).fill(0);
  for (;;) {
    let w = 1;
    for (let j = 0; j < p; j++) {
      theta[j] = rules[j].nodes[idx[j]];
      w *= rules[j].weights[idx[j]];
    }
    sum += w * Math.exp(at(theta) - ref);
    let j = 0;
    while (j < p && ++idx[j] === nodes) idx[j++] = 0;
    if (j === p) break;
  }
  return ref + Math.log(sum);
}

describe('analytic marginalisation over linear parameters (Taylor & Kitching 2010)', () => {
  const truth = { amp: 1.1, tilt: 0.05 };
  const cases: { name: string; linear: string[]; priors: LinearPrior[]; nodes: number }[] = [
    { name: '2 parameters, Gaussian priors', linear: ['c0', 'c1'], priors: [{ mean: 1, sigma: 3 }, { mean: 0, sigma: 2 }], nodes: 64 },
    { name: '3 parameters, two Gaussian and one flat prior', linear: ['c0', 'c1', 'c2'], priors: [{ mean: 0.5, sigma: 4 }, { mean: 0, sigma: Infinity }, { mean: -1, sigma: 1.5 }], nodes: 48 },
  ];
  for (const c of cases) {
    it(`equals brute-force integration: ${c.name}`, () => {
      const model = new ToyModel(entries, c.linear);
      const data = model.evaluate({ ...truth, c0: 2, c1: -1, c2: 0.5 });
      const noise = randomVector(N, 5, 0.5);
      data.forEach((_, i) => (data[i] += noise[i]));
      const points = [truth, { amp: 0.9, tilt: -0.1 }, { amp: 1.3, tilt: 0.2 }];
      const exact = points.map((p) => analytic(model, p, data, c.priors).logLikelihood);
      const brute = points.map((p) => bruteForce(model, p, data, c.priors, c.nodes));
      for (let i = 1; i < points.length; i++) {
        expect(Math.abs(exact[i] - exact[0] - (brute[i] - brute[0]))).toBeLessThan(1e-6);
        // The differences are not trivially small: the test can fail.
        expect(Math.abs(exact[i] - exact[0])).toBeGreaterThan(0.1);
      }
      // The absolute values agree too (both normalised).
      exact.forEach((e, i) => expect(Math.abs(e - brute[i])).toBeLessThan(1e-6));
    });
  }

  it('returns the best fit of the marginalised parameters (normal equations solved by ml-matrix)', () => {
    const model = new ToyModel(entries, ['c0', 'c1', 'c2']);
    const data = model.evaluate({ amp: 1, tilt: 0, c0: 2, c1: -1, c2: 0.5 });
    const priors: LinearPrior[] = [{ mean: 0, sigma: 0.5 }, { mean: 0, sigma: Infinity }, { mean: 0, sigma: Infinity }];
    const res = analytic(model, { amp: 1, tilt: 0 }, data, priors);
    const part = model.linearPart({ amp: 1, tilt: 0 }, ['c0', 'c1', 'c2']);
    const A = new Matrix(N, 3);
    part.columns.forEach((col, j) => col.forEach((v, i) => A.set(i, j, v)));
    const F = A.transpose().mmul(dense.precision).mmul(A);
    F.set(0, 0, F.get(0, 0) + 1 / 0.25);
    const b = A.transpose().mmul(dense.precision).mmul(Matrix.columnVector(Array.from(data, (v, i) => v - part.offset[i])));
    const expected = solve(F, b).to1DArray();
    expected.forEach((v, j) => expect(res.bestFit[j]).toBeCloseTo(v, 9));
    // The prior N(0, 0.5) pulls c0 away from its true value 2, so the fit is not trivially the truth.
    expect(Math.abs(res.bestFit[0] - 2)).toBeGreaterThan(0.1);
    // With flat priors only, noise-free data give back the truth and chi2 = 0.
    const flat = analytic(model, { amp: 1, tilt: 0 }, data, priors.map(() => ({ mean: 0, sigma: Infinity })));
    [2, -1, 0.5].forEach((v, j) => expect(flat.bestFit[j]).toBeCloseTo(v, 8));
    expect(flat.chi2).toBeLessThan(1e-12);
  });
});
