import { InputError } from '../../contracts/input-error.js';
import { enumerateTriangleBins, shellGrid } from '../../bispectrum/triangle-bins.js';
import { binVolumeTriangleCount } from '../../data/covariance/gaussian-bispectrum-variance.js';
import { continuousModeCount, volumeFundamentalFrequency } from '../../data/covariance/mode-counts.js';
import { assembleDataVector } from '../../data/data-vector.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import type { StatisticTable } from '../../data/statistic-table.js';

/**
 * A measurement bundle without measurements: the bins of a forecast (or of a
 * model-only study), held in memory. Every value is zero; counts are the
 * continuous-shell mode counts 4 pi k^2 dk V / (2 pi)^3 and the bin-volume
 * triangle counts 8 pi^2 k1 k2 k3 dk^3 / k_f^6 (src/data/covariance), so the
 * analytic Gaussian covariance gives the same answer with "measured" counts.
 * Effective wavenumbers are the bin centres.
 */
export interface ShellBinning {
  /** Centre of the first shell, h/Mpc. */
  readonly kMin: number;
  /** Largest centre kept, h/Mpc. */
  readonly kMax: number;
  readonly dk: number;
  readonly multipoles: readonly number[];
}

export interface BinningBundleSpec {
  readonly redshift: number;
  /** (h/Mpc)^3. */
  readonly numberDensity: number;
  /** (Mpc/h)^3. */
  readonly volume: number;
  readonly fiducialCosmology: Readonly<Record<string, number>>;
  readonly power?: ShellBinning;
  readonly bispectrum?: ShellBinning;
  /** Label used where a file name would be. */
  readonly label?: string;
}

function powerTable(b: ShellBinning, volume: number, label: string): StatisticTable {
  const g = shellGrid(b.kMin, b.kMax, b.dk);
  const centres = Float64Array.from({ length: g.count }, (_, i) => g.kMin + i * g.dk);
  return {
    statistic: 'P',
    file: `${label} (power bins)`,
    dk: b.dk,
    size: g.count,
    sides: 1,
    centres,
    effective: Float64Array.from(centres),
    shells: Int32Array.from({ length: g.count }, (_, i) => i),
    counts: Float64Array.from(centres, (k) => continuousModeCount(k, b.dk, volume)),
    multipoles: [...b.multipoles],
    values: b.multipoles.map(() => new Float64Array(g.count)),
  };
}

function bispectrumTable(b: ShellBinning, volume: number, label: string): StatisticTable {
  const bins = enumerateTriangleBins(shellGrid(b.kMin, b.kMax, b.dk));
  const kf = volumeFundamentalFrequency(volume, undefined);
  const counts = new Float64Array(bins.size);
  for (let t = 0; t < bins.size; t++) counts[t] = binVolumeTriangleCount(Array.from(bins.centres.subarray(3 * t, 3 * t + 3)), b.dk, kf);
  return {
    statistic: 'B',
    file: `${label} (triangle bins)`,
    dk: b.dk,
    size: bins.size,
    sides: 3,
    centres: bins.centres,
    effective: Float64Array.from(bins.centres),
    shells: bins.indices,
    counts,
    multipoles: [...b.multipoles],
    values: b.multipoles.map(() => new Float64Array(bins.size)),
  };
}

export function binningBundle(spec: BinningBundleSpec): MeasurementBundle {
  const label = spec.label ?? 'forecast';
  if (!(spec.volume > 0) || !Number.isFinite(spec.volume)) throw new InputError(`${label}: volume must be positive, got ${spec.volume}`, { where: 'volume' });
  if (!(spec.numberDensity > 0) || !Number.isFinite(spec.numberDensity)) throw new InputError(`${label}: nbar must be positive, got ${spec.numberDensity}`, { where: 'nbar' });
  if (!spec.power && !spec.bispectrum) throw new InputError(`${label}: neither power nor bispectrum bins were given`);
  const power = spec.power ? powerTable(spec.power, spec.volume, label) : undefined;
  const bispectrum = spec.bispectrum ? bispectrumTable(spec.bispectrum, spec.volume, label) : undefined;
  return {
    folder: '',
    metadata: {
      redshift: spec.redshift,
      numberDensity: spec.numberDensity,
      lineOfSight: 'endpoint',
      boxSize: undefined,
      volume: spec.volume,
      fiducialCosmology: spec.fiducialCosmology,
      power: power ? { table: power.file, dk: power.dk } : undefined,
      bispectrum: bispectrum ? { table: bispectrum.file, dk: bispectrum.dk } : undefined,
      covarianceMatrix: undefined,
      realisations: undefined,
    },
    power,
    bispectrum,
    dataVector: assembleDataVector([power, bispectrum]),
  };
}
