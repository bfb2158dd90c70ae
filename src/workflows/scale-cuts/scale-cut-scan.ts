import { InputError } from '../../contracts/input-error.js';
import type { ParameterValues } from '../../contracts/statistic-model.js';
import { prepareCovariance, type CovarianceOptions, type PreparedCovariance } from '../../data/covariance/covariance-choice.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { selectVector, type DataSelection, type ScaleCuts } from '../../data/scale-cuts.js';
import { addFisher, fisherErrors, gaussianPriorFisher } from '../../inference/fisher/fisher-algebra.js';
import type { FisherMatrix } from '../../inference/fisher/fisher-matrix.js';
import { selectionFisher } from '../../inference/fisher/selection-fisher.js';
import { SourceModelVector } from '../../inference/fisher/source-model-vector.js';
import { JointLikelihood } from '../../inference/likelihood/joint-likelihood.js';
import type { ModelSource } from '../../inference/likelihood/model-source.js';
import { climbFromStart } from '../../inference/optimize/climb-from-start.js';
import { ParameterSpace, type ParameterSpecs } from '../../inference/parameters/parameter-space.js';
import { sampledParametersFromPriors } from '../../inference/sampling/sampled-parameters-from-priors.js';
import { validateSampledParameters } from '../../inference/sampling/sampled-parameter.js';
import { scanSelection } from './scan-selection.js';
import { chiSquareByClass, type DataEntryShapeClass } from './shape-class-chi2.js';
import { theoryErrorCovariance, type TheoryErrorEntry, type TheoryErrorEnvelope } from './theory-error-covariance.js';

/**
 * Scale-cut scan: for each k_max of one statistic (B, or P), the best fit of
 * the sampled parameters (fast mode: restarted Nelder–Mead + BFGS from the
 * previous cut's best fit; linear parameters marginalised analytically by the
 * likelihood) or, with a ScanPosterior, the posterior mean and standard
 * deviation of a short sampling run started there; chi^2, dof and p-value and
 * the chi^2 share of each shape class at that point; and the shift of every
 * sampled parameter from the reference — the truth when given, else the
 * point at the most conservative (smallest) k_max — in units of its Fisher
 * error at that cut (all sampled and marginalised parameters varied, their
 * Gaussian priors included) or of the posterior standard deviation.
 * A cut is flagged when a |shift| exceeds `shiftThreshold` (default
 * SCAN_SHIFT_THRESHOLD) or the p-value falls below `pValueLimit` (default
 * SCAN_P_VALUE_LIMIT); the scan reports the first flagged k_max.
 */
export const SCAN_SHIFT_THRESHOLD = 0.5;
export const SCAN_P_VALUE_LIMIT = 0.01;

export interface ScaleCutScanInputs {
  readonly bundle: MeasurementBundle;
  readonly source: ModelSource;
  readonly parameters: ParameterSpecs;
  readonly covariance: CovarianceOptions;
  readonly statistic: 'P' | 'B';
  readonly kMaxValues: readonly number[];
  /** Cuts of everything else (for example the P range while B is scanned). */
  readonly baseCuts?: ScaleCuts;
  readonly excludeShapes?: readonly string[];
  /** Baldauf et al. 2016 envelope covariance added to the data covariance. */
  readonly theoryError?: TheoryErrorEnvelope;
  /** True parameter values, when the data come with them. */
  readonly truth?: ParameterValues;
  /** Where the analytic covariance and the theory-error envelope take the model (default: truth, else the starts). */
  readonly covarianceFiducial?: ParameterValues;
  readonly shiftThreshold?: number;
  readonly pValueLimit?: number;
}

export interface ScanStep {
  readonly kMax: number;
  readonly dataPoints: number;
  readonly bestFit: Readonly<Record<string, number>>;
  readonly sigma: Readonly<Record<string, number>>;
  /** (bestFit - reference) / sigma per sampled parameter. */
  readonly shift: Readonly<Record<string, number>>;
  readonly chi2: number;
  readonly dof: number;
  readonly pValue: number;
  readonly chi2ByClass: Readonly<Partial<Record<DataEntryShapeClass, number>>>;
  readonly flagged: boolean;
  readonly reasons: readonly string[];
}

export interface ScaleCutScan {
  readonly statistic: 'P' | 'B';
  readonly mode: 'best-fit' | 'sampling';
  readonly parameters: readonly string[];
  readonly reference: 'truth' | 'most conservative cut';
  readonly steps: readonly ScanStep[];
  /** First flagged k_max, or undefined when no cut is flagged. */
  readonly firstFlagged: number | undefined;
  readonly shiftThreshold: number;
  readonly pValueLimit: number;
  readonly warnings: readonly string[];
  readonly assumptions: readonly string[];
}

function fiducialTheory(vector: SourceModelVector, values: ParameterValues): Float64Array {
  try {
    return vector.evaluate(values);
  } catch (e) {
    if (e instanceof InputError) throw new InputError(`scan: the model cannot be evaluated at the covariance fiducial point (${e.message})`, { where: 'covarianceFiducial' });
    throw e;
  }
}

