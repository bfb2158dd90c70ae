import type { LinearSpectrum } from '../../contracts/linear-spectrum.js';
import type { ParameterValues } from '../../contracts/statistic-model.js';
import { effectiveTriangleNodes } from '../../bispectrum/bin-averaging.js';
import { enumerateTriangleBins, shellGrid } from '../../bispectrum/triangle-bins.js';
import { BUNDLE_METADATA_FILE, type BundleMetadata, type LineOfSight } from '../../data/bundle-metadata.js';
import { choleskyFactor } from '../../data/covariance/cholesky-factor.js';
import { prepareCovariance } from '../../data/covariance/covariance-choice.js';
import { binVolumeTriangleCount } from '../../data/covariance/gaussian-bispectrum-variance.js';
import { continuousModeCount, volumeFundamentalFrequency } from '../../data/covariance/mode-counts.js';
import { assembleDataVector } from '../../data/data-vector.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { selectData } from '../../data/scale-cuts.js';
import type { StatisticTable } from '../../data/statistic-table.js';
import { bundleModels, type BundleModelOptions } from '../../inference/likelihood/bundle-models.js';
import { CompositeModel } from '../../inference/likelihood/composite-model.js';
import { Random } from '../../numerics/random.js';
import { continuumMeanK } from '../../power/k-bins.js';

/**
 * An in-memory measurement bundle on chosen bins whose data vector is the
 * model at given parameters — noiseless, or plus one Gaussian draw from the
 * analytic Gaussian covariance of that model. For the demo data, for Fisher
 * versus posterior checks and for scale-cut tests with mis-specified data.
 *
 * Bins follow docs/conventions.md ("Binning"). A survey volume (no periodic
 * box) is assumed: mode counts 4 pi k^2 dk V / (2 pi)^3 with the mode-weighted
 * mean k of each shell, triangle counts 8 pi^2 k1 k2 k3 dk^3 / k_f^6 (halved on
 * the closure edge) with the k1 k2 k3-weighted mean wavenumbers of each bin.
 */
export interface SyntheticBundleSpec {
  readonly description?: string;
  readonly redshift: number;
  readonly numberDensity: number;
  /** (Mpc/h)^3. */
  readonly surveyVolume: number;
  readonly lineOfSight?: LineOfSight;
  readonly fiducialCosmology: Readonly<Record<string, number>>;
  /** P bins: centres kMin, kMin + dk, ... (count bins). */
  readonly power?: { readonly kMin: number; readonly dk: number; readonly count: number; readonly multipoles?: readonly number[] };
  /** Triangle bins on shells kMin .. kMax with width dk. */
  readonly bispectrum?: { readonly kMin: number; readonly kMax: number; readonly dk: number; readonly multipoles?: readonly number[] };
}

export interface SyntheticBundle {
  readonly bundle: MeasurementBundle;
  /** The noiseless model vector (the "truth"), in data-vector order. */
  readonly truth: Float64Array;
  /** Analytic Gaussian covariance of the full data vector (row-major), when computed. */
  readonly covariance: Float64Array | undefined;
}

function powerTable(spec: NonNullable<SyntheticBundleSpec['power']>, volume: number): StatisticTable {
  const { kMin, dk, count } = spec;
  const multipoles = spec.multipoles ?? [0, 2, 4];
  const centres = new Float64Array(count);
  const effective = new Float64Array(count);
  const counts = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const c = kMin + i * dk;
    centres[i] = c;
    effective[i] = continuumMeanK(c - dk / 2, c + dk / 2);
    counts[i] = continuousModeCount(c, dk, volume);
  }
  return {
    statistic: 'P',
    file: 'synthetic power table',
    dk,
    size: count,
    sides: 1,
    centres,
    effective,
    shells: Int32Array.from({ length: count }, (_, i) => i),
    counts,
    multipoles,
    values: multipoles.map(() => new Float64Array(count)),
  };
}

