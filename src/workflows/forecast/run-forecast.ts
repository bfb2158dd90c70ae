import { InputError, InputErrors } from '../../contracts/input-error.js';
import { backgroundOf } from '../../cosmology/background.js';
import { COSMOLOGY_FIELDS, validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { addFisher, fisherErrors, fixParameters, gaussianPriorFisher, type FisherErrors } from '../../inference/fisher/fisher-algebra.js';
import type { FisherMatrix } from '../../inference/fisher/fisher-matrix.js';
import { binFisherSet } from './bin-fisher-set.js';
import { FORECAST_DEFAULT_COSMOLOGY, validateForecastSpec, type ForecastPrior, type ForecastSpec } from './forecast-spec.js';
import { resolveSurvey, type SurveyBin } from './survey.js';

/**
 * A Fisher forecast of a survey: per redshift bin the Fisher matrices of P
 * alone, B alone and P + B (bin-fisher-set.ts), summed over bins (independent
 * volumes), with cosmology parameters shared and model parameters per bin
 * (named "<name>_z<bin>" when there is more than one bin), an optional
 * external Gaussian prior added to each, then marginalised and conditional
 * errors and the improvement factors sigma(P) / sigma(P+B) and
 * sigma(B) / sigma(P+B) for every parameter both statistics constrain.
 */
export type StatisticSet = 'power' | 'bispectrum' | 'joint';

export interface SetForecast {
  readonly fisher: FisherMatrix;
  /** Errors, or why there are none (a singular matrix, its degenerate direction named). */
  readonly errors: FisherErrors | undefined;
  readonly singular: string | undefined;
}

export interface ForecastResult {
  readonly spec: ForecastSpec;
  readonly bins: readonly SurveyBin[];
  readonly sets: Readonly<Partial<Record<StatisticSet, SetForecast>>>;
  /** Fiducial values of the joint parameters. */
  readonly fiducial: Readonly<Record<string, number>>;
  readonly improvement: Readonly<Record<string, { readonly overPower?: number; readonly overBispectrum?: number }>>;
  /** Data points per redshift bin: P entries up to the power kMax, B entries. */
  readonly dataPoints: readonly { readonly power: number; readonly bispectrum: number }[];
  readonly warnings: readonly string[];
  readonly assumptions: readonly string[];
}

function priorFisher(p: ForecastPrior | undefined, names: readonly string[]): FisherMatrix | undefined {
  if (!p) return undefined;
  const parts: FisherMatrix[] = [];
  if (p.sigmas && Object.keys(p.sigmas).length) parts.push(gaussianPriorFisher(p.sigmas));
  if (p.names && p.fisher) {
    const n = p.names.length;
    parts.push({ names: [...p.names], matrix: Float64Array.from(p.fisher.flat()), warnings: [] });
    if (n === 0) return undefined;
  }
  if (!parts.length) return undefined;
  const total = addFisher(...parts);
  const unknown = total.names.filter((n) => !names.includes(n));
  if (unknown.length) throw new InputError(`prior: ${unknown.map((n) => `"${n}"`).join(', ')} ${unknown.length > 1 ? 'are' : 'is'} not among the forecast parameters (${names.join(', ')})`, { where: 'prior' });
  return total;
}

function withPrior(f: FisherMatrix, prior: FisherMatrix | undefined): FisherMatrix {
  if (!prior) return f;
  const present = prior.names.filter((n) => f.names.includes(n));
  return present.length ? fixParameters(addFisher(f, fixParameters(prior, present)), f.names) : f;
}

function errorsOf(fisher: FisherMatrix): SetForecast {
  try {
    return { fisher, errors: fisherErrors(fisher), singular: undefined };
  } catch (e) {
    if (e instanceof InputError) return { fisher, errors: undefined, singular: e.message };
    throw e;
  }
}

function sigmaOf(s: SetForecast | undefined, name: string): number | undefined {
  const i = s?.errors?.names.indexOf(name) ?? -1;
  return i >= 0 ? s?.errors?.marginalised[i] : undefined;
}

export function runForecast(raw: unknown): ForecastResult {
  const { spec, bins } = validatedForecast(raw);
  const isCosmology = (n: string) => n in COSMOLOGY_FIELDS;
  const rename = (i: number) => (n: string) => (isCosmology(n) || bins.length === 1 ? n : `${n}_z${i + 1}`);
  const perSet: Record<StatisticSet, FisherMatrix[]> = { power: [], bispectrum: [], joint: [] };
  const fiducial: Record<string, number> = {};
  const dataPoints: { power: number; bispectrum: number }[] = [];
  bins.forEach((bin, i) => {
    const set = binFisherSet({ bin, cosmology: spec.cosmology, names: spec.parameters, nuisance: spec.nuisance, power: spec.power, bispectrum: spec.bispectrum, steps: spec.steps, linearPower: spec.linearPower, models: spec.models, label: `survey.bins[${i}]` });
    const r = rename(i);
    const renamed = (f: FisherMatrix): FisherMatrix => ({ names: f.names.map(r), matrix: f.matrix, warnings: f.warnings.map((w) => (bins.length > 1 ? `survey.bins[${i}]: ${w}` : w)) });
    if (set.power) perSet.power.push(renamed(set.power));
    if (set.bispectrum) perSet.bispectrum.push(renamed(set.bispectrum));
    perSet.joint.push(renamed(set.joint));
    for (const n of spec.parameters) fiducial[r(n)] = set.fiducial[n];
    dataPoints.push(set.dataPoints);
  });
  const jointNames = Object.keys(fiducial);
  const prior = priorFisher(spec.prior, jointNames);
  const sets: Partial<Record<StatisticSet, SetForecast>> = {};
  for (const key of ['power', 'bispectrum', 'joint'] as const) if (perSet[key].length) sets[key] = errorsOf(withPrior(addFisher(...perSet[key]), prior));
  const improvement: Record<string, { overPower?: number; overBispectrum?: number }> = {};
  for (const n of jointNames) {
    const j = sigmaOf(sets.joint, n);
    const p = sigmaOf(sets.power, n);
    const b = sigmaOf(sets.bispectrum, n);
    if (j === undefined) continue;
    improvement[n] = { ...(p !== undefined ? { overPower: p / j } : {}), ...(b !== undefined ? { overBispectrum: b / j } : {}) };
  }
  const warnings = [...new Set(perSet.joint.flatMap((f) => f.warnings))];
  return { spec, bins, sets, fiducial, improvement, dataPoints, warnings, assumptions: forecastAssumptions(spec, bins) };
}

/** The spec and the resolved survey, with the problems of both listed at once. */
function validatedForecast(raw: unknown): { spec: ForecastSpec; bins: SurveyBin[] } {
  const problems: string[] = [];
  const collect = <T>(f: () => T): T | undefined => {
    try {
      return f();
    } catch (e) {
      if (!(e instanceof InputErrors)) throw e;
      problems.push(...e.problems);
      return undefined;
    }
  };
  const spec = collect(() => validateForecastSpec(raw));
  const survey = spec?.survey ?? (raw as Record<string, unknown> | null)?.survey;
  const cosmology = collect(() => validateCosmology(spec?.cosmology ?? FORECAST_DEFAULT_COSMOLOGY, { path: 'cosmology' }));
  const bins = cosmology && survey !== undefined ? collect(() => resolveSurvey(survey, backgroundOf(cosmology))) : undefined;
  if (problems.length || !spec || !bins) throw new InputErrors(problems);
  return { spec, bins };
}

function forecastAssumptions(spec: ForecastSpec, bins: readonly SurveyBin[]): string[] {
  const range = (b: ForecastSpec['power']) => (b ? `k in [${b.kMin}, ${b.kMax}] h/Mpc, dk = ${b.dk}, multipoles ${b.multipoles.join(', ')}` : 'not used');
  return [
    'model: tree-level bispectrum; power multipoles with linear (Kaiser, IR-resummed) terms plus counterterms and stochastic terms',
    `power spectrum: ${range(spec.power)}`,
    `bispectrum: ${range(spec.bispectrum)}`,
    'covariance: analytic Gaussian at the fiducial point (continuous mode counts, bin-volume triangle counts), no P x B cross-covariance, no super-sample or non-Gaussian terms',
    'derivatives: cosmology parameters rebuild the linear spectrum and growth rate; AP dilations follow from the fiducial background',
    `varied: ${spec.parameters.join(', ')}; everything else fixed at its fiducial value`,
    `bias defaulted: ${bins.map((b, i) => `bin ${i + 1}: ${b.defaulted.join(', ') || 'none'}`).join('; ')}`,
    spec.prior ? 'external Gaussian prior added to every statistic set' : 'no external prior',
  ];
}
