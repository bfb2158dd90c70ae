import { InputError } from '../../contracts/input-error.js';
import type { ParameterValues } from '../../contracts/statistic-model.js';
import { backgroundOf } from '../../cosmology/background.js';
import { COSMOLOGY_FIELDS, validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology, type LinearPowerOptions } from '../../cosmology/linear-power-from-cosmology.js';
import { prepareCovariance, type PreparedCovariance } from '../../data/covariance/covariance-choice.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { selectData } from '../../data/scale-cuts.js';
import { SourceModelVector } from '../../inference/fisher/source-model-vector.js';
import { apDilations } from '../../inference/likelihood/alcock-paczynski-dilations.js';
import { bundleModels, type BundleModelOptions } from '../../inference/likelihood/bundle-models.js';
import { fullCosmologySource } from '../../inference/likelihood/model-source.js';
import { shellGrid } from '../../bispectrum/triangle-bins.js';
import { syntheticBundle } from '../synthetic/synthetic-bundle.js';
import type { SurveyBin } from './survey.js';

/**
 * The model side of a forecast for one redshift bin: an in-memory bundle on
 * the forecast bins (syntheticBundle, data = the model at the fiducial point;
 * survey-volume mode counts and mean wavenumbers), the model vector through a full-cosmology model source
 * (cosmology parameters rebuild the linear spectrum and so the growth rate f,
 * and move the AP dilations relative to the fiducial background, as in a
 * full-mode fit), the fiducial point, and the analytic Gaussian covariance
 * there (continuous mode counts, bin-volume triangle counts, no P x B cross
 * term, no super-sample or non-Gaussian terms). The Gaussian B variance needs
 * the model P_0 at every triangle side, so the bundle's power bins reach the
 * bispectrum's largest k (or, without P bins, are P_0 on the triangle
 * shells); P entries beyond the power kMax enter only that variance.
 */
/** Shell centres kMin, kMin + dk, ... up to kMax (h/Mpc), and the multipoles. */
export interface ShellBinning {
  readonly kMin: number;
  readonly kMax: number;
  readonly dk: number;
  readonly multipoles: readonly number[];
}

export interface BinForecastInputs {
  readonly bin: SurveyBin;
  readonly cosmology: Readonly<Record<string, number>>;
  /** Parameters of the forecast: cosmology names and model parameters. */
  readonly names: readonly string[];
  /** Fiducial values of model parameters (overriding the survey bias and the model defaults). */
  readonly nuisance?: ParameterValues;
  readonly power?: ShellBinning;
  readonly bispectrum?: ShellBinning;
  readonly steps?: Readonly<Record<string, number>>;
  readonly linearPower?: LinearPowerOptions;
  readonly models?: BundleModelOptions;
  readonly label?: string;
}

export interface BinForecastSetup {
  readonly bundle: MeasurementBundle;
  readonly vector: SourceModelVector;
  readonly fiducial: Readonly<Record<string, number>>;
  /** Model parameters read by the power and by the bispectrum model (empty for a statistic left out). */
  readonly readByPower: ReadonlySet<string>;
  readonly readByBispectrum: ReadonlySet<string>;
  /** Full-vector covariance. */
  readonly covariance: PreparedCovariance;
  /** P entries up to this k belong to the power data (with rounding slack). */
  readonly powerKMax: number;
}

export function binForecastSetup(inp: BinForecastInputs): BinForecastSetup {
  const { bin } = inp;
  const label = inp.label ?? 'survey bin';
  const b = inp.bispectrum;
  if (!(bin.volume > 0) || !Number.isFinite(bin.volume)) throw new InputError(`${label}: volume must be positive, got ${bin.volume}`, { where: 'volume' });
  if (!(bin.nbar > 0) || !Number.isFinite(bin.nbar)) throw new InputError(`${label}: nbar must be positive, got ${bin.nbar}`, { where: 'nbar' });
  if (!inp.power && !b) throw new InputError(`${label}: neither power nor bispectrum bins were given`);
  const covered = inp.power ? { ...inp.power, kMax: Math.max(inp.power.kMax, b?.kMax ?? 0) } : { ...(b as ShellBinning), multipoles: [0] };
  const powerKMax = (inp.power?.kMax ?? -1) * (1 + 1e-9);
  const cosmologyNames = inp.names.filter((n) => n in COSMOLOGY_FIELDS);
  const fiducialCosmology = validateCosmology(inp.cosmology, { path: 'cosmology' });
  const { bundle } = syntheticBundle(
    {
      description: label,
      redshift: bin.zEff,
      numberDensity: bin.nbar,
      surveyVolume: bin.volume,
      fiducialCosmology: inp.cosmology,
      power: { kMin: covered.kMin, dk: covered.dk, count: shellGrid(covered.kMin, covered.kMax, covered.dk).count, multipoles: covered.multipoles },
      bispectrum: b,
    },
    { spectrum: linearPowerFromCosmology(fiducialCosmology, bin.zEff, inp.linearPower), parameters: { ...bin.bias, ...inp.nuisance }, models: inp.models },
  );
  const fiducialBackground = backgroundOf(fiducialCosmology);
  const source = fullCosmologySource(
    cosmologyNames,
    (values) => {
      const params = validateCosmology({ ...inp.cosmology, ...values }, { path: 'parameters' });
      const spectrum = linearPowerFromCosmology(params, bin.zEff, inp.linearPower);
      return { spectrum, ...apDilations(spectrum.background, fiducialBackground, bin.zEff) };
    },
    bundleModels(bundle, inp.models),
  );
  const vector = new SourceModelVector(bundle, source);
  const fiducial: Record<string, number> = { ...bin.bias, ...inp.nuisance };
  for (const n of cosmologyNames) fiducial[n] = inp.cosmology[n] ?? (fiducialCosmology as unknown as Record<string, number>)[n];
  const models = source.prepare(fiducial).models;
  for (const n of inp.names) for (const m of models) if (fiducial[n] === undefined && m.defaults[n] !== undefined) fiducial[n] = m.defaults[n];
  const readBy = (statistic: 'P' | 'B') => new Set(models.filter((m) => m.entries[0]?.block.startsWith(statistic)).flatMap((m) => m.parameterNames));
  const readByPower = inp.power ? readBy('P') : new Set<string>();
  const readByBispectrum = b ? readBy('B') : new Set<string>();
  for (const n of inp.names) {
    if (!(n in COSMOLOGY_FIELDS) && !readByPower.has(n) && !readByBispectrum.has(n)) {
      throw new InputError(`parameters: "${n}" is neither a cosmology parameter nor read by the models (they read: ${[...new Set([...readByPower, ...readByBispectrum])].join(', ')})`, { where: `parameters.${n}` });
    }
  }
  const theory = vector.evaluate(fiducial);
  const all = selectData(bundle.dataVector.entries);
  const covariance = prepareCovariance({ source: 'gaussian', modeCounts: 'continuous', triangleCounts: 'bin-volume' }, { bundle, selection: all, theory, freeParameters: inp.names.length });
  return { bundle, vector, fiducial, readByPower, readByBispectrum, covariance, powerKMax };
}
