import { InputErrors } from '../../contracts/input-error.js';
import type { LinearPowerOptions } from '../../cosmology/linear-power-from-cosmology.js';
import type { BundleModelOptions } from '../../inference/likelihood/bundle-models.js';
import type { ShellBinning } from './bin-forecast-setup.js';
import { isJsonObject, type JsonObject } from '../../io/json-with-lines.js';

/**
 * A Fisher forecast, as JSON (validated with every problem listed at once):
 *   survey:      { name?, skyArea?, bins: [{ zMin, zMax, nbar, volume?, b1?, b2?, bG2? }] } (see survey.ts);
 *   cosmology:   the fiducial cosmology (src/cosmology names; default FORECAST_DEFAULT_COSMOLOGY);
 *   parameters:  names varied in the Fisher matrix (default FORECAST_DEFAULT_PARAMETERS); cosmology
 *                names are shared by all redshift bins, model parameters are per bin;
 *   nuisance:    fiducial values of model parameters (default: survey bias, model defaults);
 *   power:       { kMin, kMax, dk, multipoles? = [0, 2, 4] } (default FORECAST_DEFAULT_POWER_BINS);
 *   bispectrum:  { kMin, kMax, dk, multipoles? = [0] } (default FORECAST_DEFAULT_BISPECTRUM_BINS);
 *   steps:       finite-difference steps per parameter (default 1% of |fiducial|, mNu 0.01 eV);
 *   prior:       external Gaussian information: { sigmas: { name: sigma } } or
 *                { names: [...], fisher: [[...]] } (a Fisher matrix, for example from the CMB);
 *   linearPower, models: options of the linear spectrum and of the bin-averaged models.
 */
export interface ForecastPrior {
  readonly sigmas?: Readonly<Record<string, number>>;
  readonly names?: readonly string[];
  readonly fisher?: readonly (readonly number[])[];
}

export interface ForecastSpec {
  readonly survey: unknown;
  readonly cosmology: Readonly<Record<string, number>>;
  readonly parameters: readonly string[];
  readonly nuisance: Readonly<Record<string, number>>;
  readonly power: ShellBinning | undefined;
  readonly bispectrum: ShellBinning | undefined;
  readonly steps: Readonly<Record<string, number>>;
  readonly prior: ForecastPrior | undefined;
  readonly linearPower: LinearPowerOptions | undefined;
  readonly models: BundleModelOptions | undefined;
}

/** Planck 2018 (A&A 641, A6, Table 2; from memory, REFERENCES.md) with the minimal neutrino mass 0.06 eV. */
export const FORECAST_DEFAULT_COSMOLOGY = { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044, mNu: 0.06 } as const;
export const FORECAST_DEFAULT_PARAMETERS = ['h', 'omegaCdm', 'lnAs', 'mNu', 'b1', 'b2', 'bG2', 'pStochConst', 'bispShotPower', 'pCt0'] as const;
export const FORECAST_DEFAULT_POWER_BINS: ShellBinning = { kMin: 0.01, kMax: 0.2, dk: 0.01, multipoles: [0, 2, 4] };
export const FORECAST_DEFAULT_BISPECTRUM_BINS: ShellBinning = { kMin: 0.02, kMax: 0.12, dk: 0.02, multipoles: [0] };
/** mNu: central differences at 0.02 and 0.01 eV disagree by 1.2% around 0.06 eV, at 0.01 and 0.005 eV by < 1% (docs/forecast-example.md). */
export const FORECAST_DEFAULT_STEPS = { mNu: 0.01 } as const;

const KEYS = ['survey', 'cosmology', 'parameters', 'nuisance', 'power', 'bispectrum', 'steps', 'prior', 'linearPower', 'models'];
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function numberMap(key: string, v: unknown, problems: string[], positive: boolean): Record<string, number> {
  if (v === undefined) return {};
  if (!isJsonObject(v)) {
    problems.push(`${key} must be an object of named numbers`);
    return {};
  }
  for (const [k, x] of Object.entries(v)) if (!isNum(x) || (positive && !(x > 0))) problems.push(`${key}.${k} must be a ${positive ? 'positive' : 'finite'} number, got ${JSON.stringify(x)}`);
  return v as Record<string, number>;
}

