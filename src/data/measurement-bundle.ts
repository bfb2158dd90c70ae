import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { InputError } from '../contracts/input-error.js';
import { BUNDLE_METADATA_FILE, validateBundleMetadata, type BundleMetadata } from './bundle-metadata.js';
import { readNumericTable } from './csv-table.js';
import { assembleDataVector, tableValues, type DataVector } from './data-vector.js';
import { checkSameBins, readStatisticTable, type StatisticTable } from './statistic-table.js';

/** A loaded measurement bundle: metadata, the statistic tables and the data vector. */
export interface MeasurementBundle {
  readonly folder: string;
  readonly metadata: BundleMetadata;
  readonly power: StatisticTable | undefined;
  readonly bispectrum: StatisticTable | undefined;
  readonly dataVector: DataVector;
}

function parseJson(path: string, label: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError(`${label}: cannot read the file (${(e as Error).message})`, { where: label });
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new InputError(`${label}: not valid JSON (${(e as Error).message})`, { where: label });
  }
}

/** Load `<folder>/measurement.json` and the tables it names. */
export function loadMeasurementBundle(folder: string): MeasurementBundle {
  const metadata = validateBundleMetadata(parseJson(join(folder, BUNDLE_METADATA_FILE), join(folder, BUNDLE_METADATA_FILE)), BUNDLE_METADATA_FILE);
  const read = (files: BundleMetadata['power'], statistic: 'P' | 'B') =>
    files ? readStatisticTable(readNumericTable(join(folder, files.table), files.table), statistic, files.dk) : undefined;
  const power = read(metadata.power, 'P');
  const bispectrum = read(metadata.bispectrum, 'B');
  return { folder, metadata, power, bispectrum, dataVector: assembleDataVector([power, bispectrum]) };
}

function csvFiles(folder: string, sub: string): string[] {
  let names: string[];
  try {
    names = readdirSync(join(folder, sub)).filter((n) => n.endsWith('.csv'));
  } catch (e) {
    throw new InputError(`realisations folder ${sub}: cannot read it (${(e as Error).message})`, { where: sub });
  }
  return names.sort().map((n) => join(sub, n));
}

/**
 * The mock realisations named by `realisations` in the metadata, one data
 * vector per mock (rows of the returned array). Power and bispectrum tables are
 * paired by their position in name order; each must have the measurement's bins.
 */
export function loadBundleRealisations(bundle: MeasurementBundle): Float64Array[] {
  const r = bundle.metadata.realisations;
  if (!r) throw new InputError(`${BUNDLE_METADATA_FILE}: realisations is not given, so there are no mocks for a sample covariance`, { where: 'realisations' });
  const lists = [r.power ? csvFiles(bundle.folder, r.power) : undefined, r.bispectrum ? csvFiles(bundle.folder, r.bispectrum) : undefined];
  const counts = lists.filter((l): l is string[] => l !== undefined).map((l) => l.length);
  if (counts.some((c) => c !== counts[0])) throw new InputError(`realisations: ${r.power} has ${lists[0]?.length} tables but ${r.bispectrum} has ${lists[1]?.length}`, { where: 'realisations' });
  const out: Float64Array[] = [];
  for (let i = 0; i < counts[0]; i++) {
    const one = (list: string[] | undefined, ref: StatisticTable | undefined) => {
      if (!list || !ref) return undefined;
      const t = readStatisticTable(readNumericTable(join(bundle.folder, list[i]), list[i]), ref.statistic, ref.dk);
      checkSameBins(ref, t);
      return t;
    };
    out.push(tableValues([one(lists[0], bundle.power), one(lists[1], bundle.bispectrum)]));
  }
  return out;
}
