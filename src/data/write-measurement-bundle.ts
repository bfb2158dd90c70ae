import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { BUNDLE_FORMAT, BUNDLE_METADATA_FILE, type LineOfSight } from './bundle-metadata.js';

/**
 * Writes a measurement bundle in the layout `loadMeasurementBundle` reads
 * (docs/conventions.md, "Measurement bundles"): `measurement.json` plus one CSV
 * table per statistic. Numbers are written in shortest round-trip form, so a
 * written and re-read bundle holds exactly the same values.
 */
export interface StatisticColumns {
  /** Bin centres: 1 per bin for P, 3 per bin (k1 >= k2 >= k3) for B. */
  readonly centres: ArrayLike<number>;
  readonly effective: ArrayLike<number>;
  /** Mode (P) or fundamental-triangle (B) counts per bin. */
  readonly counts: ArrayLike<number>;
  readonly dk: number;
  /** Even multipole orders, one value column each. */
  readonly multipoles: readonly number[];
  readonly values: readonly ArrayLike<number>[];
}

export interface BundleToWrite {
  readonly description?: string;
  readonly redshift: number;
  readonly numberDensity: number;
  readonly lineOfSight: LineOfSight;
  readonly boxSize?: number;
  readonly surveyVolume?: number;
  readonly fiducialCosmology: Readonly<Record<string, number>>;
  readonly power?: StatisticColumns;
  readonly bispectrum?: StatisticColumns;
  /** Row-major covariance in data-vector order, written as covariance.csv. */
  readonly covariance?: { readonly matrix: ArrayLike<number>; readonly size: number };
}

const POWER_FILE = 'power.csv';
const BISPECTRUM_FILE = 'bispectrum.csv';
const COVARIANCE_FILE = 'covariance.csv';

function tableText(kind: 'P' | 'B', t: StatisticColumns): string {
  const sides = kind === 'P' ? 1 : 3;
  const head =
    kind === 'P'
      ? ['k_centre', 'k_eff', 'modes']
      : ['k1_centre', 'k2_centre', 'k3_centre', 'k1_eff', 'k2_eff', 'k3_eff', 'triangles'];
  const lines = [[...head, ...t.multipoles.map((l) => `${kind}${l}`)].join(',')];
  const rows = t.counts.length;
  for (let r = 0; r < rows; r++) {
    const cells: number[] = [];
    for (let s = 0; s < sides; s++) cells.push(t.centres[r * sides + s]);
    for (let s = 0; s < sides; s++) cells.push(t.effective[r * sides + s]);
    cells.push(t.counts[r]);
    for (const v of t.values) cells.push(v[r]);
    lines.push(cells.map((x) => String(x)).join(','));
  }
  return `${lines.join('\n')}\n`;
}

/** Header cells of a covariance file: the block, then the bin centres ("P2 k=0.05", "B0 k=0.1/0.08/0.05"). */
function entryHeaders(kind: 'P' | 'B', t: StatisticColumns | undefined): string[] {
  if (!t) return [];
  const sides = kind === 'P' ? 1 : 3;
  const out: string[] = [];
  for (const l of t.multipoles) {
    for (let r = 0; r < t.counts.length; r++) {
      out.push(`${kind}${l} k=${Array.from({ length: sides }, (_, s) => t.centres[r * sides + s]).join('/')}`);
    }
  }
  return out;
}

export function writeMeasurementBundle(folder: string, b: BundleToWrite): void {
  mkdirSync(folder, { recursive: true });
  const meta: Record<string, unknown> = { format: BUNDLE_FORMAT };
  if (b.description) meta.description = b.description;
  meta.redshift = b.redshift;
  meta.numberDensity = b.numberDensity;
  meta.lineOfSight = b.lineOfSight;
  if (b.boxSize !== undefined) meta.boxSize = b.boxSize;
  if (b.surveyVolume !== undefined) meta.surveyVolume = b.surveyVolume;
  meta.fiducialCosmology = b.fiducialCosmology;
  if (b.power) {
    writeFileSync(join(folder, POWER_FILE), tableText('P', b.power));
    meta.power = { table: POWER_FILE, dk: b.power.dk };
  }
  if (b.bispectrum) {
    writeFileSync(join(folder, BISPECTRUM_FILE), tableText('B', b.bispectrum));
    meta.bispectrum = { table: BISPECTRUM_FILE, dk: b.bispectrum.dk };
  }
  if (b.covariance) {
    const { matrix, size } = b.covariance;
    const labels = [...entryHeaders('P', b.power), ...entryHeaders('B', b.bispectrum)];
    if (labels.length !== size) throw new Error(`covariance of size ${size} for a data vector of ${labels.length} entries`);
    const lines: string[] = [labels.join(',')];
    for (let i = 0; i < size; i++) lines.push(Array.from({ length: size }, (_, j) => String(matrix[i * size + j])).join(','));
    writeFileSync(join(folder, COVARIANCE_FILE), `${lines.join('\n')}\n`);
    meta.covarianceMatrix = COVARIANCE_FILE;
  }
  writeFileSync(join(folder, BUNDLE_METADATA_FILE), `${JSON.stringify(meta, null, 2)}\n`);
}
