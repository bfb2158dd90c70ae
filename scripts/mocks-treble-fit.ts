/**
 * Acceptance check (issue 9) through treble's own fitting engine: the mean
 * B_0 and B_2 of R second-order redshift-space mocks (the setup of
 * scripts/mocks-second-order.ts: src/mocks/second-order-field.ts plus Gaussian
 * white noise) is written as a measurement bundle, with the covariance of the
 * mean, and fitted with a run config through `findBestFit` (treble peak) and
 * `runJointFit` (treble fit): fixed template = the mocks' cosmology,
 * alphaPar = alphaPerp = templateAmplitude = 1, exact discrete-box bin
 * averaging, b1, b2, bG2 sampled, fsigma8 fixed to the truth or sampled.
 *
 * Covariance (--covariance): "diagonal" (default), the diagonal of the sample
 * covariance of the realisations divided by R (the error of the mean), as in
 * the Gauss–Newton fit of scripts/mocks-second-order.ts; the full sample
 * covariance of the 142 entries is singular for R <= 142. "full" (needs
 * R > 144): the full sample covariance / R, divided by the Hartlap factor
 * (R - N - 2)/(R - 1) (Hartlap, Simon & Schneider 2007, eq. 17), so that its
 * inverse is the unbiased precision of the mean.
 *
 * Stochastic terms: Gaussian white noise adds nothing to the mean bispectrum
 * (docs/conventions.md, "Mocks"), so bispShotPower = bispShotConst = 0; no IR
 * resummation (the mocks' linear field has the raw linear power); no
 * velocity dispersion. No power spectrum in the bundle (P is kept out of the fit).
 *
 * --subtract-cubic: in each realisation the bispectrum of the quadratic part
 * alone, B[delta2, delta2, delta2] (one-loop in size, absent from the tree
 * model; scripts/mocks-cubic-term.ts), is measured and subtracted from that
 * realisation's B0, B2 before the mean and the covariance are formed, as in
 * scripts/mocks-second-order.ts --subtract-cubic 1. The measured terms are
 * kept in out/cubic.json; out/rows.json (the raw rows) is shared with a run
 * without the option if copied over.
 *
 *   npx tsx scripts/mocks-treble-fit.ts [--z 2] [--realisations 50] [--n 64] [--box 1000] [--kmax 0.1] [--covariance diagonal|full]
 *       [--subtract-cubic]
 *       [--walkers 24] [--steps 1500] [--workers 2] [--out .treble-tmp/mocks-treble-fit]
 * Prints a JSON summary (recorded in docs/mocks-validation.md).
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { findBestFit, readRunConfig, runJointFit, writeMeasurementBundle } from '../src/index.js';
import { fundamentalFrequency } from '../src/numerics/lattice-shell.js';
import { bispectrumColumns, measureBox, planGeometry, type BoxMeasurementPlan } from '../src/mocks/box-measurement.js';
import { gaussianFieldSpectrum } from '../src/mocks/gaussian-field.js';
import { secondOrderGalaxySpectrum } from '../src/mocks/second-order-field.js';
import { addWhiteNoise } from '../src/mocks/stochastic-field.js';
import { measureQuadraticPart } from './mocks-cubic-term.js';
import { argValue, columnMoments, fiducialSpectrum, FIDUCIAL } from './mocks-setup.js';

const realisations = argValue('realisations', 50);
const n = argValue('n', 64);
const boxSize = argValue('box', 1000);
const redshift = argValue('z', 2);
const kMax = argValue('kmax', 0.1);
const nbar = argValue('nbar', 1e-3);
const walkers = argValue('walkers', 24);
const maxSteps = argValue('steps', 1500);
const workers = argValue('workers', 2);
const textArg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : fallback;
};
const covarianceKind = textArg('covariance', 'diagonal');
if (covarianceKind !== 'diagonal' && covarianceKind !== 'full') throw new Error(`--covariance must be diagonal or full, got ${covarianceKind}`);
const cubicFlag = process.argv.indexOf('--subtract-cubic');
const subtractCubic = cubicFlag >= 0 && process.argv[cubicFlag + 1] !== '0';
const out = resolve(textArg('out', '.treble-tmp/mocks-treble-fit'), `z${redshift}-R${realisations}-n${n}-${covarianceKind}${subtractCubic ? '-subcubic' : ''}`);

const spectrum = fiducialSpectrum(redshift);
const b1True = argValue('b1', 2);
// Local-Lagrangian tidal bias bG2 = -2/7 (b1 - 1) (common practice), as in scripts/mocks-second-order.ts.
const truth = { b1: b1True, b2: argValue('b2', 0.5), bG2: (-2 / 7) * (b1True - 1), f: spectrum.growthRateLargeScale };
const fsigma8True = truth.f * spectrum.sigma8;
const kf = fundamentalFrequency(boxSize);
const mesh = { n, boxSize };
const plan: BoxMeasurementPlan = { mesh, power: { kMin: 2 * kf, kMax: 0.1, dk: 2 * kf }, bispectrum: { kMin: 2 * kf, kMax, dk: 2 * kf }, shotNoise: 1 / nbar };

mkdirSync(out, { recursive: true });
const seconds = (t: number) => Math.round((Date.now() - t) / 100) / 10;
const times: Record<string, number> = {};

// 1. Realisations (same seeds as scripts/mocks-second-order.ts), kept in out/rows.json so a rerun skips them;
// with --subtract-cubic the measured B[delta2, delta2, delta2] of each realisation is kept in out/cubic.json.
const rowsFile = join(out, 'rows.json');
const cubicFile = join(out, 'cubic.json');
let t = Date.now();
let columns: ReturnType<typeof bispectrumColumns>;
let rows: Float64Array[] | undefined;
let cubic: Float64Array[] | undefined;
const toRow = (c: NonNullable<ReturnType<typeof bispectrumColumns>>) => Float64Array.from([...Array.from(c.values[0]), ...Array.from(c.values[1])]);
if (existsSync(rowsFile)) {
  const saved = JSON.parse(readFileSync(rowsFile, 'utf8'));
  columns = saved.columns;
  rows = saved.rows.map((r: number[]) => Float64Array.from(r));
}
if (subtractCubic && existsSync(cubicFile)) cubic = JSON.parse(readFileSync(cubicFile, 'utf8')).rows.map((r: number[]) => Float64Array.from(r));
const needRows = rows === undefined;
const needCubic = subtractCubic && cubic === undefined;
if (needRows || needCubic) {
  const geometry = planGeometry(plan);
  const newRows: Float64Array[] = [];
  const newCubic: Float64Array[] = [];
  for (let r = 0; r < realisations; r++) {
    const lin = gaussianFieldSpectrum(mesh, (k) => spectrum.power(k), 7000 + r);
    const second = secondOrderGalaxySpectrum(lin, mesh, truth);
    if (needCubic) {
      const c = bispectrumColumns(measureQuadraticPart(lin, second, truth, plan, geometry));
      if (!c) throw new Error('no bispectrum of the quadratic part measured');
      newCubic.push(toRow(c));
    }
    if (needRows) {
      columns = bispectrumColumns(measureBox(addWhiteNoise(second, mesh, 1 / nbar, 90_000 + r), plan, geometry));
      if (!columns) throw new Error('no bispectrum measured');
      newRows.push(toRow(columns));
    }
    if (r % 10 === 9) process.stderr.write(`${r + 1} realisations, ${seconds(t)} s\n`);
  }
  if (needRows) {
    rows = newRows;
    writeFileSync(rowsFile, JSON.stringify({ columns: { ...columns!, centres: Array.from(columns!.centres), effective: Array.from(columns!.effective), counts: Array.from(columns!.counts) }, rows: rows.map((r) => Array.from(r)) }));
  }
  if (needCubic) {
    cubic = newCubic;
    writeFileSync(cubicFile, JSON.stringify({ about: 'B0, B2 of the quadratic part delta2 of each realisation (same bins as rows.json)', rows: cubic.map((r) => Array.from(r)) }));
  }
}
if (!rows) throw new Error('no realisations');
if (rows.length !== realisations) throw new Error(`${rowsFile} holds ${rows.length} realisations, asked for ${realisations}`);
let meanCubic: Float64Array | undefined;
if (subtractCubic) {
  if (!cubic || cubic.length !== rows.length || cubic[0].length !== rows[0].length) throw new Error(`${cubicFile} does not match ${rowsFile}`);
  meanCubic = columnMoments(cubic).mean;
  rows = rows.map((row, r) => row.map((v, i) => v - cubic![r][i]));
}
times.mocks = seconds(t);
if (!columns) throw new Error('no bispectrum columns');
const nBins = columns.counts.length;

// 2. Bundle of the mean with the (diagonal) covariance of the mean.
const { mean, variance } = columnMoments(rows);
const size = mean.length;
const R = rows.length;
const matrix = new Float64Array(size * size);
let hartlap = 1;
if (covarianceKind === 'diagonal') {
  for (let i = 0; i < size; i++) matrix[i * size + i] = variance[i] / R;
} else {
  if (R <= size + 2) throw new Error(`--covariance full needs more than ${size + 2} realisations, got ${R}`);
  hartlap = (R - size - 2) / (R - 1);
  for (const r of rows) {
    for (let i = 0; i < size; i++) {
      const di = r[i] - mean[i];
      for (let j = 0; j < size; j++) matrix[i * size + j] += (di * (r[j] - mean[j])) / ((R - 1) * R * hartlap);
    }
  }
}
const bundleDir = join(out, 'bundle');
writeMeasurementBundle(bundleDir, {
  description: `mean B0, B2 of ${rows.length} second-order mocks (${n}^3, L = ${boxSize} Mpc/h, z = ${redshift})${subtractCubic ? ', measured B[delta2, delta2, delta2] subtracted per realisation' : ''}; covariance = ${covarianceKind === 'diagonal' ? 'diagonal sample covariance / R' : 'full sample covariance / R / Hartlap factor'}, R = ${R}`,
  redshift,
  numberDensity: nbar,
  lineOfSight: 'z-axis',
  boxSize,
  fiducialCosmology: FIDUCIAL,
  bispectrum: { ...columns, values: [mean.subarray(0, nBins), mean.subarray(nBins)] },
  covariance: { matrix, size },
});
writeFileSync(join(out, 'truth.json'), `${JSON.stringify({ parameters: { ...truth, fsigma8: fsigma8True } }, null, 2)}\n`);

// 3. Run configs and fits.
const uniform = (min: number, max: number, start: number) => ({ prior: { kind: 'uniform', min, max }, start });
function runConfig(name: string, freeF: boolean): string {
  const config = {
    title: `second-order mocks, z = ${redshift}, B0 + B2${subtractCubic ? ' minus B[d2, d2, d2]' : ''}, ${freeF ? 'b1, b2, bG2, fsigma8' : 'b1, b2, bG2 (f fixed)'}`,
    measurement: 'bundle',
    covariance: { source: 'matrix' },
    cosmology: { mode: 'fixed-template', template: FIDUCIAL },
    models: { bispectrum: { averaging: 'box', irResummation: false } },
    parameters: {
      alphaPar: { value: 1 },
      alphaPerp: { value: 1 },
      templateAmplitude: { value: 1 },
      fsigma8: freeF ? uniform(0.1, 1.5, 0.9 * fsigma8True) : { value: fsigma8True },
      b1: uniform(0.5, 4, 1.8),
      b2: uniform(-5, 5, 0),
      bG2: uniform(-3, 3, 0),
      bispShotPower: { value: 0 },
      bispShotConst: { value: 0 },
    },
    sampler: { method: 'ensemble', seed: 11, walkers, maxSteps, checkEvery: 100, workers },
    peak: { starts: 4 },
    output: `run-${name}`,
    truth: 'truth.json',
  };
  const file = join(out, `${name}.json`);
  writeFileSync(file, `${JSON.stringify(config, null, 2)}\n`);
  return file;
}

/** Largest |mean cubic term| / |mean of the subtracted data| over the bins [from, to). */
function maxRatio(c: Float64Array, from: number, to: number): number {
  let m = 0;
  for (let i = from; i < to; i++) m = Math.max(m, Math.abs(c[i] / mean[i]));
  return m;
}

