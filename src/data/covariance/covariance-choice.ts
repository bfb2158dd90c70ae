import { join } from 'node:path';
import { InputError, InputErrors } from '../../contracts/input-error.js';
import { latticeTriangleCounts } from '../../bispectrum/lattice/lattice-bin-average.js';
import { LogLogSpline } from '../../numerics/cubic-spline.js';
import { triangleBinsOf } from '../statistic-table.js';
import type { MeasurementBundle } from '../measurement-bundle.js';
import { loadBundleRealisations } from '../measurement-bundle.js';
import { selectMatrix, type DataSelection } from '../scale-cuts.js';
import { addGaussianBispectrumVariance, type TriangleCountSource } from './gaussian-bispectrum-variance.js';
import { addGaussianPowerCovariance } from './gaussian-power-covariance.js';
import { readCovarianceMatrix } from './matrix-file.js';
import type { ModeCountSource } from './mode-counts.js';
import { addPowerBispectrumCross } from './power-bispectrum-cross.js';
import { hartlapFactor, percivalInflation, sampleCovariance } from './sample-covariance.js';

/**
 * The covariance options (JSON-serialisable), one of:
 *   { source: "matrix", file? }  — a matrix file in data-vector order (default: the bundle's covarianceMatrix);
 *   { source: "mocks", treatment: "hartlap" | "t-distribution" } — sample covariance of the bundle's
 *       realisations, with the Hartlap factor on the inverse (and the Percival et al. inflation
 *       reported), or the Sellentin–Heavens t-distribution likelihood (no Hartlap factor);
 *   { source: "gaussian", modeCounts?, triangleCounts?, crossPowerBispectrum? } — analytic, from the
 *       model at a fiducial point: Gaussian P_l x P_l', diagonal Gaussian B, P x B zero ("none",
 *       default) or its leading non-Gaussian term ("leading"); the Poisson noise 1/nbar is taken as
 *       part of the model (its stochastic terms at their Poisson defaults: shotNoise "in-theory",
 *       default) or added to a noise-free model (shotNoise "add").
 */
export type CovarianceOptions =
  | { readonly source: 'matrix'; readonly file?: string }
  | { readonly source: 'mocks'; readonly treatment: 'hartlap' | 't-distribution' }
  | {
      readonly source: 'gaussian';
      readonly modeCounts?: ModeCountSource;
      readonly triangleCounts?: TriangleCountSource;
      readonly crossPowerBispectrum?: 'none' | 'leading';
      /** "in-theory" (default): the model's stochastic terms already hold the shot noise; "add": add 1/nbar. */
      readonly shotNoise?: 'in-theory' | 'add';
    };

/** How the likelihood must use the covariance. */
export type CovarianceLikelihoodForm =
  | { readonly kind: 'gaussian'; readonly precisionFactor: number }
  | { readonly kind: 't-distribution'; readonly realisations: number };

export interface PreparedCovariance {
  /** Cut covariance, row-major, selection.indices.length squared. */
  readonly matrix: Float64Array;
  readonly size: number;
  readonly form: CovarianceLikelihoodForm;
  /** What was chosen, for printing with a fit. */
  readonly description: CovarianceDescription;
}

export interface CovarianceDescription {
  readonly source: string;
  readonly details: Readonly<Record<string, string | number>>;
  readonly text: string;
}

export interface CovarianceContext {
  readonly bundle: MeasurementBundle;
  readonly selection: DataSelection;
  /** Model over the full data vector at the fiducial point (for source "gaussian"). */
  readonly theory?: Float64Array;
  /** Number of free parameters (for the Percival et al. factors). */
  readonly freeParameters: number;
}

