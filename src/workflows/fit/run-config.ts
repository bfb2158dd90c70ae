import { existsSync, readFileSync, statSync } from 'node:fs';
import { basename, dirname, extname, resolve } from 'node:path';
import { InputError, InputErrors } from '../../contracts/input-error.js';
import { validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { validateCovarianceOptions } from '../../data/covariance/covariance-choice.js';
import { loadMeasurementBundle } from '../../data/measurement-bundle.js';
import { selectData, type ScaleCuts } from '../../data/scale-cuts.js';
import type { JointLikelihoodOptions } from '../../inference/likelihood/joint-likelihood-options.js';
import { PROVIDED_QUANTITIES } from '../../inference/likelihood/model-source.js';
import { ParameterSpace } from '../../inference/parameters/parameter-space.js';
import { parseJsonWithLines, type JsonWithLines, isJsonObject, type JsonObject } from '../../io/json-with-lines.js';
import { checkBispectrumModelOptions } from './model-options.js';

/**
 * The run config of a joint fit (JSON; layout in docs/run-config.md). Every
 * problem is collected and reported at once, each naming its key and line.
 * Paths are relative to the config file's folder.
 */
export interface SamplerChoice {
  readonly method: 'ensemble' | 'chains';
  readonly seed: number;
  readonly workers: number | undefined;
  /** Settings handed to the sampler as they are (names as in src/inference/sampling). */
  readonly settings: Readonly<Record<string, number>>;
}

/** Optimiser starts drawn like the sampler's, besides the best draw (fit) or the parameters' starts (peak). */
export const DEFAULT_PEAK_STARTS = 4;

export interface PeakChoice {
  /** Extra starts drawn like the sampler's starting points. */
  readonly starts: number;
  readonly seed: number;
}

export interface RunConfig {
  readonly file: string;
  readonly title: string;
  readonly note: string | undefined;
  readonly likelihood: JointLikelihoodOptions;
  readonly sampler: SamplerChoice;
  readonly peak: PeakChoice;
  /** Output folder (absolute). */
  readonly output: string;
  /** True parameter values to compare with (demo and validation data), if given. */
  readonly truth: Readonly<Record<string, number>> | undefined;
  readonly truthFile: string | undefined;
}

const TOP_KEYS = ['title', 'note', 'measurement', 'covariance', 'cuts', 'cosmology', 'models', 'parameters', 'covarianceFiducial', 'sampler', 'peak', 'output', 'truth'];
const SAMPLER_COMMON = ['method', 'seed', 'workers', 'maxSteps', 'checkEvery', 'checkpointSeconds', 'maxLikelihoodErrors', 'workerRestarts', 'progressSeconds'];
const SAMPLER_KEYS = {
  ensemble: [...SAMPLER_COMMON, 'walkers', 'stretch', 'tauMultiple', 'tauDrift', 'burnInTaus'],
  chains: [...SAMPLER_COMMON, 'chains', 'adaptAfter', 'regularization', 'warmupFraction', 'maxRhat', 'minEss'],
} as const;
const PEAK_KEYS = ['starts', 'seed'];


/** Collect the problems of a validator that throws InputError(s). */
function collect(problems: string[], prefix: string, fn: () => void): void {
  try {
    fn();
  } catch (e) {
    if (e instanceof InputErrors) problems.push(...e.problems.map((p) => `${prefix}${p}`));
    else if (e instanceof InputError) problems.push(`${prefix}${e.message}`);
    else throw e;
  }
}

function readConfigText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError(`${path}: cannot read the run config (${(e as NodeJS.ErrnoException).code ?? String(e)})`, { hint: 'give the path of a JSON run config; `treble make-demo` writes an example' });
  }
}

