import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { enumerateTriangleBins, shellGrid } from '../../../src/bispectrum/triangle-bins.js';
import { TreeBispectrumModel } from '../../../src/bispectrum/tree-bispectrum-model.js';
import { backgroundOf } from '../../../src/cosmology/background.js';
import { PLANCK_2018, validateCosmology } from '../../../src/cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology } from '../../../src/cosmology/linear-power-from-cosmology.js';
import { binVolumeTriangleCount, continuousModeCount } from '../../../src/data/index.js';
import { writeMeasurementBundle } from '../../../src/data/write-measurement-bundle.js';
import { createJointLikelihood, createJointLogPosterior, readJointLikelihoodOptions } from '../../../src/inference/likelihood/joint-likelihood-options.js';
import { scaledSpectrum } from '../../../src/inference/likelihood/model-source.js';
import { loadLogPosterior } from '../../../src/inference/sampling/load-log-posterior.js';
import { normalizeLogPosteriorReference } from '../../../src/inference/sampling/log-posterior-reference.js';
import { PowerMultipoleModel } from '../../../src/power/power-multipole-model.js';

// The likelihood with the project's own power and bispectrum models on a bundle
// whose "measurement" is those models at known parameters: a self-consistency
// check of the wiring (entries, cuts, marginalisation, cosmology modes), not physics.
const z = 0.5;
const nbar = 4e-4;
const box = 1500;
const fiducialCosmology = { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044, mNu: 0.06, massiveNuCount: 1 };
const spectrum = linearPowerFromCosmology(PLANCK_2018, z);
const f = spectrum.growthRateLargeScale;
const truth = { b1: 1.9, f, b2: 0.4, bG2: -0.2, pCt0: 3, pStochConst: 1.1, bispShotPower: 0.9, bispShotConst: 1.2 };
const pBins = { kMin: 0.02, dk: 0.01, count: 10 };
const grid = shellGrid(0.03, 0.09, 0.02);
const bins = enumerateTriangleBins(grid);

const dir = mkdtempSync(join(tmpdir(), 'treble-fit-'));
{
  const p = new PowerMultipoleModel({ spectrum, bins: pBins, nbar, multipoles: [0, 2] }).evaluate(truth);
  const b = new TreeBispectrumModel({ spectrum, bins, multipoles: [0], numberDensity: nbar, averaging: 'centres' }).evaluate(truth);
  const centres = Array.from({ length: pBins.count }, (_, i) => pBins.kMin + i * pBins.dk);
  writeMeasurementBundle(dir, {
    redshift: z,
    numberDensity: nbar,
    lineOfSight: 'z-axis',
    boxSize: box,
    fiducialCosmology,
    power: { centres, effective: centres, counts: centres.map((c) => continuousModeCount(c, pBins.dk, box ** 3)), dk: pBins.dk, multipoles: [0, 2], values: [p.slice(0, 10), p.slice(10)] },
    bispectrum: {
      centres: bins.centres,
      effective: bins.centres,
      counts: Array.from({ length: bins.size }, (_, t) => binVolumeTriangleCount(Array.from(bins.centres.subarray(3 * t, 3 * t + 3)), grid.dk, (2 * Math.PI) / box)),
      dk: grid.dk,
      multipoles: [0],
      values: [b],
    },
  });
}

const marginalised = {
  pCt0: { prior: { kind: 'flat' }, marginalise: true },
  pStochConst: { prior: { kind: 'flat' }, marginalise: true },
  b2: { prior: { kind: 'flat' }, marginalise: true },
  bG2: { prior: { kind: 'flat' }, marginalise: true },
  bispShotPower: { prior: { kind: 'flat' }, marginalise: true },
  bispShotConst: { prior: { kind: 'flat' }, marginalise: true },
};

const templateOptions = {
  bundle: dir,
  covariance: { source: 'gaussian' },
  cosmology: { mode: 'fixed-template' },
  models: { bispectrum: { averaging: 'centres' } },
  parameters: {
    b1: { prior: { kind: 'uniform', min: 1, max: 3 }, start: 1.9 },
    fsigma8: { prior: { kind: 'uniform', min: 0.1, max: 1 }, start: 0.45 },
    alphaPar: { value: 1 },
    alphaPerp: { value: 1 },
    templateAmplitude: { value: 1 },
    fsigma8Check: { derived: 'f * sigma8Cold' },
    ...marginalised,
  },
};

