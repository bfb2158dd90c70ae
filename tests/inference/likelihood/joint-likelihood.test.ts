import { describe, expect, it } from 'vitest';
import { prepareCovariance } from '../../../src/data/covariance/covariance-choice.js';
import { loadMeasurementBundle } from '../../../src/data/measurement-bundle.js';
import { selectData, selectMatrix, selectVector, type ScaleCuts } from '../../../src/data/scale-cuts.js';
import { chiSquarePValue } from '../../../src/inference/likelihood/chi-square-tail.js';
import { JointLikelihood } from '../../../src/inference/likelihood/joint-likelihood.js';
import { sellentinHeavensLogLikelihood } from '../../../src/inference/likelihood/linear-marginalisation.js';
import { fixedModelSource } from '../../../src/inference/likelihood/model-source.js';
import { ParameterSpace, type ParameterSpecs } from '../../../src/inference/parameters/parameter-space.js';
import { baseBundle, withMocks, writeBundle } from '../../data/support/write-bundle.js';
import { DenseGaussian, randomCovariance } from './support/dense-reference.js';
import { ToyModel } from './support/toy-models.js';

// A bundle of 20 entries (P0, P2 on 5 k bins; B0 on 10 triangles) with a random
// covariance matrix file, modelled by test-support toy models.
const files = withMocks(baseBundle(), 60);
const N = 20;
const cov = randomCovariance(N, 77, 1e3);
const bundle0 = loadMeasurementBundle(writeBundle(files));
const header = bundle0.dataVector.entries.map((e, i) => `${e.block}_${i}`).join(',');
const rows = Array.from({ length: N }, (_, i) => Array.from(cov.subarray(i * N, (i + 1) * N)).join(','));
files.files['covariance.csv'] = [header, ...rows].join('\n') + '\n';
files.metadata = { ...files.metadata, covarianceMatrix: 'covariance.csv' };
const dir = writeBundle(files);
const bundle = loadMeasurementBundle(dir);
const entries = bundle.dataVector.entries;
const models = [new ToyModel(entries.slice(0, 10), ['c0', 'c1']), new ToyModel(entries.slice(10), ['s0'], 'b')];

const specs = (marginalise: boolean): ParameterSpecs => ({
  amp: { prior: { kind: 'uniform', min: 0, max: 3 } },
  tilt: { value: 0 },
  bamp: { prior: { kind: 'gaussian', mean: 1, sigma: 1 } },
  btilt: { value: 0.1 },
  ...(marginalise
    ? { c0: { prior: { kind: 'gaussian', mean: 0, sigma: 100 }, marginalise: true }, c1: { prior: { kind: 'flat' }, marginalise: true }, s0: { prior: { kind: 'flat' }, marginalise: true } }
    : { c0: { value: 3 }, c1: { value: -2 }, s0: { value: 5 } }),
});

function likelihood(marginalise: boolean, covariance: Parameters<typeof prepareCovariance>[0], cuts: ScaleCuts = {}): JointLikelihood {
  const parameters = new ParameterSpace(specs(marginalise));
  const selection = selectData(entries, cuts);
  const prepared = prepareCovariance(covariance, { bundle, selection, freeParameters: parameters.dimension });
  return new JointLikelihood({ bundle, selection, covariance: prepared, parameters, models: fixedModelSource(models) });
}

function fullModel(theta: number[]): Float64Array {
  const v = { amp: theta[0], tilt: 0, bamp: theta[1], btilt: 0.1, c0: 3, c1: -2, s0: 5 };
  return Float64Array.from([...models[0].evaluate(v), ...models[1].evaluate(v)]);
}

