/**
 * Acceptance check (issue 9): Gaussian fields. Over R realisations of a
 * Gaussian field with the linear power of the fiducial cosmology plus white
 * noise, compare (a) the mean P_l with the input, (b) the mean B_0 with zero
 * and (c) the scatter of P_l and B_0 with the analytic Gaussian covariance of
 * src/data/covariance (lattice mode counts for P, measured triangle counts for B).
 *
 *   npx tsx scripts/mocks-gaussian-covariance.ts [--realisations 60] [--n 64] [--box 1000] [--b1 1] [--f 0]
 * Prints a JSON summary (recorded in docs/mocks-validation.md).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fundamentalFrequency, latticeShell } from '../src/numerics/lattice-shell.js';
import { legendre } from '../src/numerics/legendre.js';
import { addGaussianBispectrumVariance } from '../src/data/covariance/gaussian-bispectrum-variance.js';
import { addGaussianPowerCovariance } from '../src/data/covariance/gaussian-power-covariance.js';
import type { MeasuredEntry } from '../src/data/data-vector.js';
import { loadMeasurementBundle } from '../src/data/measurement-bundle.js';
import { writeMeasurementBundle } from '../src/data/write-measurement-bundle.js';
import { boxBundle, bispectrumColumns, measureBox, planGeometry, powerColumns, type BoxMeasurement, type BoxMeasurementPlan } from '../src/mocks/box-measurement.js';
import { gaussianFieldSpectrum } from '../src/mocks/gaussian-field.js';
import { linearGalaxySpectrum } from '../src/mocks/linear-galaxy-field.js';
import { addWhiteNoise } from '../src/mocks/stochastic-field.js';
import { argValue, columnMoments, FIDUCIAL, fiducialSpectrum } from './mocks-setup.js';

const realisations = argValue('realisations', 60);
const n = argValue('n', 64);
const boxSize = argValue('box', 1000);
const b1 = argValue('b1', 1);
const f = argValue('f', 0);
const nbar = argValue('nbar', 5e-4);
const redshift = 0.5;
const spectrum = fiducialSpectrum(redshift);
const kf = fundamentalFrequency(boxSize);
const mesh = { n, boxSize };
const plan: BoxMeasurementPlan = { mesh, power: { kMin: 2 * kf, kMax: 0.15, dk: 2 * kf }, bispectrum: { kMin: 2 * kf, kMax: 0.1, dk: 2 * kf }, shotNoise: 1 / nbar };
const geometry = planGeometry(plan);

/** Data-vector values of a measurement: P0, P2, P4 over k, then B0, B2 over the triangle bins (src/data/data-vector.ts). */
function dataVectorOf(m: BoxMeasurement): Float64Array {
  const parts = [powerColumns(m), bispectrumColumns(m)].flatMap((c) => (c ? c.values.map((v) => Array.from(v)) : []));
  return Float64Array.from(parts.flat());
}

const t0 = Date.now();
const rows: Float64Array[] = [];
let entries: readonly MeasuredEntry[] = [];
const folder = mkdtempSync(join(tmpdir(), 'treble-gauss-'));
for (let r = 0; r < realisations; r++) {
  const lin = gaussianFieldSpectrum(mesh, (k) => spectrum.power(k), 1000 + r);
  const field = addWhiteNoise(linearGalaxySpectrum(lin, mesh, b1, f), mesh, 1 / nbar, 50_000 + r);
  const m = measureBox(field, plan, geometry);
  rows.push(dataVectorOf(m));
  if (r === 0) {
    // The entries (bins, counts, order) as the likelihood reads them from a bundle.
    writeMeasurementBundle(folder, boxBundle(m, { redshift, numberDensity: nbar, fiducialCosmology: FIDUCIAL }));
    const dv = loadMeasurementBundle(folder).dataVector;
    if (dv.values.some((v, i) => v !== rows[0][i])) throw new Error('data-vector order differs from the bundle reader');
    entries = dv.entries;
  }
  if (r % 10 === 9) process.stderr.write(`${r + 1} realisations, ${((Date.now() - t0) / 1000).toFixed(0)} s\n`);
}
rmSync(folder, { recursive: true, force: true });

const { mean, variance } = columnMoments(rows);
const size = entries.length;
// Expected P_l: (2l+1) < (b1 + f mu^2)^2 P(k) L_l(mu) > over the lattice modes of each shell (the
// estimator's own average; on a lattice P_4 of an isotropic field is not zero at low k).
// The B variance uses the Kaiser monopole (Kaiser 1987, MNRAS 227, 1) b1^2 + 2 b1 f / 3 + f^2 / 5.
const kaiser0 = b1 * b1 + (2 * b1 * f) / 3 + (f * f) / 5;
const theory = Float64Array.from(entries, (e) => {
  if (e.statistic !== 'P') return 0;
  const shell = latticeShell(boxSize, e.k[0] - plan.power.dk / 2, e.k[0] + plan.power.dk / 2);
  let sum = 0;
  for (let v = 0; v < shell.count; v++) {
    const mu = shell.vectors[3 * v + 2] / Math.sqrt(shell.normSquared[v]);
    sum += (b1 + f * mu * mu) ** 2 * spectrum.power(kf * Math.sqrt(shell.normSquared[v])) * legendre(e.ell, mu);
  }
  return ((2 * e.ell + 1) * sum) / shell.count;
});
const cov = new Float64Array(size * size);
addGaussianPowerCovariance({ entries, theory, shotNoise: 1 / nbar, dk: plan.power.dk, volume: boxSize ** 3, boxSize, modeCounts: 'lattice' }, cov);
addGaussianBispectrumVariance(
  { entries, monopoleAt: (k) => kaiser0 * spectrum.power(k), shotNoise: 1 / nbar, dk: 2 * kf, volume: boxSize ** 3, boxSize, triangleCounts: 'measured' },
  cov,
);

const blocks = ['P0', 'P2', 'P4', 'B0', 'B2'];
const summary: Record<string, unknown> = {};
for (const block of blocks) {
  const idx = entries.map((e, i) => (e.block === block ? i : -1)).filter((i) => i >= 0);
  const ratios = idx.map((i) => variance[i] / cov[i * size + i]);
  const meanRatio = ratios.reduce((a, v) => a + v, 0) / ratios.length;
  // Mean over realisations against its expectation, in units of its standard error.
  const pulls = idx.map((i) => (mean[i] - theory[i]) / Math.sqrt(cov[i * size + i] / realisations));
  const chi2 = pulls.reduce((a, v) => a + v * v, 0);
  summary[block] = {
    bins: idx.length,
    meanVarianceRatio: meanRatio,
    // each ratio scatters by sqrt(2/(R-1)) for Gaussian data; the mean over independent bins by that / sqrt(bins)
    expectedScatterOfMeanRatio: Math.sqrt(2 / (realisations - 1) / idx.length),
    ratioQuartiles: [0.25, 0.5, 0.75].map((q) => ratios.slice().sort((a, b) => a - b)[Math.floor(q * (ratios.length - 1))]),
    meanVsInputChi2PerBin: chi2 / idx.length,
  };
}
console.log(JSON.stringify({ realisations, mesh, b1, f, nbar, redshift, seconds: (Date.now() - t0) / 1000, summary }, null, 2));