describe('likelihood with the power and bispectrum models on a bundle', () => {
  const L = createJointLikelihood(templateOptions);
  const fs8 = f * spectrum.sigma8;

  it('recovers the marginalised parameters and chi2 = 0 at the parameters that made the data (fixed-template mode)', () => {
    const p = L.pointAt(Float64Array.from([1.9, fs8]), { bestFit: true });
    expect(p.chi2).toBeLessThan(1e-6);
    expect(Object.keys(p.marginalised ?? {})).toHaveLength(6);
    for (const [name, v] of Object.entries(p.marginalised ?? {})) expect(v).toBeCloseTo(truth[name as keyof typeof truth], 6);
    expect(p.values.f).toBeCloseTo(f, 12);
    expect(p.values.fsigma8Check).toBeCloseTo(fs8, 12);
    expect(p.dof).toBe(L.size - 2 - 6);
    // The posterior falls away from the truth in b1 and fsigma8.
    const at = (b1: number, s: number) => L.logPosterior(Float64Array.from([b1, s]));
    expect(at(1.9, fs8)).toBeGreaterThan(at(2.2, fs8) + 1);
    expect(at(1.9, fs8)).toBeGreaterThan(at(1.9, fs8 * 1.15) + 1);
  });

  it('gives the sampler the same log-posterior from its JSON options, also through its module reference', async () => {
    const logPost = createJointLogPosterior(JSON.parse(JSON.stringify(templateOptions)));
    const theta = Float64Array.from([2.1, 0.4]);
    expect(logPost(theta)).toBe(L.logPosterior(theta));
    const ref = normalizeLogPosteriorReference({ module: new URL('../../../src/inference/likelihood/joint-likelihood-options.ts', import.meta.url).href, exportName: 'createJointLogPosterior', options: templateOptions });
    const loaded = await loadLogPosterior(ref);
    expect(loaded(theta)).toBe(L.logPosterior(theta));
  });

  it('full mode: AP dilations from the bundle fiducial cosmology, 1 at the fiducial itself', () => {
    const full = createJointLikelihood({
      ...templateOptions,
      cosmology: { mode: 'full' },
      parameters: {
        h: { prior: { kind: 'uniform', min: 0.6, max: 0.75 }, start: 0.6736 },
        omegaB: { value: 0.02237 },
        omegaCdm: { value: 0.12 },
        ns: { value: 0.9649 },
        lnAs: { value: 3.044 },
        mNu: { value: 0.06 },
        massiveNuCount: { value: 1 },
        b1: { prior: { kind: 'uniform', min: 1, max: 3 }, start: 1.9 },
        omegaMatterCheck: { derived: 'omegaMatter' },
        ...marginalised,
      },
    });
    const at = full.pointAt(Float64Array.from([0.6736, 1.9]), { bestFit: true });
    // Provided quantities from the cosmology code (Planck 2018 sigma8 = 0.811, from memory, within a few percent).
    expect(at.values.omegaMatter).toBeCloseTo((0.02237 + 0.12 + 0.06 / 93.14) / 0.6736 ** 2, 3);
    expect(Math.abs(at.values.sigma8Today / 0.811 - 1)).toBeLessThan(0.05);
    expect(at.values.omegaMatterCheck).toBe(at.values.omegaMatter);
    expect(at.values.alphaPar).toBe(1);
    expect(at.values.alphaPerp).toBe(1);
    expect(at.chi2).toBeLessThan(1e-6);
    const other = full.pointAt(Float64Array.from([0.7, 1.9]));
    // alphaPar = E_fid(z) / E(z), alphaPerp = D_M(z) / D_M,fid(z) (common practice).
    const bg = backgroundOf(validateCosmology({ ...fiducialCosmology, h: 0.7 }));
    const fid = backgroundOf(validateCosmology(fiducialCosmology));
    expect(other.values.alphaPar).toBeCloseTo(fid.e(z) / bg.e(z), 12);
    expect(other.values.alphaPerp).toBeCloseTo(bg.transverseDistance(z) / fid.transverseDistance(z), 12);
    expect(other.values.alphaPar).not.toBeCloseTo(1, 3);
    expect(other.chi2).toBeGreaterThan(1);
    // An h outside the cosmology code's range is refused by the posterior, not thrown.
    expect(full.logPosterior(Float64Array.from([0.3, 1.9]))).toBe(-Infinity);
  });

  it('fixed-template amplitude: the template power scales by q^2 and sigma8Cold by q', () => {
    const free = createJointLikelihood({
      ...templateOptions,
      parameters: { ...templateOptions.parameters, templateAmplitude: { prior: { kind: 'uniform', min: 0.8, max: 1.2 }, start: 1 } },
    });
    const at1 = free.pointAt(Float64Array.from([1.9, fs8, 1]));
    const at2 = free.pointAt(Float64Array.from([1.9, fs8, 1.05]));
    expect(at1.chi2).toBeLessThan(1e-6);
    expect(at2.chi2).toBeGreaterThan(1);
    expect(at2.values.sigma8Cold).toBeCloseTo(1.05 * spectrum.sigma8, 12);
    expect(at2.values.f).toBeCloseTo(f / 1.05, 12);
    const q = scaledSpectrum(spectrum, 1.05);
    expect(q.power(0.1) / spectrum.power(0.1)).toBeCloseTo(1.1025, 12);
    expect(q.powerNoWiggle(0.1) / spectrum.powerNoWiggle(0.1)).toBeCloseTo(1.1025, 12);
    expect(q.sigma2BAO / spectrum.sigma2BAO).toBeCloseTo(1.1025, 12);
  });

  it('reads its options from a JSON file with the bundle path relative to it, and gives residuals at a point', () => {
    const file = join(dir, 'fit.json');
    writeFileSync(file, JSON.stringify({ ...templateOptions, bundle: '.' }));
    const fromFile = createJointLikelihood(readJointLikelihoodOptions(file));
    const theta = Float64Array.from([1.9, fs8]);
    expect(fromFile.logPosterior(theta)).toBe(L.logPosterior(theta));
    const r = fromFile.residualsAt(theta);
    expect(r.entries).toHaveLength(L.size);
    r.data.forEach((d, i) => expect(Math.abs(d - r.model[i])).toBeLessThan(1e-6 * r.sigma[i]));
    expect(() => readJointLikelihoodOptions(join(dir, 'missing.json'))).toThrow(/missing\.json: cannot read the likelihood options/);
  });

  it('refuses a configuration missing the template parameters', () => {
    const { alphaPar: _drop, ...rest } = templateOptions.parameters;
    expect(() => createJointLikelihood({ ...templateOptions, parameters: rest })).toThrow(/the fixed-template cosmology mode needs alphaPar declared/);
  });
});
