import { mkdirSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { isAbsolute, join } from 'node:path';
import { InputErrors } from '../../contracts/input-error.js';
import { validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology, type LinearPowerOptions } from '../../cosmology/linear-power-from-cosmology.js';
import { validateCovarianceOptions, type CovarianceOptions } from '../../data/covariance/covariance-choice.js';
import { loadMeasurementBundle } from '../../data/measurement-bundle.js';
import type { ScaleCuts } from '../../data/scale-cuts.js';
import { bundleModels, type BundleModelOptions } from '../../inference/likelihood/bundle-models.js';
import { fixedModelSource } from '../../inference/likelihood/model-source.js';
import { ParameterSpace, type ParameterSpecs } from '../../inference/parameters/parameter-space.js';
import { meanAndSd } from '../../inference/sampling/draw-summary.js';
import { trebleLibraryModule } from '../../inference/sampling/module-locations.js';
import { sampleEnsemble } from '../../inference/sampling/sample-ensemble.js';
import { sampledParametersFromPriors } from '../../inference/sampling/sampled-parameters-from-priors.js';
import { runScaleCutScan, scanContext, scanStepLikelihood, type ScaleCutScan, type ScaleCutScanInputs, type ScanPosterior } from './scale-cut-scan.js';
import type { TheoryErrorEnvelope } from './theory-error-covariance.js';
import { isJsonObject, type JsonObject } from '../../io/json-with-lines.js';

/**
 * A scale-cut scan from JSON (every problem listed at once, each naming its key):
 *   bundle:        measurement-bundle folder (relative to the config file);
 *   parameters:    as in a fit ({ value } | { prior, start?, marginalise? } | { derived });
 *   covariance:    { source: "matrix" | "mocks" | "gaussian", ... };
 *   statistic:     "B" (default) or "P" — whose k_max is scanned;
 *   kMax:          list of k_max values, h/Mpc;
 *   cuts:          the other scale cuts (optional);
 *   excludeShapes: shape classes to leave out (optional);
 *   theoryError:   { amplitude, kRef, slope, correlationLength } (optional);
 *   truth:         true parameter values, when the data come with them (optional);
 *   shiftThreshold, pValueLimit: flag limits (defaults in scale-cut-scan.ts);
 *   models, linearPower: model and linear-spectrum settings (optional);
 *   mode:          "best-fit" (default, fast) or "sampling": a short ensemble run per cut,
 *                  started at the cut's best fit, shifts in units of the posterior sd;
 *   sampling:      { seed, walkers?, maxSteps? (default 2000), workers? } for mode "sampling".
 * The linear spectrum is fixed at the bundle's fiducial cosmology (no
 * cosmology parameters are fitted in the scan).
 */
export interface ScanSamplingSettings {
  readonly seed: number;
  readonly walkers?: number;
  readonly maxSteps?: number;
  readonly workers?: number;
}

export interface ScanConfig {
  readonly bundle: string;
  readonly parameters: ParameterSpecs;
  readonly covariance: CovarianceOptions;
  readonly statistic: 'P' | 'B';
  readonly kMax: readonly number[];
  readonly cuts?: ScaleCuts;
  readonly excludeShapes?: readonly string[];
  readonly theoryError?: TheoryErrorEnvelope;
  readonly truth?: Readonly<Record<string, number>>;
  readonly shiftThreshold?: number;
  readonly pValueLimit?: number;
  readonly models?: BundleModelOptions;
  readonly linearPower?: LinearPowerOptions;
  readonly mode: 'best-fit' | 'sampling';
  readonly sampling?: ScanSamplingSettings;
}

const KEYS = ['bundle', 'parameters', 'covariance', 'statistic', 'kMax', 'cuts', 'excludeShapes', 'theoryError', 'truth', 'shiftThreshold', 'pValueLimit', 'models', 'linearPower', 'mode', 'sampling'];
const SAMPLING_KEYS = ['seed', 'walkers', 'maxSteps', 'workers'];
const ENVELOPE_KEYS = ['amplitude', 'kRef', 'slope', 'correlationLength'];
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

export function validateScanConfig(raw: unknown): ScanConfig {
  if (!isJsonObject(raw)) throw new InputErrors(['the scan config must be a JSON object']);
  const problems: string[] = [];
  for (const k of Object.keys(raw)) if (!KEYS.includes(k)) problems.push(`${k} is not a scan key (${KEYS.join(', ')})`);
  if (typeof raw.bundle !== 'string' || raw.bundle === '') problems.push('bundle must be the path of a measurement-bundle folder');
  if (!isJsonObject(raw.parameters)) problems.push('parameters must be an object of named parameters');
  if (raw.covariance === undefined) problems.push('covariance is required: { "source": "matrix" | "mocks" | "gaussian", ... }');
  else {
    try {
      validateCovarianceOptions(raw.covariance);
    } catch (e) {
      if (e instanceof InputErrors) problems.push(...e.problems);
      else throw e;
    }
  }
  if (raw.statistic !== undefined && raw.statistic !== 'P' && raw.statistic !== 'B') problems.push(`statistic must be "P" or "B", got ${JSON.stringify(raw.statistic)}`);
  if (!Array.isArray(raw.kMax) || raw.kMax.length === 0 || !raw.kMax.every((k) => isNum(k) && k > 0)) problems.push('kMax must be a non-empty list of positive wavenumbers (h/Mpc)');
  if (raw.excludeShapes !== undefined && !(Array.isArray(raw.excludeShapes) && raw.excludeShapes.every((s) => typeof s === 'string'))) problems.push('excludeShapes must be a list of shape-class names');
  if (raw.theoryError !== undefined) {
    if (!isJsonObject(raw.theoryError)) problems.push(`theoryError must be an object { ${ENVELOPE_KEYS.join(', ')} }`);
    else {
      for (const k of Object.keys(raw.theoryError)) if (!ENVELOPE_KEYS.includes(k)) problems.push(`theoryError.${k} is not a key (${ENVELOPE_KEYS.join(', ')})`);
      for (const k of ENVELOPE_KEYS) if (!isNum(raw.theoryError[k])) problems.push(`theoryError.${k} must be a number`);
    }
  }
  if (raw.truth !== undefined && !(isJsonObject(raw.truth) && Object.values(raw.truth).every(isNum))) problems.push('truth must be an object of named numbers');
  for (const k of ['shiftThreshold', 'pValueLimit']) if (raw[k] !== undefined && !isNum(raw[k])) problems.push(`${k} must be a number`);
  for (const k of ['cuts', 'models', 'linearPower']) if (raw[k] !== undefined && !isJsonObject(raw[k])) problems.push(`${k} must be an object`);
  if (raw.mode !== undefined && raw.mode !== 'best-fit' && raw.mode !== 'sampling') problems.push(`mode must be "best-fit" or "sampling", got ${JSON.stringify(raw.mode)}`);
  if (raw.mode === 'sampling' && !isJsonObject(raw.sampling)) problems.push('sampling must be an object { seed, walkers?, maxSteps?, workers? } with mode "sampling"');
  if (raw.sampling !== undefined && raw.mode !== 'sampling') problems.push('sampling is only used with mode "sampling"');
  if (isJsonObject(raw.sampling)) {
    for (const k of Object.keys(raw.sampling)) if (!SAMPLING_KEYS.includes(k)) problems.push(`sampling.${k} is not a key (${SAMPLING_KEYS.join(', ')})`);
    if (!Number.isInteger(raw.sampling.seed) || (raw.sampling.seed as number) < 0) problems.push('sampling.seed must be a non-negative integer');
    for (const k of ['walkers', 'maxSteps', 'workers']) if (raw.sampling[k] !== undefined && !(Number.isInteger(raw.sampling[k]) && (raw.sampling[k] as number) >= 0)) problems.push(`sampling.${k} must be a non-negative integer`);
  }
  if (problems.length) throw new InputErrors(problems);
  return { ...(raw as unknown as ScanConfig), statistic: (raw.statistic as 'P' | 'B' | undefined) ?? 'B', mode: (raw.mode as ScanConfig['mode'] | undefined) ?? 'best-fit' };
}

/** The scan inputs of a validated config: the bundle (path relative to `baseDir`) and its models at the fiducial cosmology. */
export function scanInputsFromConfig(c: ScanConfig, baseDir: string): ScaleCutScanInputs {
  const bundle = loadMeasurementBundle(isAbsolute(c.bundle) ? c.bundle : join(baseDir, c.bundle));
  const cosmology = validateCosmology(bundle.metadata.fiducialCosmology, { path: 'measurement.json: fiducialCosmology' });
  const spectrum = linearPowerFromCosmology(cosmology, bundle.metadata.redshift, c.linearPower);
  return {
    bundle,
    source: fixedModelSource(bundleModels(bundle, c.models)(spectrum)),
    parameters: c.parameters,
    covariance: c.covariance,
    statistic: c.statistic,
    kMaxValues: c.kMax,
    baseCuts: c.cuts,
    excludeShapes: c.excludeShapes,
    theoryError: c.theoryError,
    truth: c.truth,
    shiftThreshold: c.shiftThreshold,
    pValueLimit: c.pValueLimit,
  };
}

/**
 * The sampler's log-posterior of one cut (module reference
 * { module: the library entry, exportName: "createScanStepLogPosterior", options }).
 */
export function createScanStepLogPosterior(options: { config: unknown; baseDir: string; kMax: number }): (theta: Float64Array) => number {
  const ctx = scanContext(scanInputsFromConfig(validateScanConfig(options.config), options.baseDir));
  const { likelihood } = scanStepLikelihood(ctx, options.kMax);
  return (theta) => likelihood.logPosterior(theta);
}

/**
 * Validate, load, scan. Mode "sampling" writes one chain per cut under
 * `chainsDir` (default: a temporary folder) as `scan-kmax-<k>.csv` and `.json`.
 */
export async function runScanFromConfig(raw: unknown, baseDir: string, chainsDir?: string): Promise<ScaleCutScan> {
  const c = validateScanConfig(raw);
  const inputs = scanInputsFromConfig(c, baseDir);
  if (c.mode === 'best-fit' || !c.sampling) return runScaleCutScan(inputs);
  const settings = c.sampling;
  const dir = chainsDir ?? mkdtempSync(join(tmpdir(), 'treble-scan-'));
  mkdirSync(dir, { recursive: true });
  const base = sampledParametersFromPriors(new ParameterSpace(c.parameters, inputs.source.providedNames));
  const posterior: ScanPosterior = async (kMax, start) => {
    const run = await sampleEnsemble({
      parameters: base.map((p, i) => ({ ...p, start: start[i] })),
      target: { module: trebleLibraryModule(), exportName: 'createScanStepLogPosterior', options: { config: raw, baseDir, kMax } },
      output: join(dir, `scan-kmax-${kMax}`),
      seed: settings.seed,
      walkers: settings.walkers,
      maxSteps: settings.maxSteps ?? 2000,
      workers: settings.workers,
      progress: 'off',
      handleInterrupt: false,
    });
    const burn = run.diagnostics.burnInSteps;
    const summaries = base.map((_, p) => meanAndSd(run.history.seriesByMember(p, burn)));
    return { mean: Float64Array.from(summaries, (m) => m.mean), sd: Float64Array.from(summaries, (m) => m.sd) };
  };
  return runScaleCutScan(inputs, posterior);
}