function samplerChoice(raw: unknown, at: (k: string) => string, problems: string[]): SamplerChoice {
  const s = raw === undefined ? {} : raw;
  if (!isJsonObject(s)) {
    problems.push(`${at('sampler')}: must be an object`);
    return { method: 'ensemble', seed: 1, workers: undefined, settings: {} };
  }
  const method = (s.method ?? 'ensemble') as string;
  if (method !== 'ensemble' && method !== 'chains') problems.push(`${at('sampler.method')}: must be "ensemble" or "chains", got ${JSON.stringify(s.method)}`);
  const allowed: readonly string[] = method === 'chains' ? SAMPLER_KEYS.chains : SAMPLER_KEYS.ensemble;
  const settings: Record<string, number> = {};
  for (const [k, v] of Object.entries(s)) {
    if (k === 'method') continue;
    if (!allowed.includes(k)) {
      problems.push(`${at(`sampler.${k}`)}: not a setting of the ${method} sampler (${allowed.filter((a) => a !== 'method').join(', ')})`);
      continue;
    }
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      problems.push(`${at(`sampler.${k}`)}: must be a number, got ${JSON.stringify(v)}`);
      continue;
    }
    settings[k] = v;
  }
  const seed = settings.seed ?? 1;
  if (!Number.isInteger(seed) || seed < 0) problems.push(`${at('sampler.seed')}: must be a non-negative integer, got ${seed}`);
  const workers = settings.workers;
  if (workers !== undefined && (!Number.isInteger(workers) || workers < 0)) problems.push(`${at('sampler.workers')}: must be an integer >= 0, got ${workers}`);
  delete settings.seed;
  delete settings.workers;
  return { method: method === 'chains' ? 'chains' : 'ensemble', seed, workers, settings };
}

function peakChoice(raw: unknown, seed: number, at: (k: string) => string, problems: string[]): PeakChoice {
  if (raw === undefined) return { starts: DEFAULT_PEAK_STARTS, seed };
  if (!isJsonObject(raw)) {
    problems.push(`${at('peak')}: must be an object { starts, seed }`);
    return { starts: DEFAULT_PEAK_STARTS, seed };
  }
  for (const k of Object.keys(raw)) if (!PEAK_KEYS.includes(k)) problems.push(`${at(`peak.${k}`)}: not a key of peak (${PEAK_KEYS.join(', ')})`);
  const starts = raw.starts ?? DEFAULT_PEAK_STARTS;
  const s = raw.seed ?? seed;
  if (typeof starts !== 'number' || !Number.isInteger(starts) || starts < 0) problems.push(`${at('peak.starts')}: must be an integer >= 0, got ${JSON.stringify(starts)}`);
  if (typeof s !== 'number' || !Number.isInteger(s) || s < 0) problems.push(`${at('peak.seed')}: must be a non-negative integer, got ${JSON.stringify(s)}`);
  return { starts: Number(starts), seed: Number(s) };
}

function truthValues(raw: unknown, dir: string, at: (k: string) => string, problems: string[]): { values: Record<string, number> | undefined; file: string | undefined } {
  if (raw === undefined) return { values: undefined, file: undefined };
  if (typeof raw !== 'string' || raw === '') {
    problems.push(`${at('truth')}: must be the path of a JSON file of true parameter values`);
    return { values: undefined, file: undefined };
  }
  const file = resolve(dir, raw);
  let parsed: JsonWithLines;
  try {
    parsed = parseJsonWithLines(readFileSync(file, 'utf8'), file);
  } catch (e) {
    problems.push(`${at('truth')}: ${e instanceof InputError ? e.message : `cannot read ${file} (${(e as NodeJS.ErrnoException).code ?? e})`}`);
    return { values: undefined, file };
  }
  const v = isJsonObject(parsed.value) && isJsonObject(parsed.value.parameters) ? parsed.value.parameters : parsed.value;
  const values: Record<string, number> = {};
  if (!isJsonObject(v)) problems.push(`${file}: must hold an object of named true values (or { "parameters": { ... } })`);
  else {
    for (const [k, x] of Object.entries(v)) {
      if (typeof x === 'number' && Number.isFinite(x)) values[k] = x;
      else problems.push(`${parsed.where(isJsonObject(parsed.value) && isJsonObject(parsed.value.parameters) ? `parameters.${k}` : k)}: true value of ${k} must be a finite number`);
    }
  }
  return { values, file };
}

