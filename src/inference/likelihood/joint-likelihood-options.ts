import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { InputError, InputErrors } from '../../contracts/input-error.js';
import type { ParameterValues } from '../../contracts/statistic-model.js';
import { backgroundOf } from '../../cosmology/background.js';
import { COSMOLOGY_FIELDS, validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology, type LinearPowerOptions } from '../../cosmology/linear-power-from-cosmology.js';
import { prepareCovariance, validateCovarianceOptions, type CovarianceOptions } from '../../data/covariance/covariance-choice.js';
import { loadMeasurementBundle, type MeasurementBundle } from '../../data/measurement-bundle.js';
import { selectData, type ScaleCuts } from '../../data/scale-cuts.js';
import { ParameterSpace, type ParameterSpecs } from '../parameters/parameter-space.js';
import { apDilations } from './alcock-paczynski-dilations.js';
import { bundleModels, type BundleModelOptions } from './bundle-models.js';
import { CompositeModel } from './composite-model.js';
import { JointLikelihood } from './joint-likelihood.js';
import { fixedTemplateSource, fullCosmologySource, type ModelSource, type ModelsForSpectrum } from './model-source.js';

/**
 * Everything that defines a joint P + B likelihood, as plain JSON, so that it
 * can be rebuilt inside a worker thread from the same options:
 *   bundle:     folder of a measurement bundle (measurement.json + tables);
 *   parameters: { name: { value } | { prior, start?, marginalise? } | { derived } };
 *   covariance: { source: "matrix" | "mocks" | "gaussian", ... };
 *   cuts:       scale cuts (optional, default none);
 *   cosmology:  { mode: "full", linearPower? }  — the cosmology parameters (h, omegaB, ...) are
 *               the declared parameters named as in src/cosmology; the AP dilations follow from
 *               the bundle's fiducial cosmology;
 *               { mode: "fixed-template", template?, linearPower? } — the template cosmology
 *               (default: the bundle's fiducial cosmology); alphaPar, alphaPerp, fsigma8 and
 *               templateAmplitude must be declared;
 *   models:     bin-averaging settings of the power and bispectrum models (optional);
 *   covarianceFiducial: parameter values at which the analytic covariance's model is evaluated
 *               (default: the starts, Gaussian-prior means of marginalised parameters, the
 *               models' own defaults for the rest).
 */
export interface JointLikelihoodOptions {
  readonly bundle: string;
  readonly parameters: ParameterSpecs;
  readonly covariance: CovarianceOptions;
  readonly cuts?: ScaleCuts;
  readonly cosmology:
    | { readonly mode: 'full'; readonly linearPower?: LinearPowerOptions }
    | { readonly mode: 'fixed-template'; readonly template?: Readonly<Record<string, number>>; readonly linearPower?: LinearPowerOptions };
  readonly models?: BundleModelOptions;
  readonly covarianceFiducial?: Readonly<Record<string, number>>;
}

const KEYS = ['bundle', 'parameters', 'covariance', 'cuts', 'cosmology', 'models', 'covarianceFiducial'];

function checkTopLevel(o: unknown): asserts o is JointLikelihoodOptions {
  const problems: string[] = [];
  if (typeof o !== 'object' || o === null) throw new InputErrors(['likelihood options must be an object']);
  const v = o as Record<string, unknown>;
  for (const k of Object.keys(v)) if (!KEYS.includes(k)) problems.push(`${k} is not a likelihood option (${KEYS.join(', ')})`);
  if (typeof v.bundle !== 'string' || v.bundle === '') problems.push('bundle must be the path of a measurement-bundle folder');
  if (typeof v.parameters !== 'object' || v.parameters === null) problems.push('parameters must be an object of named parameters');
  if (v.covariance === undefined) problems.push('covariance is required: { "source": "matrix" | "mocks" | "gaussian", ... }');
  const c = v.cosmology as Record<string, unknown> | undefined;
  if (!c || (c.mode !== 'full' && c.mode !== 'fixed-template')) problems.push(`cosmology.mode must be "full" or "fixed-template", got ${JSON.stringify(c?.mode)}`);
  if (problems.length) throw new InputErrors(problems);
}

