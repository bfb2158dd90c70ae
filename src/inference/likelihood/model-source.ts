import type { LinearSpectrum } from '../../contracts/linear-spectrum.js';
import type { ParameterValues, StatisticModel } from '../../contracts/statistic-model.js';

/**
 * Where the likelihood gets its models, and how cosmology enters (two modes):
 *   full:            a new linear spectrum, and new models, whenever a cosmology
 *                    parameter changes (the last build is cached);
 *   fixed-template:  the linear spectrum's shape is fixed at a template cosmology;
 *                    sampled are alphaPar, alphaPerp (passed to the models), fsigma8
 *                    and templateAmplitude q = sigma8 / sigma8_template. The models
 *                    see f = fsigma8 / (q sigma8_template) and a linear power
 *                    q^2 P_template; they are rebuilt only when q changes.
 * `provided` quantities (sigma8, f, fsigma8 of the current spectrum) are
 * reported with every point and usable in derived-parameter expressions.
 */
export interface PreparedModels {
  readonly models: readonly StatisticModel[];
  /** Values to hand to the models (the sampled ones, mapped). */
  readonly modelValues: ParameterValues;
  readonly provided: Readonly<Record<string, number>>;
}

export interface ModelSource {
  readonly mode: 'full' | 'fixed-template' | 'fixed-models';
  /** Quantities in `provided`. */
  readonly providedNames: readonly string[];
  /** Parameter names the source itself reads (and which must be declared). */
  readonly requiredNames: readonly string[];
  prepare(values: ParameterValues): PreparedModels;
  describe(): Readonly<Record<string, string | number>>;
}

export type ModelsForSpectrum = (spectrum: LinearSpectrum) => readonly StatisticModel[];

const PROVIDED = ['sigma8', 'fsigma8', 'growthRate'] as const;

function spectrumQuantities(s: LinearSpectrum, f: number): Record<string, number> {
  return { sigma8: s.sigma8, fsigma8: f * s.sigma8, growthRate: s.growthRateLargeScale };
}

/** Full mode: `spectrumFor` builds the linear spectrum from the cosmology parameters `names`. */
export function fullCosmologySource(names: readonly string[], spectrumFor: (cosmology: ParameterValues) => LinearSpectrum, build: ModelsForSpectrum): ModelSource {
  let key = '';
  let cache: { spectrum: LinearSpectrum; models: readonly StatisticModel[] } | undefined;
  return {
    mode: 'full',
    providedNames: PROVIDED,
    requiredNames: names,
    prepare(values) {
      const cosmology: Record<string, number> = {};
      for (const n of names) cosmology[n] = values[n];
      const k = names.map((n) => cosmology[n]).join(',');
      if (!cache || k !== key) {
        const spectrum = spectrumFor(cosmology);
        cache = { spectrum, models: build(spectrum) };
        key = k;
      }
      const f = values.f ?? cache.spectrum.growthRateLargeScale;
      return { models: cache.models, modelValues: { ...values, f }, provided: spectrumQuantities(cache.spectrum, f) };
    },
    describe: () => ({ cosmologyMode: 'full', cosmologyParameters: names.join(', ') }),
  };
}

/** The template spectrum scaled by q^2 in power (q in sigma8; the BAO damping integrals scale with P). */
export function scaledSpectrum(s: LinearSpectrum, q: number): LinearSpectrum {
  if (q === 1) return s;
  const q2 = q * q;
  return {
    redshift: s.redshift,
    kMin: s.kMin,
    kMax: s.kMax,
    power: (k) => q2 * s.power(k),
    powerNoWiggle: (k) => q2 * s.powerNoWiggle(k),
    growthRate: (k) => s.growthRate(k),
    growthRateLargeScale: s.growthRateLargeScale,
    sigma2BAO: q2 * s.sigma2BAO,
    deltaSigma2BAO: q2 * s.deltaSigma2BAO,
    sigma8: q * s.sigma8,
  };
}

export const TEMPLATE_PARAMETERS = ['alphaPar', 'alphaPerp', 'fsigma8', 'templateAmplitude'] as const;

export function fixedTemplateSource(template: LinearSpectrum, build: ModelsForSpectrum): ModelSource {
  let cache: { q: number; models: readonly StatisticModel[] } | undefined;
  return {
    mode: 'fixed-template',
    providedNames: ['sigma8', 'f'],
    requiredNames: TEMPLATE_PARAMETERS,
    prepare(values) {
      const q = values.templateAmplitude;
      if (!cache || cache.q !== q) cache = { q, models: build(scaledSpectrum(template, q)) };
      const sigma8 = q * template.sigma8;
      const f = values.fsigma8 / sigma8;
      return { models: cache.models, modelValues: { ...values, f }, provided: { sigma8, f } };
    },
    describe: () => ({ cosmologyMode: 'fixed-template', templateSigma8: template.sigma8, templateRedshift: template.redshift }),
  };
}

/** Models fixed once and for all (tests, or a fit at a known linear spectrum). */
export function fixedModelSource(models: readonly StatisticModel[]): ModelSource {
  return {
    mode: 'fixed-models',
    providedNames: [],
    requiredNames: [],
    prepare: (values) => ({ models, modelValues: values, provided: {} }),
    describe: () => ({ cosmologyMode: 'fixed models' }),
  };
}