function binning(key: string, v: unknown, fallback: ShellBinning, defaultMultipoles: number[], problems: string[]): ShellBinning | undefined {
  if (v === null) return undefined;
  if (v === undefined) return fallback;
  if (!isJsonObject(v)) {
    problems.push(`${key} must be an object { kMin, kMax, dk, multipoles? }, or null to leave the statistic out`);
    return undefined;
  }
  for (const k of Object.keys(v)) if (!['kMin', 'kMax', 'dk', 'multipoles'].includes(k)) problems.push(`${key}.${k} is not a key (kMin, kMax, dk, multipoles)`);
  for (const k of ['kMin', 'kMax', 'dk']) if (!isNum(v[k]) || !((v[k] as number) > 0)) problems.push(`${key}.${k} must be a positive wavenumber in h/Mpc, got ${JSON.stringify(v[k])}`);
  if (isNum(v.kMin) && isNum(v.kMax) && v.kMax < v.kMin) problems.push(`${key}.kMax (${v.kMax}) is below kMin (${v.kMin})`);
  if (isNum(v.kMin) && isNum(v.dk) && v.kMin < v.dk / 2) problems.push(`${key}.kMin must be at least dk/2 (the first shell starts at kMin - dk/2)`);
  const m = v.multipoles ?? defaultMultipoles;
  if (!Array.isArray(m) || m.length === 0 || !m.every((x) => Number.isInteger(x) && x >= 0 && x % 2 === 0)) problems.push(`${key}.multipoles must be a list of even orders, got ${JSON.stringify(m)}`);
  return { kMin: v.kMin as number, kMax: v.kMax as number, dk: v.dk as number, multipoles: m as number[] };
}

function prior(v: unknown, problems: string[]): ForecastPrior | undefined {
  if (v === undefined) return undefined;
  if (!isJsonObject(v)) {
    problems.push('prior must be an object { sigmas } or { names, fisher }');
    return undefined;
  }
  for (const k of Object.keys(v)) if (!['sigmas', 'names', 'fisher'].includes(k)) problems.push(`prior.${k} is not a key (sigmas, names, fisher)`);
  numberMap('prior.sigmas', v.sigmas, problems, true);
  if ((v.names === undefined) !== (v.fisher === undefined)) problems.push('prior.names and prior.fisher go together');
  if (v.names !== undefined) {
    const names = v.names as unknown[];
    if (!Array.isArray(names) || !names.every((n) => typeof n === 'string')) problems.push('prior.names must be a list of parameter names');
    const f = v.fisher as unknown[];
    if (!Array.isArray(f) || !Array.isArray(names) || f.length !== names.length || !f.every((row) => Array.isArray(row) && row.length === names.length && row.every(isNum))) {
      problems.push(`prior.fisher must be a ${Array.isArray(names) ? names.length : 'n'} x ${Array.isArray(names) ? names.length : 'n'} matrix of numbers`);
    } else {
      const rows = f as number[][];
      for (let a = 0; a < rows.length; a++) for (let b = 0; b < a; b++) if (Math.abs(rows[a][b] - rows[b][a]) > 1e-9 * (Math.abs(rows[a][b]) + Math.abs(rows[b][a]))) problems.push(`prior.fisher must be symmetric (rows ${a + 1} and ${b + 1} differ)`);
    }
  }
  return v as ForecastPrior;
}

export function validateForecastSpec(raw: unknown): ForecastSpec {
  if (!isJsonObject(raw)) throw new InputErrors(['the forecast must be a JSON object with at least "survey"']);
  const problems: string[] = [];
  for (const k of Object.keys(raw)) if (!KEYS.includes(k)) problems.push(`${k} is not a forecast key (${KEYS.join(', ')})`);
  if (raw.survey === undefined) problems.push('survey is required: { skyArea?, bins: [{ zMin, zMax, nbar, volume? }] }');
  const cosmology = raw.cosmology === undefined ? { ...FORECAST_DEFAULT_COSMOLOGY } : numberMap('cosmology', raw.cosmology, problems, false);
  const parameters = (raw.parameters ?? [...FORECAST_DEFAULT_PARAMETERS]) as string[];
  if (!Array.isArray(parameters) || parameters.length === 0 || !parameters.every((n) => typeof n === 'string')) problems.push('parameters must be a non-empty list of parameter names');
  else if (new Set(parameters).size !== parameters.length) problems.push('parameters lists a name twice');
  const nuisance = numberMap('nuisance', raw.nuisance, problems, false);
  const power = binning('power', raw.power, FORECAST_DEFAULT_POWER_BINS, [0, 2, 4], problems);
  const bispectrum = binning('bispectrum', raw.bispectrum, FORECAST_DEFAULT_BISPECTRUM_BINS, [0], problems);
  if (raw.power === null && raw.bispectrum === null) problems.push('power and bispectrum cannot both be null');
  const steps = { ...FORECAST_DEFAULT_STEPS, ...numberMap('steps', raw.steps, problems, true) };
  const p = prior(raw.prior, problems);
  for (const k of ['linearPower', 'models']) if (raw[k] !== undefined && !isJsonObject(raw[k])) problems.push(`${k} must be an object`);
  if (problems.length) throw new InputErrors(problems);
  return { survey: raw.survey, cosmology, parameters, nuisance, power, bispectrum, steps, prior: p, linearPower: raw.linearPower as LinearPowerOptions | undefined, models: raw.models as BundleModelOptions | undefined };
}