describe('joint likelihood', () => {
  const cuts: ScaleCuts = { limits: { P2: { kMax: 0.04 }, B: { kMax: 0.05 } } };

  it('cuts data, model and covariance alike before factorising (dense ml-matrix reference)', () => {
    const L = likelihood(false, { source: 'matrix' }, cuts);
    const sel = selectData(entries, cuts);
    expect(L.size).toBe(sel.indices.length);
    expect(L.size).toBe(5 + 3 + 4);
    const dense = new DenseGaussian(selectMatrix(cov, N, sel.indices), sel.indices.length);
    const theta = [1.2, 0.8];
    const expected = dense.logDensity(selectVector(bundle.dataVector.values, sel.indices), selectVector(fullModel(theta), sel.indices));
    // The toy model is far from the data (chi2 ~ 1e12), so compare relatively.
    expect(L.logLikelihoodAt(L.parameters.values(Float64Array.from(theta))) / expected - 1).toBeCloseTo(0, 12);
  });

  it('applies the Hartlap factor to the precision and normalises with det(C/h)', () => {
    const L = likelihood(false, { source: 'mocks', treatment: 'hartlap' });
    const h = (60 - 20 - 2) / 59;
    const dense = new DenseGaussian(Float64Array.from(L.covariance.matrix, (v) => v / h), N);
    const theta = [1.1, 0.9];
    expect(L.logLikelihoodAt(L.parameters.values(Float64Array.from(theta)))).toBeCloseTo(dense.logDensity(bundle.dataVector.values, fullModel(theta)), 8);
  });

  it('uses the Sellentin–Heavens likelihood with the raw sample covariance', () => {
    const L = likelihood(false, { source: 'mocks', treatment: 't-distribution' });
    const dense = new DenseGaussian(L.covariance.matrix, N);
    const theta = [1.1, 0.9];
    const chi2 = dense.chi2(bundle.dataVector.values, fullModel(theta));
    expect(L.logLikelihoodAt(L.parameters.values(Float64Array.from(theta)))).toBeCloseTo(sellentinHeavensLogLikelihood(chi2, dense.logDet, N, 60), 8);
  });

  it('reports chi-square, degrees of freedom, p-value and the best-fit marginalised parameters at any point', () => {
    const L = likelihood(true, { source: 'matrix' });
    const p = L.pointAt(Float64Array.from([1.2, 0.8]), { bestFit: true });
    expect(p.dof).toBe(N - 2 - 3);
    expect(p.pValue).toBeCloseTo(chiSquarePValue(p.chi2, p.dof), 14);
    expect(Object.keys(p.marginalised ?? {})).toEqual(['c0', 'c1', 's0']);
    // Fixing the marginalised parameters at their best fit gives the reported chi-square.
    const fixed = new ParameterSpace({ ...specs(false), c0: { value: p.marginalised!.c0 }, c1: { value: p.marginalised!.c1 }, s0: { value: p.marginalised!.s0 } });
    const selection = selectData(entries);
    const at = new JointLikelihood({ bundle, selection, covariance: L.covariance, parameters: fixed, models: fixedModelSource(models) }).pointAt(Float64Array.from([1.2, 0.8]));
    expect(at.chi2 / p.chi2 - 1).toBeCloseTo(0, 12);
    expect(p.logPosterior).toBeCloseTo(p.logPrior + p.logLikelihood, 12);
    expect(p.values).toMatchObject({ amp: 1.2, bamp: 0.8, tilt: 0 });
  });

  it('is -Infinity outside the prior and prints its choices', () => {
    const L = likelihood(true, { source: 'matrix' }, cuts);
    expect(L.logPosterior(Float64Array.from([4, 1]))).toBe(-Infinity);
    expect(Number.isFinite(L.logPosterior(Float64Array.from([1, 1])))).toBe(true);
    const d = L.describe();
    expect(d.blocks).toBe('P0 5/5, P2 3/5, B0 4/10');
    expect(d.covariance).toMatch(/matrix file \(file = covariance\.csv; entries = 12\)/);
    expect(d.marginalised).toBe('c0 (N(0, 100)), c1 (flat), s0 (flat)');
  });

  it('refuses Gaussian priors on marginalised parameters with the t-distribution, and unconstrained flat ones', () => {
    const parameters = new ParameterSpace(specs(true));
    const selection = selectData(entries);
    const t = prepareCovariance({ source: 'mocks', treatment: 't-distribution' }, { bundle, selection, freeParameters: 2 });
    expect(() => new JointLikelihood({ bundle, selection, covariance: t, parameters, models: fixedModelSource(models) })).toThrow(/t-distribution likelihood, analytically marginalised parameters must have flat priors/);
    // Only B0 kept: the P-only parameters c0, c1 have no data; c1's flat prior leaves it unconstrained.
    const onlyB = selectData(entries, { blocks: ['B0'] });
    const m = prepareCovariance({ source: 'matrix' }, { bundle, selection: onlyB, freeParameters: 2 });
    const L = new JointLikelihood({ bundle, selection: onlyB, covariance: m, parameters, models: fixedModelSource(models) });
    expect(() => L.logLikelihoodAt(parameters.values(Float64Array.from([1, 1])))).toThrow(/do not constrain the analytically marginalised parameters c0, c1, s0/);
  });

  it('refuses a covariance file that is not positive definite or holds NaN, with the smallest eigenvalue or the cell', () => {
    const bad = { ...files, files: { ...files.files } };
    const broken = Float64Array.from(cov);
    broken[3 * N + 3] = -5;
    bad.files['covariance.csv'] = [header, ...Array.from({ length: N }, (_, i) => Array.from(broken.subarray(i * N, (i + 1) * N)).join(','))].join('\n');
    const b = loadMeasurementBundle(writeBundle(bad));
    const selection = selectData(b.dataVector.entries);
    const parameters = new ParameterSpace(specs(false));
    const c = prepareCovariance({ source: 'matrix' }, { bundle: b, selection, freeParameters: 2 });
    expect(() => new JointLikelihood({ bundle: b, selection, covariance: c, parameters, models: fixedModelSource(models) })).toThrow(
      /covariance \(matrix file\) is not positive definite: smallest eigenvalue -\d/,
    );
    bad.files['covariance.csv'] = bad.files['covariance.csv'].replace(/\n([^,\n]+),/, '\nNaN,');
    const withNaN = loadMeasurementBundle(writeBundle(bad));
    expect(() => prepareCovariance({ source: 'matrix' }, { bundle: withNaN, selection, freeParameters: 2 })).toThrow(/covariance\.csv:2: column 1 \(P0_0\) is not a finite number: 'NaN'/);
  });

  it('refuses models whose entries do not match the data vector', () => {
    const parameters = new ParameterSpace(specs(false));
    const selection = selectData(entries);
    const c = prepareCovariance({ source: 'matrix' }, { bundle, selection, freeParameters: 2 });
    const swapped = [models[1], models[0]];
    const L = new JointLikelihood({ bundle, selection, covariance: c, parameters, models: fixedModelSource(swapped) });
    expect(() => L.logLikelihoodAt(parameters.values(Float64Array.from([1, 1])))).toThrow(/model 1, entry 1 is B0 at k = 0\.03, 0\.03, 0\.03 but data-vector entry 1 is P0/);
  });
});