/** Parse and validate a run config; throws InputErrors listing every problem. */
export function readRunConfig(path: string): RunConfig {
  const file = resolve(path);
  const json = parseJsonWithLines(readConfigText(file), file);
  const at = (key: string) => `${key} (${json.where(key)})`;
  if (!isJsonObject(json.value)) throw new InputError(`${file}: the run config must be a JSON object`);
  const c = json.value;
  const dir = dirname(file);
  const problems: string[] = [];
  for (const k of Object.keys(c)) if (!TOP_KEYS.includes(k)) problems.push(`${at(k)}: unknown key (known: ${TOP_KEYS.join(', ')})`);
  for (const k of ['measurement', 'covariance', 'cosmology', 'parameters']) if (c[k] === undefined) problems.push(`${k} (${file}): missing`);
  for (const k of ['title', 'note', 'output']) if (c[k] !== undefined && (typeof c[k] !== 'string' || c[k] === '')) problems.push(`${at(k)}: must be a non-empty string`);

  let bundlePath = '';
  let entries: ReturnType<typeof loadMeasurementBundle>['dataVector']['entries'] | undefined;
  if (c.measurement !== undefined) {
    if (typeof c.measurement !== 'string' || c.measurement === '') problems.push(`${at('measurement')}: must be the path of a measurement-bundle folder`);
    else {
      bundlePath = resolve(dir, c.measurement);
      if (!existsSync(bundlePath) || !statSync(bundlePath).isDirectory()) problems.push(`${at('measurement')}: no folder at ${bundlePath}`);
      else collect(problems, `${at('measurement')}: `, () => (entries = loadMeasurementBundle(bundlePath).dataVector.entries));
    }
  }
  if (c.covariance !== undefined) collect(problems, '', () => validateCovarianceOptions(c.covariance));
  if (c.cuts !== undefined && entries) {
    const e = entries;
    collect(problems, '', () => selectData(e, c.cuts as ScaleCuts));
  }
  let mode = 'fixed-template';
  if (c.cosmology !== undefined) {
    if (!isJsonObject(c.cosmology)) problems.push(`${at('cosmology')}: must be an object { mode, ... }`);
    else {
      mode = String(c.cosmology.mode);
      if (mode !== 'full' && mode !== 'fixed-template') problems.push(`${at('cosmology.mode')}: must be "full" or "fixed-template", got ${JSON.stringify(c.cosmology.mode)}`);
      const allowed = mode === 'full' ? ['mode', 'linearPower'] : ['mode', 'template', 'linearPower'];
      for (const k of Object.keys(c.cosmology)) if (!allowed.includes(k)) problems.push(`${at(`cosmology.${k}`)}: not a key of cosmology mode ${mode} (${allowed.join(', ')})`);
      if (c.cosmology.template !== undefined) collect(problems, '', () => validateCosmology(c.cosmology && (c.cosmology as JsonObject).template, { path: 'cosmology.template', file, lineOf: (k) => json.lineOf(`cosmology.template.${k}`) }));
    }
  }
  if (c.parameters !== undefined) collect(problems, '', () => new ParameterSpace(c.parameters as never, mode === 'full' || mode === 'fixed-template' ? PROVIDED_QUANTITIES[mode] : []));
  if (c.models !== undefined && !isJsonObject(c.models)) problems.push(`${at('models')}: must be an object { power?, bispectrum? }`);
  checkBispectrumModelOptions(c.models, at, problems);
  if (c.covarianceFiducial !== undefined) {
    if (!isJsonObject(c.covarianceFiducial)) problems.push(`${at('covarianceFiducial')}: must be an object of named values`);
    else for (const [k, v] of Object.entries(c.covarianceFiducial)) if (typeof v !== 'number' || !Number.isFinite(v)) problems.push(`${at(`covarianceFiducial.${k}`)}: must be a finite number`);
  }
  const sampler = samplerChoice(c.sampler, at, problems);
  const peak = peakChoice(c.peak, sampler.seed, at, problems);
  const truth = truthValues(c.truth, dir, at, problems);
  if (problems.length) throw new InputErrors(problems, `fix the run config ${file}; see docs/run-config.md for its keys`);

  const name = basename(file, extname(file));
  return {
    file,
    title: (c.title as string | undefined) ?? name,
    note: c.note as string | undefined,
    likelihood: {
      bundle: bundlePath,
      parameters: c.parameters as JointLikelihoodOptions['parameters'],
      covariance: c.covariance as JointLikelihoodOptions['covariance'],
      cuts: c.cuts as ScaleCuts | undefined,
      cosmology: c.cosmology as JointLikelihoodOptions['cosmology'],
      models: c.models as JointLikelihoodOptions['models'],
      covarianceFiducial: c.covarianceFiducial as JointLikelihoodOptions['covarianceFiducial'],
    },
    sampler,
    peak,
    output: resolve(dir, (c.output as string | undefined) ?? `run-${name}`),
    truth: truth.values,
    truthFile: truth.file,
  };
}
