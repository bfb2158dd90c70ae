import { isAbsolute, join } from 'node:path';
import { InputErrors } from '../../contracts/input-error.js';
import { validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology, type LinearPowerOptions } from '../../cosmology/linear-power-from-cosmology.js';
import { validateCovarianceOptions, type CovarianceOptions } from '../../data/covariance/covariance-choice.js';
import { loadMeasurementBundle } from '../../data/measurement-bundle.js';
import type { ScaleCuts } from '../../data/scale-cuts.js';
import { bundleModels, type BundleModelOptions } from '../../inference/likelihood/bundle-models.js';
import { fixedModelSource } from '../../inference/likelihood/model-source.js';
import type { ParameterSpecs } from '../../inference/parameters/parameter-space.js';
import { runScaleCutScan, type ScaleCutScan } from './scale-cut-scan.js';
import type { TheoryErrorEnvelope } from './theory-error-covariance.js';

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
 *   models, linearPower: model and linear-spectrum settings (optional).
 * The linear spectrum is fixed at the bundle's fiducial cosmology (no
 * cosmology parameters are fitted in the scan).
 */
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
}

const KEYS = ['bundle', 'parameters', 'covariance', 'statistic', 'kMax', 'cuts', 'excludeShapes', 'theoryError', 'truth', 'shiftThreshold', 'pValueLimit', 'models', 'linearPower'];
const ENVELOPE_KEYS = ['amplitude', 'kRef', 'slope', 'correlationLength'];
type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

export function validateScanConfig(raw: unknown): ScanConfig {
  if (!isObject(raw)) throw new InputErrors(['the scan config must be a JSON object']);
  const problems: string[] = [];
  for (const k of Object.keys(raw)) if (!KEYS.includes(k)) problems.push(`${k} is not a scan key (${KEYS.join(', ')})`);
  if (typeof raw.bundle !== 'string' || raw.bundle === '') problems.push('bundle must be the path of a measurement-bundle folder');
  if (!isObject(raw.parameters)) problems.push('parameters must be an object of named parameters');
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
    if (!isObject(raw.theoryError)) problems.push(`theoryError must be an object { ${ENVELOPE_KEYS.join(', ')} }`);
    else {
      for (const k of Object.keys(raw.theoryError)) if (!ENVELOPE_KEYS.includes(k)) problems.push(`theoryError.${k} is not a key (${ENVELOPE_KEYS.join(', ')})`);
      for (const k of ENVELOPE_KEYS) if (!isNum(raw.theoryError[k])) problems.push(`theoryError.${k} must be a number`);
    }
  }
  if (raw.truth !== undefined && !(isObject(raw.truth) && Object.values(raw.truth).every(isNum))) problems.push('truth must be an object of named numbers');
  for (const k of ['shiftThreshold', 'pValueLimit']) if (raw[k] !== undefined && !isNum(raw[k])) problems.push(`${k} must be a number`);
  for (const k of ['cuts', 'models', 'linearPower']) if (raw[k] !== undefined && !isObject(raw[k])) problems.push(`${k} must be an object`);
  if (problems.length) throw new InputErrors(problems);
  return { ...(raw as unknown as ScanConfig), statistic: (raw.statistic as 'P' | 'B' | undefined) ?? 'B' };
}

/** Validate, load the bundle (path relative to `baseDir`), build the models at its fiducial cosmology, scan. */
export function runScanFromConfig(raw: unknown, baseDir: string): ScaleCutScan {
  const c = validateScanConfig(raw);
  const bundle = loadMeasurementBundle(isAbsolute(c.bundle) ? c.bundle : join(baseDir, c.bundle));
  const cosmology = validateCosmology(bundle.metadata.fiducialCosmology, { path: 'measurement.json: fiducialCosmology' });
  const spectrum = linearPowerFromCosmology(cosmology, bundle.metadata.redshift, c.linearPower);
  const source = fixedModelSource(bundleModels(bundle, c.models)(spectrum));
  return runScaleCutScan({
    bundle,
    source,
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
  });
}
