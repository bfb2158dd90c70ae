import { InputErrors } from '../contracts/input-error.js';
import { isJsonObject, type JsonObject } from '../io/json-with-lines.js';

/**
 * The JSON metadata of a measurement bundle (file `measurement.json` in the
 * bundle folder; layout in docs/conventions.md, "Measurement bundles").
 */
export type LineOfSight = 'x-axis' | 'y-axis' | 'z-axis' | 'endpoint' | 'midpoint';
const LINES_OF_SIGHT: readonly LineOfSight[] = ['x-axis', 'y-axis', 'z-axis', 'endpoint', 'midpoint'];

export interface StatisticFiles {
  /** CSV table, relative to the bundle folder. */
  readonly table: string;
  /** Shell width, h/Mpc. */
  readonly dk: number;
}

export interface BundleMetadata {
  readonly redshift: number;
  /** Mean number density, (h/Mpc)^3. */
  readonly numberDensity: number;
  readonly lineOfSight: LineOfSight;
  /** Side of a periodic box, Mpc/h, when the measurement comes from one. */
  readonly boxSize: number | undefined;
  /** Effective survey volume, (Mpc/h)^3 (boxSize^3 for a box). */
  readonly volume: number;
  /** Cosmology used to turn redshifts into distances (the AP reference). */
  readonly fiducialCosmology: Readonly<Record<string, number>>;
  readonly power: StatisticFiles | undefined;
  readonly bispectrum: StatisticFiles | undefined;
  /** Covariance matrix CSV in data-vector order, relative to the folder. */
  readonly covarianceMatrix: string | undefined;
  /** Folders of per-mock tables in the layout of `power.table` / `bispectrum.table`. */
  readonly realisations: { readonly power: string | undefined; readonly bispectrum: string | undefined } | undefined;
}

export const BUNDLE_FORMAT = 'treble-measurement-1';
export const BUNDLE_METADATA_FILE = 'measurement.json';


/** Validate parsed JSON; every problem is collected and named by its key. */
export function validateBundleMetadata(json: unknown, file = BUNDLE_METADATA_FILE): BundleMetadata {
  const problems: string[] = [];
  const bad = (key: string, why: string) => problems.push(`${file}: ${key} ${why}`);
  if (!isJsonObject(json)) throw new InputErrors([`${file}: the metadata must be a JSON object`]);
  const known = new Set(['format', 'redshift', 'numberDensity', 'lineOfSight', 'boxSize', 'surveyVolume', 'fiducialCosmology', 'power', 'bispectrum', 'covarianceMatrix', 'realisations', 'description']);
  for (const key of Object.keys(json)) if (!known.has(key)) bad(key, 'is not a known key');
  if (json.format !== BUNDLE_FORMAT) bad('format', `must be "${BUNDLE_FORMAT}", got ${JSON.stringify(json.format)}`);

  const num = (key: string, v: unknown, check: (x: number) => boolean, what: string): number => {
    if (typeof v !== 'number' || !Number.isFinite(v) || !check(v)) {
      bad(key, `must be ${what}, got ${JSON.stringify(v)}`);
      return Number.NaN;
    }
    return v;
  };
  const str = (key: string, v: unknown): string | undefined => {
    if (v === undefined) return undefined;
    if (typeof v !== 'string' || v === '') {
      bad(key, `must be a non-empty file path, got ${JSON.stringify(v)}`);
      return undefined;
    }
    return v;
  };
  const redshift = num('redshift', json.redshift, (x) => x >= 0, 'a number >= 0');
  const numberDensity = num('numberDensity', json.numberDensity, (x) => x > 0, 'a positive number in (h/Mpc)^3');
  const lineOfSight = json.lineOfSight as LineOfSight;
  if (!LINES_OF_SIGHT.includes(lineOfSight)) bad('lineOfSight', `must be one of ${LINES_OF_SIGHT.join(', ')}, got ${JSON.stringify(json.lineOfSight)}`);

  let boxSize: number | undefined;
  let volume = Number.NaN;
  if ((json.boxSize === undefined) === (json.surveyVolume === undefined)) {
    bad('boxSize', 'or surveyVolume must be given, exactly one of them');
  } else if (json.boxSize !== undefined) {
    boxSize = num('boxSize', json.boxSize, (x) => x > 0, 'a positive side length in Mpc/h');
    volume = boxSize ** 3;
  } else {
    volume = num('surveyVolume', json.surveyVolume, (x) => x > 0, 'a positive volume in (Mpc/h)^3');
  }
  if (boxSize !== undefined && !['x-axis', 'y-axis', 'z-axis'].includes(lineOfSight)) {
    bad('lineOfSight', `must be a box axis (x-axis, y-axis, z-axis) for a periodic box, got ${JSON.stringify(json.lineOfSight)}`);
  }

  const fiducialCosmology: Record<string, number> = {};
  if (!isJsonObject(json.fiducialCosmology) || Object.keys(json.fiducialCosmology).length === 0) {
    bad('fiducialCosmology', 'must be an object of named numbers (the cosmology that turned redshifts into distances)');
  } else {
    for (const [k, v] of Object.entries(json.fiducialCosmology)) fiducialCosmology[k] = num(`fiducialCosmology.${k}`, v, () => true, 'a finite number');
  }

  const statistic = (key: 'power' | 'bispectrum'): StatisticFiles | undefined => {
    const v = json[key];
    if (v === undefined) return undefined;
    if (!isJsonObject(v)) {
      bad(key, 'must be an object { "table": file, "dk": width }');
      return undefined;
    }
    for (const k of Object.keys(v)) if (k !== 'table' && k !== 'dk') bad(`${key}.${k}`, 'is not a known key');
    const table = str(`${key}.table`, v.table);
    if (table === undefined) bad(`${key}.table`, 'is required');
    const dk = num(`${key}.dk`, v.dk, (x) => x > 0, 'a positive shell width in h/Mpc');
    return { table: table ?? '', dk };
  };
  const power = statistic('power');
  const bispectrum = statistic('bispectrum');
  if (!power && !bispectrum) bad('power', 'or bispectrum must be given (the bundle has no measurement)');

  const covarianceMatrix = str('covarianceMatrix', json.covarianceMatrix);
  let realisations: BundleMetadata['realisations'];
  if (json.realisations !== undefined) {
    if (!isJsonObject(json.realisations)) bad('realisations', 'must be an object { "power": folder, "bispectrum": folder }');
    else {
      const r = json.realisations;
      for (const k of Object.keys(r)) if (k !== 'power' && k !== 'bispectrum') bad(`realisations.${k}`, 'is not a known key');
      realisations = { power: str('realisations.power', r.power), bispectrum: str('realisations.bispectrum', r.bispectrum) };
      if ((realisations.power === undefined) !== (power === undefined)) bad('realisations.power', 'must be given exactly when power is');
      if ((realisations.bispectrum === undefined) !== (bispectrum === undefined)) bad('realisations.bispectrum', 'must be given exactly when bispectrum is');
    }
  }
  if (problems.length > 0) throw new InputErrors(problems);
  return { redshift, numberDensity, lineOfSight, boxSize, volume, fiducialCosmology, power, bispectrum, covarianceMatrix, realisations };
}