const names = ['b1', 'b2', 'bG2', 'fsigma8', 'f'] as const;
const fits: Record<string, unknown> = {};
for (const [name, freeF] of [['fixed-f', false], ['free-f', true]] as const) {
  const config = readRunConfig(runConfig(name, freeF));
  t = Date.now();
  const peak = await findBestFit(config, { workers });
  const peakSeconds = seconds(t);
  t = Date.now();
  const summary = await runJointFit(config, { fresh: true, workers, progress: 'off', log: (line) => process.stderr.write(`${line}\n`) });
  const fitSeconds = seconds(t);
  const rowsOut: Record<string, unknown> = {};
  for (const row of summary.parameters) {
    if (!(names as readonly string[]).includes(row.name)) continue;
    const tv = row.name === 'fsigma8' ? fsigma8True : truth[row.name as keyof typeof truth];
    rowsOut[row.name] = { truth: tv, peak: peak.values[row.name] ?? null, mean: row.mean, sd: row.sd, pull: (row.mean - tv) / row.sd, rhat: row.rhat, ess: row.ess };
  }
  fits[name] = {
    peakSeconds,
    fitSeconds,
    peakChi2: peak.chi2,
    dof: peak.dof,
    startsAgreeing: `${peak.startsAgreeing}/${peak.starts}`,
    sampler: summary.sampler,
    parameters: rowsOut,
  };
  writeFileSync(join(out, 'result.json'), `${JSON.stringify({ fits }, null, 2)}\n`);
}

console.log(
  JSON.stringify(
    {
      realisations: rows.length,
      mesh,
      redshift,
      kMaxUpperEdge: kMax,
      dk: 2 * kf,
      triangleBins: nBins,
      dataPoints: size,
      truth: { ...truth, fsigma8: fsigma8True, sigma8: spectrum.sigma8 },
      subtractCubic,
      meanCubicOverMeanData: meanCubic ? { B0: maxRatio(meanCubic, 0, nBins), B2: maxRatio(meanCubic, nBins, 2 * nBins) } : undefined,
      covariance: covarianceKind === 'diagonal' ? 'diagonal of the sample covariance / R' : `full sample covariance / R / Hartlap factor ${hartlap}`,
      sampler: { walkers, maxSteps, workers },
      mockSeconds: times.mocks,
      fits,
      out,
    },
    null,
    2,
  ),
);
