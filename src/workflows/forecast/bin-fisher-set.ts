import { InputError } from '../../contracts/input-error.js';
import type { ParameterValues } from '../../contracts/statistic-model.js';
import { backgroundOf } from '../../cosmology/background.js';
import { COSMOLOGY_FIELDS, validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology, type LinearPowerOptions } from '../../cosmology/linear-power-from-cosmology.js';
import { prepareCovariance } from '../../data/covariance/covariance-choice.js';
import { selectData, selectMatrix } from '../../data/scale-cuts.js';
import type { FisherMatrix } from '../../inference/fisher/fisher-matrix.js';
import { selectionFisher } from '../../inference/fisher/selection-fisher.js';
import { SourceModelVector } from '../../inference/fisher/source-model-vector.js';
import { apDilations } from '../../inference/likelihood/alcock-paczynski-dilations.js';
import { bundleModels, type BundleModelOptions } from '../../inference/likelihood/bundle-models.js';
import { fullCosmologySource } from '../../inference/likelihood/model-source.js';
import { binningBundle, type ShellBinning } from './binning-bundle.js';
import type { SurveyBin } from './survey.js';

/**
 * Fisher matrices of one redshift bin of a survey for P alone, B alone and
 * P + B, from one set of model evaluations. The data vector is P_l on the
 * power bins and B_l on the triangle bins; the covariance is the analytic
 * Gaussian one (src/data/covariance) at the fiducial point, with continuous
 * mode counts and bin-volume triangle counts for the bin's volume, no P x B
 * cross term, no super-sample or non-Gaussian terms. Cosmology parameters
 * rebuild the linear spectrum (and so the growth rate f) and move the AP
 * dilations relative to the fiducial background, as in a full-mode fit.
 * Each statistic's matrix lists only the parameters it reads. The Gaussian B
 * variance needs the model P_0 at every triangle side, so the bundle's power
 * bins reach the bispectrum's largest k (or, without P bins, are P_0 on the
 * triangle shells); P entries beyond the power kMax enter only that variance.
 */
export interface BinFisherInputs {
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

export interface BinFisherSet {
  readonly fiducial: ParameterValues;
  readonly power: FisherMatrix | undefined;
  readonly bispectrum: FisherMatrix | undefined;
  readonly joint: FisherMatrix;
  readonly dataPoints: { readonly power: number; readonly bispectrum: number };
}

export function binFisherSet(inp: BinFisherInputs): BinFisherSet {
  const { bin } = inp;
  const label = inp.label ?? 'survey bin';
  const b = inp.bispectrum;
  const covered = inp.power ? { ...inp.power, kMax: Math.max(inp.power.kMax, b?.kMax ?? 0) } : b && { ...b, multipoles: [0] };
  const bundle = binningBundle({ redshift: bin.zEff, numberDensity: bin.nbar, volume: bin.volume, fiducialCosmology: inp.cosmology, power: covered, bispectrum: b, label });
  const powerKMax = (inp.power?.kMax ?? -1) * (1 + 1e-9);
  const cosmologyNames = inp.names.filter((n) => n in COSMOLOGY_FIELDS);
  const fiducialCosmology = validateCosmology(inp.cosmology, { path: 'cosmology' });
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
  const readP = inp.power ? readBy('P') : new Set<string>();
  const readB = b ? readBy('B') : new Set<string>();
  for (const n of inp.names) {
    if (!(n in COSMOLOGY_FIELDS) && !readP.has(n) && !readB.has(n)) {
      throw new InputError(`parameters: "${n}" is neither a cosmology parameter nor read by the models (they read: ${[...new Set([...readP, ...readB])].join(', ')})`, { where: `parameters.${n}` });
    }
  }
  const theory = vector.evaluate(fiducial);
  const all = selectData(bundle.dataVector.entries);
  const covariance = prepareCovariance({ source: 'gaussian', modeCounts: 'continuous', triangleCounts: 'bin-volume' }, { bundle, selection: all, theory, freeParameters: inp.names.length });
  const full = bundle.dataVector.entries.length;
  const fisherOf = (statistics: readonly ('P' | 'B')[], names: readonly string[]) => {
    const used = (e: (typeof bundle.dataVector.entries)[number]) => statistics.includes(e.statistic) && (e.statistic === 'B' || e.k[0] <= powerKMax);
    const indices = Int32Array.from(bundle.dataVector.entries.flatMap((e, i) => (used(e) ? [i] : [])));
    return selectionFisher({ vector, names, fiducial, indices, covariance: selectMatrix(covariance.matrix, full, indices), steps: inp.steps, label: `${label} covariance` });
  };
  const namesFor = (read: Set<string>) => inp.names.filter((n) => n in COSMOLOGY_FIELDS || read.has(n));
  const statistics = [...(inp.power ? ['P' as const] : []), ...(b ? ['B' as const] : [])];
  return {
    fiducial,
    power: inp.power ? fisherOf(['P'], namesFor(readP)) : undefined,
    bispectrum: bundle.bispectrum ? fisherOf(['B'], namesFor(readB)) : undefined,
    joint: fisherOf(statistics, inp.names),
    dataPoints: {
      power: bundle.dataVector.entries.filter((e) => e.statistic === 'P' && e.k[0] <= powerKMax).length,
      bispectrum: bundle.dataVector.entries.filter((e) => e.statistic === 'B').length,
    },
  };
}