/** What every cut of a scan shares: parameters, model vector, covariance fiducial theory, priors as Fisher information. */
export interface ScanContext {
  readonly inputs: ScaleCutScanInputs;
  readonly space: ParameterSpace;
  readonly vector: SourceModelVector;
  readonly theory: Float64Array;
  readonly linearNames: readonly string[];
  readonly priorFisher: FisherMatrix | undefined;
}

export function scanContext(inp: ScaleCutScanInputs): ScanContext {
  const space = new ParameterSpace(inp.parameters, inp.source.providedNames);
  const names = space.free;
  if (!names.length) throw new InputError('scan: no sampled parameter to fit (declare at least one with a prior)', { where: 'parameters' });
  for (const n of inp.truth ? names : []) if (!Number.isFinite(inp.truth?.[n])) throw new InputError(`scan: truth has no value for the sampled parameter "${n}"`, { where: `truth.${n}` });
  const vector = new SourceModelVector(inp.bundle, inp.source);
  const covFiducial: Record<string, number> = { ...space.values(space.starts), ...inp.truth, ...inp.covarianceFiducial };
  for (const m of space.marginalised) if (covFiducial[m.name] === undefined && m.sigma !== Infinity) covFiducial[m.name] = m.mean;
  const priorSigmas: Record<string, number> = {};
  space.priors.forEach((p, i) => {
    if (p.kind === 'gaussian') priorSigmas[names[i]] = p.sigma;
  });
  for (const m of space.marginalised) if (m.sigma !== Infinity) priorSigmas[m.name] = m.sigma;
  return {
    inputs: inp,
    space,
    vector,
    theory: fiducialTheory(vector, covFiducial),
    linearNames: space.marginalised.map((m) => m.name),
    priorFisher: Object.keys(priorSigmas).length ? gaussianPriorFisher(priorSigmas) : undefined,
  };
}

/** The likelihood of one cut: selection (with shape exclusion), covariance (plus theory error), classes of the kept entries. */
export function scanStepLikelihood(ctx: ScanContext, kMax: number): { selection: DataSelection; classes: DataEntryShapeClass[]; covariance: PreparedCovariance; likelihood: JointLikelihood } {
  const inp = ctx.inputs;
  const { selection, classes } = scanSelection(inp.bundle, inp.baseCuts ?? {}, inp.statistic, kMax, inp.excludeShapes ?? []);
  const prepared = prepareCovariance(inp.covariance, { bundle: inp.bundle, selection, theory: ctx.theory, freeParameters: ctx.space.dimension + ctx.linearNames.length });
  const covariance: PreparedCovariance = inp.theoryError ? withTheoryError(prepared, selection.entries, selectVector(ctx.theory, selection.indices), inp.theoryError) : prepared;
  return { selection, classes, covariance, likelihood: new JointLikelihood({ bundle: inp.bundle, selection, covariance, parameters: ctx.space, models: inp.source }) };
}

/**
 * Posterior summary of one cut from a sampler (mean and standard deviation
 * per sampled parameter, theta order); without it the scan runs in fast mode.
 */
export type ScanPosterior = (kMax: number, start: Float64Array) => Promise<{ readonly mean: Float64Array; readonly sd: Float64Array }>;