export function validateCovarianceOptions(o: unknown): CovarianceOptions {
  const problems: string[] = [];
  if (typeof o !== 'object' || o === null) throw new InputErrors(['covariance must be an object with a "source" key (matrix, mocks or gaussian)']);
  const v = o as Record<string, unknown>;
  const allowed: Record<string, string[]> = { matrix: ['file'], mocks: ['treatment'], gaussian: ['modeCounts', 'triangleCounts', 'crossPowerBispectrum', 'shotNoise'] };
  const keys = allowed[String(v.source)];
  if (!keys) throw new InputErrors([`covariance.source must be matrix, mocks or gaussian, got ${JSON.stringify(v.source)}`]);
  for (const k of Object.keys(v)) if (k !== 'source' && !keys.includes(k)) problems.push(`covariance.${k} is not a key of source "${v.source}" (${keys.join(', ')})`);
  const oneOf = (key: string, options: string[], required: boolean) => {
    if (v[key] === undefined ? required : !options.includes(v[key] as string)) problems.push(`covariance.${key} must be one of ${options.join(', ')}, got ${JSON.stringify(v[key])}`);
  };
  if (v.source === 'matrix' && v.file !== undefined && (typeof v.file !== 'string' || v.file === '')) problems.push('covariance.file must be a file path');
  if (v.source === 'mocks') oneOf('treatment', ['hartlap', 't-distribution'], true);
  if (v.source === 'gaussian') {
    oneOf('modeCounts', ['measured', 'continuous', 'lattice'], false);
    oneOf('triangleCounts', ['measured', 'bin-volume', 'lattice'], false);
    oneOf('crossPowerBispectrum', ['none', 'leading'], false);
    oneOf('shotNoise', ['in-theory', 'add'], false);
  }
  if (problems.length) throw new InputErrors(problems);
  return v as unknown as CovarianceOptions;
}

function describe(source: string, details: Record<string, string | number>): CovarianceDescription {
  const text = `covariance: ${source} (${Object.entries(details).map(([k, x]) => `${k} = ${typeof x === 'number' ? Number(x.toPrecision(6)) : x}`).join('; ')})`;
  return { source, details, text };
}

/** Interpolated model monopole P_0(k) from the P0 entries of the theory vector. */
function monopoleFromTheory(ctx: CovarianceContext, theory: Float64Array): (k: number) => number {
  const ks: number[] = [];
  const ps: number[] = [];
  ctx.bundle.dataVector.entries.forEach((e, i) => {
    if (e.block === 'P0') {
      ks.push(e.kEffective[0]);
      ps.push(theory[i]);
    }
  });
  if (ks.length < 2) throw new InputError('covariance: the Gaussian bispectrum variance needs the model P0 on at least 2 k bins, and the bundle has no P0 table', { where: 'covariance.source' });
  const bad = ps.findIndex((p) => !(p > 0));
  if (bad >= 0) throw new InputError(`covariance: the model P0 at the fiducial point is not positive at k = ${ks[bad]}, so the Gaussian B variance is undefined`, { where: 'covariance' });
  const s = new LogLogSpline(ks, ps);
  return (k) => s.at(k);
}

