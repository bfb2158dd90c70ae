import { InputError, InputErrors } from '../contracts/input-error.js';
import { DEFAULT_N_EFF, DEFAULT_T_CMB_K } from './physical-constants.js';

/**
 * Cosmological parameters of a flat universe (docs/conventions.md, "Cosmology").
 * Exactly one amplitude: `lnAs` = ln(10^10 A_s) at the pivot 0.05 /Mpc, or
 * `sigma8` of the total matter field at z = 0.
 */
export interface CosmologyParameters {
  readonly h: number;
  /** Omega_b h^2. */
  readonly omegaB: number;
  /** Omega_c h^2. */
  readonly omegaCdm: number;
  readonly ns: number;
  readonly lnAs?: number;
  readonly sigma8?: number;
  /** Sum of the neutrino masses in eV, shared equally by `massiveNuCount` species. */
  readonly mNu: number;
  /** Number of degenerate massive species (1, 2 or 3) when mNu > 0. */
  readonly massiveNuCount: number;
  readonly w0: number;
  readonly wa: number;
  readonly tCmb: number;
  readonly nEff: number;
}

interface FieldRule {
  readonly min: number;
  readonly max: number;
  readonly required: boolean;
  readonly fallback?: number;
  readonly integer?: boolean;
  readonly meaning: string;
}

/** Allowed ranges: wide enough for any survey analysis, narrow enough for the Eisenstein–Hu fits to hold. */
export const COSMOLOGY_FIELDS: Readonly<Record<string, FieldRule>> = {
  h: { min: 0.4, max: 1.0, required: true, meaning: 'H0 / (100 km/s/Mpc)' },
  omegaB: { min: 0.005, max: 0.1, required: true, meaning: 'Omega_b h^2' },
  omegaCdm: { min: 0.01, max: 0.5, required: true, meaning: 'Omega_c h^2' },
  ns: { min: 0.5, max: 1.5, required: true, meaning: 'scalar spectral index' },
  lnAs: { min: 1, max: 5, required: false, meaning: 'ln(10^10 A_s), pivot 0.05 /Mpc' },
  sigma8: { min: 0.1, max: 2, required: false, meaning: 'sigma8 of the total matter at z = 0' },
  mNu: { min: 0, max: 3, required: false, fallback: 0, meaning: 'sum of neutrino masses in eV' },
  massiveNuCount: { min: 1, max: 3, required: false, fallback: 3, integer: true, meaning: 'number of degenerate massive neutrinos' },
  w0: { min: -3, max: 0, required: false, fallback: -1, meaning: 'dark-energy equation of state today' },
  wa: { min: -3, max: 3, required: false, fallback: 0, meaning: 'dark-energy equation-of-state slope, w = w0 + wa (1 - a)' },
  tCmb: { min: 1, max: 5, required: false, fallback: DEFAULT_T_CMB_K, meaning: 'CMB temperature in K' },
  nEff: { min: 0, max: 10, required: false, fallback: DEFAULT_N_EFF, meaning: 'effective number of neutrino species' },
};

/** Where a config came from, so that errors can name the file and line. */
export interface ConfigOrigin {
  /** Key path prefix, e.g. "cosmology". */
  readonly path?: string;
  readonly file?: string;
  /** Line of a key in the file, when known. */
  readonly lineOf?: (key: string) => number | undefined;
}

function locate(origin: ConfigOrigin, key: string): string {
  const name = origin.path ? `${origin.path}.${key}` : key;
  if (!origin.file) return name;
  const line = origin.lineOf?.(key);
  return line === undefined ? `${name} (${origin.file})` : `${name} (${origin.file}:${line})`;
}

/**
 * Check a raw object (for example parsed JSON) and return complete parameters
 * with defaults filled in. All problems are reported at once as InputErrors.
 */
export function validateCosmology(raw: unknown, origin: ConfigOrigin = { path: 'cosmology' }): CosmologyParameters {
  const where = origin.path ?? 'cosmology';
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    throw new InputError(`${where}${origin.file ? ` (${origin.file})` : ''} must be an object of cosmological parameters`);
  }
  const input = raw as Record<string, unknown>;
  const problems: string[] = [];
  const out: Record<string, number> = {};
  for (const key of Object.keys(input)) {
    if (!(key in COSMOLOGY_FIELDS)) {
      problems.push(`${locate(origin, key)}: unknown key; allowed keys are ${Object.keys(COSMOLOGY_FIELDS).join(', ')}`);
    }
  }
  for (const [key, rule] of Object.entries(COSMOLOGY_FIELDS)) {
    const value = input[key];
    if (value === undefined) {
      if (rule.required) problems.push(`${locate(origin, key)}: missing (${rule.meaning}, allowed [${rule.min}, ${rule.max}])`);
      else if (rule.fallback !== undefined) out[key] = rule.fallback;
      continue;
    }
    if (typeof value !== 'number' || Number.isNaN(value)) {
      problems.push(`${locate(origin, key)}: must be a number (${rule.meaning}), got ${JSON.stringify(value) ?? String(value)}`);
      continue;
    }
    if (!(value >= rule.min && value <= rule.max)) {
      problems.push(`${locate(origin, key)} = ${value} is out of range [${rule.min}, ${rule.max}] (${rule.meaning})`);
      continue;
    }
    if (rule.integer && !Number.isInteger(value)) {
      problems.push(`${locate(origin, key)} = ${value} must be an integer`);
      continue;
    }
    out[key] = value;
  }
  const hasAs = input.lnAs !== undefined;
  const hasS8 = input.sigma8 !== undefined;
  if (hasAs === hasS8) {
    problems.push(`${locate(origin, hasAs ? 'sigma8' : 'lnAs')}: give exactly one amplitude, lnAs or sigma8`);
  }
  if (out.w0 !== undefined && out.wa !== undefined && out.w0 + out.wa >= 0) {
    problems.push(`${locate(origin, 'wa')}: w0 + wa = ${out.w0 + out.wa} must be negative (dark energy must not dominate early)`);
  }
  if (problems.length === 0 && out.h !== undefined) {
    const omegaM = (out.omegaB + out.omegaCdm) / (out.h * out.h);
    if (omegaM >= 1) problems.push(`${locate(origin, 'omegaCdm')}: Omega_m = ${omegaM.toFixed(3)} >= 1 leaves no room for dark energy in a flat universe`);
  }
  if (problems.length > 0) throw new InputErrors(problems);
  return out as unknown as CosmologyParameters;
}

/** Parameters of the Planck 2018 best fit (A&A 641, A6, Table 2, from memory), one massive neutrino of 0.06 eV. */
export const PLANCK_2018: CosmologyParameters = validateCosmology({
  h: 0.6736,
  omegaB: 0.02237,
  omegaCdm: 0.12,
  ns: 0.9649,
  lnAs: 3.044,
  mNu: 0.06,
  massiveNuCount: 1,
});