export async function runScaleCutScan(inp: ScaleCutScanInputs, posterior?: ScanPosterior): Promise<ScaleCutScan> {
  if (!inp.kMaxValues.length || !inp.kMaxValues.every((k) => Number.isFinite(k) && k > 0)) throw new InputError('scan: kMaxValues must be a non-empty list of positive wavenumbers', { where: 'kMaxValues' });
  const threshold = inp.shiftThreshold ?? SCAN_SHIFT_THRESHOLD;
  const pLimit = inp.pValueLimit ?? SCAN_P_VALUE_LIMIT;
  if (!(threshold > 0)) throw new InputError(`scan: shiftThreshold must be positive, got ${threshold}`, { where: 'shiftThreshold' });
  if (!(pLimit > 0 && pLimit < 1)) throw new InputError(`scan: pValueLimit must be in (0, 1), got ${pLimit}`, { where: 'pValueLimit' });
  const kMaxValues = [...inp.kMaxValues].sort((a, b) => a - b);
  const ctx = scanContext(inp);
  const { space, vector, linearNames, priorFisher } = ctx;
  const names = space.free;
  const bounded = validateSampledParameters(sampledParametersFromPriors(space));
  const fisherNames = [...names, ...linearNames];

  let theta = Float64Array.from(names, (n, i) => inp.truth?.[n] ?? space.starts[i]);
  const steps: Omit<ScanStep, 'shift' | 'flagged' | 'reasons'>[] = [];
  const warnings: string[] = [];
  for (const kMax of kMaxValues) {
    const { selection, classes, covariance, likelihood } = scanStepLikelihood(ctx, kMax);
    const climb = climbFromStart((t) => likelihood.logPosterior(t), bounded, theta);
    theta = Float64Array.from(climb.theta);
    const sampled = posterior ? await posterior(kMax, theta) : undefined;
    if (sampled) theta = Float64Array.from(sampled.mean);
    const point = likelihood.pointAt(theta, { bestFit: true });
    const values: Record<string, number> = { ...space.values(theta), ...point.marginalised };
    const h = covariance.form.kind === 'gaussian' ? covariance.form.precisionFactor : 1;
    const fisher = selectionFisher({ vector, names: fisherNames, fiducial: values, indices: selection.indices, covariance: covariance.matrix, precisionFactor: h, label: `scan covariance at kMax = ${kMax}` });
    warnings.push(...fisher.warnings.map((w) => `kMax = ${kMax}: ${w}`));
    const errors = fisherErrors(priorFisher ? addFisher(fisher, priorFisher) : fisher);
    const sigma = Object.fromEntries(names.map((n, i) => [n, sampled ? sampled.sd[i] : errors.marginalised[errors.names.indexOf(n)]]));
    const model = selectVector(vector.evaluate(values), selection.indices);
    const data = selectVector(inp.bundle.dataVector.values, selection.indices);
    const residual = Float64Array.from(data, (d, i) => d - model[i]);
    steps.push({
      kMax,
      dataPoints: selection.indices.length,
      bestFit: Object.fromEntries(names.map((n, i) => [n, theta[i]])),
      sigma,
      chi2: point.chi2,
      dof: point.dof,
      pValue: point.pValue,
      chi2ByClass: chiSquareByClass(residual, covariance.matrix, classes, h),
    });
  }
  const reference = inp.truth ?? steps[0].bestFit;
  const scanned = steps.map((s) => {
    const shift = Object.fromEntries(names.map((n) => [n, (s.bestFit[n] - reference[n]) / s.sigma[n]]));
    const reasons = [
      ...names.filter((n) => Math.abs(shift[n]) > threshold).map((n) => `${n} shifted by ${shift[n].toFixed(2)} sigma`),
      ...(s.pValue < pLimit ? [`p-value ${s.pValue.toExponential(2)} < ${pLimit}`] : []),
    ];
    return { ...s, shift, flagged: reasons.length > 0, reasons };
  });
  return {
    statistic: inp.statistic,
    mode: posterior ? 'sampling' : 'best-fit',
    parameters: names,
    reference: inp.truth ? 'truth' : 'most conservative cut',
    steps: scanned,
    firstFlagged: scanned.find((s) => s.flagged)?.kMax,
    shiftThreshold: threshold,
    pValueLimit: pLimit,
    warnings,
    assumptions: [
      'model: tree-level bispectrum; power multipoles with linear (IR-resummed Kaiser) terms plus counterterms and stochastic terms',
      `scanned: k_max of ${inp.statistic === 'B' ? 'the bispectrum (largest triangle side)' : 'the power multipoles'} over ${kMaxValues.join(', ')} h/Mpc; other cuts fixed`,
      `shape classes excluded: ${(inp.excludeShapes ?? []).join(', ') || 'none'}`,
      `${covarianceSummary(inp.covariance)}${inp.theoryError ? `, plus a theoretical-error covariance (amplitude ${inp.theoryError.amplitude} at k = ${inp.theoryError.kRef}, slope ${inp.theoryError.slope}, correlation length ${inp.theoryError.correlationLength} h/Mpc)` : ''}`,
      `fit: ${posterior ? 'posterior mean of a short ensemble run per cut' : 'best fit (fast mode)'} of ${names.join(', ')}; marginalised analytically: ${linearNames.join(', ') || 'none'}; ${inp.source.describe().cosmologyMode}`,
      `sigma: ${posterior ? 'posterior standard deviations' : "Fisher errors at each cut's best fit"}; shifts relative to the ${inp.truth ? 'truth' : 'most conservative cut'}; flag when |shift| > ${threshold} or p < ${pLimit}`,
    ],
  };
}

function covarianceSummary(o: CovarianceOptions): string {
  if (o.source === 'gaussian') return 'covariance: analytic Gaussian at the fiducial point, no super-sample or non-Gaussian terms';
  if (o.source === 'mocks') return `covariance: mock sample covariance (${o.treatment})`;
  return 'covariance: matrix file';
}

function withTheoryError(c: PreparedCovariance, entries: readonly TheoryErrorEntry[], signal: Float64Array, envelope: TheoryErrorEnvelope): PreparedCovariance {
  const extra = theoryErrorCovariance(entries, signal, envelope);
  const matrix = Float64Array.from(c.matrix, (v, i) => v + extra[i]);
  const text = `${c.description.text}; plus theoretical error (Baldauf et al. 2016 envelope)`;
  return { ...c, matrix, description: { ...c.description, text } };
}