function analyticGaussian(o: Extract<CovarianceOptions, { source: 'gaussian' }>, ctx: CovarianceContext): Float64Array {
  const { bundle } = ctx;
  const theory = ctx.theory;
  if (!theory) throw new Error('covariance "gaussian" needs the model at the fiducial point');
  const { metadata } = bundle;
  const entries = bundle.dataVector.entries;
  const n = entries.length;
  const modeCounts = o.modeCounts ?? 'measured';
  if (modeCounts === 'lattice' && metadata.boxSize === undefined) throw new InputError('covariance.modeCounts "lattice" needs a periodic box (boxSize in the bundle)', { where: 'covariance.modeCounts' });
  const triangleCounts = o.triangleCounts ?? 'measured';
  if (triangleCounts === 'lattice' && metadata.boxSize === undefined) throw new InputError('covariance.triangleCounts "lattice" needs a periodic box (boxSize in the bundle)', { where: 'covariance.triangleCounts' });
  const shotNoise = o.shotNoise === 'add' ? 1 / metadata.numberDensity : 0;
  const common = { entries, theory, shotNoise, volume: metadata.volume, boxSize: metadata.boxSize };
  const out = new Float64Array(n * n);
  if (bundle.power) addGaussianPowerCovariance({ ...common, dk: bundle.power.dk, modeCounts }, out);
  if (bundle.bispectrum) {
    const latticeCounts = triangleCounts === 'lattice' ? latticeTriangleCounts(triangleBinsOf(bundle.bispectrum), metadata.boxSize as number) : undefined;
    const empty = latticeCounts?.findIndex((c) => !(c > 0)) ?? -1;
    if (empty >= 0) throw new InputError(`covariance: triangle bin ${empty + 1} of ${bundle.bispectrum.file} has no lattice triangles in the box`, { where: 'covariance.triangleCounts' });
    addGaussianBispectrumVariance({ ...common, dk: bundle.bispectrum.dk, monopoleAt: monopoleFromTheory(ctx, theory), triangleCounts, latticeCounts }, out);
    if (bundle.power && o.crossPowerBispectrum === 'leading') addPowerBispectrumCross({ ...common, dk: bundle.power.dk, modeCounts }, out);
  }
  return out;
}

/** Build the chosen covariance over the full data vector, then cut it to the selection. */
export function prepareCovariance(options: CovarianceOptions, ctx: CovarianceContext): PreparedCovariance {
  const { bundle, selection } = ctx;
  const nFull = bundle.dataVector.entries.length;
  const nd = selection.indices.length;
  const cut = (m: Float64Array) => selectMatrix(m, nFull, selection.indices);
  if (options.source === 'matrix') {
    const file = options.file ?? bundle.metadata.covarianceMatrix;
    if (!file) throw new InputError('covariance: source "matrix" needs covariance.file or covarianceMatrix in the bundle', { where: 'covariance.file' });
    const m = readCovarianceMatrix(join(bundle.folder, file), file, bundle.dataVector.entries);
    return { matrix: cut(m), size: nd, form: { kind: 'gaussian', precisionFactor: 1 }, description: describe('matrix file', { file, entries: nd }) };
  }
  if (options.source === 'mocks') {
    const mocks = loadBundleRealisations(bundle);
    const { covariance } = sampleCovariance(mocks);
    const ns = mocks.length;
    if (options.treatment === 't-distribution') {
      if (ns <= nd) throw new InputError(`covariance: the t-distribution likelihood needs more realisations (${ns}) than data points (${nd})`, { where: 'covariance.treatment' });
      return { matrix: cut(covariance), size: nd, form: { kind: 't-distribution', realisations: ns }, description: describe('mock sample covariance, Sellentin–Heavens t-distribution likelihood', { realisations: ns, entries: nd }) };
    }
    const h = hartlapFactor(ns, nd);
    const details: Record<string, string | number> = { realisations: ns, entries: nd, hartlapFactor: h };
    if (ns - nd > 4) {
      const { m1, m2 } = percivalInflation(ns, nd, ctx.freeParameters);
      Object.assign(details, { percivalM1: m1, percivalM2: m2, errorInflation: Math.sqrt(m1) });
    }
    return { matrix: cut(covariance), size: nd, form: { kind: 'gaussian', precisionFactor: h }, description: describe('mock sample covariance, Hartlap-corrected inverse', details) };
  }
  const m = analyticGaussian(options, ctx);
  return {
    matrix: cut(m),
    size: nd,
    form: { kind: 'gaussian', precisionFactor: 1 },
    description: describe('analytic Gaussian', {
      entries: nd,
      modeCounts: options.modeCounts ?? 'measured',
      triangleCounts: options.triangleCounts ?? 'measured',
      crossPowerBispectrum: options.crossPowerBispectrum ?? 'none',
      shotNoise: options.shotNoise === 'add' ? `add 1/nbar = ${1 / bundle.metadata.numberDensity}` : 'in the model',
      volume: bundle.metadata.volume,
    }),
  };
}