function modelSource(o: JointLikelihoodOptions, bundle: MeasurementBundle, build: ModelsForSpectrum): ModelSource {
  const z = bundle.metadata.redshift;
  const fiducialRaw = bundle.metadata.fiducialCosmology;
  const where = { path: 'measurement.json: fiducialCosmology' };
  if (o.cosmology.mode === 'fixed-template') {
    const template = validateCosmology(o.cosmology.template ?? fiducialRaw, o.cosmology.template ? { path: 'cosmology.template' } : where);
    return fixedTemplateSource(linearPowerFromCosmology(template, z, o.cosmology.linearPower), build);
  }
  const fiducial = backgroundOf(validateCosmology(fiducialRaw, where));
  const names = Object.keys(o.parameters).filter((n) => n in COSMOLOGY_FIELDS);
  const linearPower = o.cosmology.linearPower;
  return fullCosmologySource(
    names,
    (values) => {
      const params = validateCosmology(values, { path: 'parameters' });
      const spectrum = linearPowerFromCosmology(params, z, linearPower);
      return { spectrum, ...apDilations(spectrum.background, fiducial, z), sigma8Today: spectrum.sigma8MatterToday, omegaMatter: spectrum.background.omegaMatter0 };
    },
    build,
  );
}

/**
 * Read likelihood options from a JSON file; a relative `bundle` path is taken
 * relative to the file's folder (so the options can be handed to workers as is).
 */
export function readJointLikelihoodOptions(path: string): JointLikelihoodOptions {
  let parsed: unknown;
  try {
    parsed = JSON.parse(readFileSync(path, 'utf8'));
  } catch (e) {
    throw new InputError(`${path}: cannot read the likelihood options (${(e as Error).message})`, { where: path });
  }
  checkTopLevel(parsed);
  return { ...parsed, bundle: resolve(dirname(path), parsed.bundle) };
}

/** Build the likelihood from JSON options; `build` overrides the bundle's default models (tests). */
export function createJointLikelihood(options: unknown, build?: ModelsForSpectrum): JointLikelihood {
  checkTopLevel(options);
  const covarianceOptions = validateCovarianceOptions(options.covariance);
  const bundle = loadMeasurementBundle(options.bundle);
  const selection = selectData(bundle.dataVector.entries, options.cuts);
  const source = modelSource(options, bundle, build ?? bundleModels(bundle, options.models));
  const parameters = new ParameterSpace(options.parameters, source.providedNames);
  let theory: Float64Array | undefined;
  if (covarianceOptions.source === 'gaussian') {
    const values: Record<string, number> = { ...parameters.values(parameters.starts) };
    for (const m of parameters.marginalised) if (m.sigma !== Infinity) values[m.name] = m.mean;
    Object.assign(values, options.covarianceFiducial ?? {});
    theory = fiducialTheory(source, bundle, values);
  }
  const covariance = prepareCovariance(covarianceOptions, { bundle, selection, theory, freeParameters: parameters.dimension + parameters.marginalised.length });
  return new JointLikelihood({ bundle, selection, covariance, parameters, models: source });
}

function fiducialTheory(source: ModelSource, bundle: MeasurementBundle, values: ParameterValues): Float64Array {
  try {
    const prepared = source.prepare(values);
    const model = new CompositeModel(prepared.models, bundle.dataVector.entries, { P: bundle.power?.dk, B: bundle.bispectrum?.dk });
    return model.evaluate({ ...prepared.modelValues, ...values });
  } catch (e) {
    if (e instanceof InputError) throw new InputError(`covariance: the model cannot be evaluated at the fiducial point (${e.message})`, { where: 'covarianceFiducial' });
    throw e;
  }
}

/**
 * The sampler's log-posterior factory (module reference
 * { module: <this file>, exportName: "createJointLogPosterior", options }):
 * theta in the order of the free parameters as declared.
 */
export function createJointLogPosterior(options: unknown): (theta: Float64Array) => number {
  const likelihood = createJointLikelihood(options);
  return (theta) => likelihood.logPosterior(theta);
}