function bispectrumTable(spec: NonNullable<SyntheticBundleSpec['bispectrum']>, volume: number): StatisticTable {
  const bins = enumerateTriangleBins(shellGrid(spec.kMin, spec.kMax, spec.dk));
  const nodes = effectiveTriangleNodes(bins);
  const multipoles = spec.multipoles ?? [0];
  const kf = volumeFundamentalFrequency(volume, undefined);
  const effective = new Float64Array(3 * bins.size);
  const counts = new Float64Array(bins.size);
  for (let b = 0; b < bins.size; b++) {
    effective[3 * b] = nodes.k1[b];
    effective[3 * b + 1] = nodes.k2[b];
    effective[3 * b + 2] = nodes.k3[b];
    counts[b] = binVolumeTriangleCount(Array.from(bins.centres.subarray(3 * b, 3 * b + 3)), spec.dk, kf);
  }
  return {
    statistic: 'B',
    file: 'synthetic bispectrum table',
    dk: spec.dk,
    size: bins.size,
    sides: 3,
    centres: Float64Array.from(bins.centres),
    effective,
    shells: Int32Array.from(bins.indices),
    counts,
    multipoles,
    values: multipoles.map(() => new Float64Array(bins.size)),
  };
}

/** Copy of a bundle with its data vector (and table columns) replaced by `values`. */
export function withDataValues(bundle: MeasurementBundle, values: Float64Array): MeasurementBundle {
  const tables = [bundle.power, bundle.bispectrum];
  let at = 0;
  const [power, bispectrum] = tables.map((t) => {
    if (!t) return undefined;
    const cols = t.multipoles.map(() => {
      const col = values.slice(at, at + t.size);
      at += t.size;
      return col;
    });
    return { ...t, values: cols };
  });
  return { ...bundle, power, bispectrum, dataVector: assembleDataVector([power, bispectrum]) };
}

export interface SyntheticDataOptions {
  readonly spectrum: LinearSpectrum;
  /** Model parameters of the truth (defaults of the models otherwise). */
  readonly parameters: ParameterValues;
  readonly models?: BundleModelOptions;
  /** Draw one Gaussian noise realisation from the analytic covariance with this seed. */
  readonly noiseSeed?: number;
  /** Compute the analytic covariance even without noise (default: only with noise). */
  readonly withCovariance?: boolean;
}

export function syntheticBundle(spec: SyntheticBundleSpec, options: SyntheticDataOptions): SyntheticBundle {
  const volume = spec.surveyVolume;
  const power = spec.power ? powerTable(spec.power, volume) : undefined;
  const bispectrum = spec.bispectrum ? bispectrumTable(spec.bispectrum, volume) : undefined;
  const metadata: BundleMetadata = {
    redshift: spec.redshift,
    numberDensity: spec.numberDensity,
    lineOfSight: spec.lineOfSight ?? 'midpoint',
    boxSize: undefined,
    volume,
    fiducialCosmology: spec.fiducialCosmology,
    power: power ? { table: power.file, dk: power.dk } : undefined,
    bispectrum: bispectrum ? { table: bispectrum.file, dk: bispectrum.dk } : undefined,
    covarianceMatrix: undefined,
    realisations: undefined,
  };
  const empty: MeasurementBundle = {
    folder: `(synthetic: ${spec.description ?? BUNDLE_METADATA_FILE})`,
    metadata,
    power,
    bispectrum,
    dataVector: assembleDataVector([power, bispectrum]),
  };
  const models = bundleModels(empty, options.models)(options.spectrum);
  const composite = new CompositeModel(models, empty.dataVector.entries, { P: power?.dk, B: bispectrum?.dk });
  const truth = composite.evaluate(options.parameters);
  const wantCovariance = options.noiseSeed !== undefined || options.withCovariance === true;
  let covariance: Float64Array | undefined;
  let data = truth;
  if (wantCovariance) {
    const selection = selectData(empty.dataVector.entries);
    covariance = prepareCovariance(
      { source: 'gaussian', modeCounts: 'measured', triangleCounts: 'measured' },
      { bundle: withDataValues(empty, truth), selection, theory: truth, freeParameters: 0 },
    ).matrix;
    if (options.noiseSeed !== undefined) {
      const n = truth.length;
      const factor = choleskyFactor(covariance, n, 'synthetic covariance');
      const random = new Random(options.noiseSeed);
      const z = Float64Array.from({ length: n }, () => random.normal());
      data = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        let s = truth[i];
        for (let j = 0; j <= i; j++) s += factor.lower[i * n + j] * z[j];
        data[i] = s;
      }
    }
  }
  return { bundle: withDataValues(empty, data), truth, covariance };
}
