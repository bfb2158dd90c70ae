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
 * `provided` quantities (sigma8Cold, the growth rate, fsigma8, the dilations) are
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

/** Quantities each cosmology mode provides to derived expressions (names a parameter may not take). */
export const PROVIDED_QUANTITIES: Readonly<Record<'full' | 'fixed-template', readonly string[]>> = {
  full: ['sigma8Cold', 'fsigma8', 'growthRate', 'alphaPar', 'alphaPerp', 'sigma8Today', 'omegaMatter'],
  'fixed-template': ['sigma8Cold', 'f'],
};

/** What full mode builds from the cosmology parameters: the spectrum and the AP dilations. */
export interface CosmologyBuild {
  readonly spectrum: LinearSpectrum;
  /** Dilations relative to the measurement's fiducial cosmology; default 1. */
  readonly alphaPar?: number;
  readonly alphaPerp?: number;
  /** sigma8 of the total matter at z = 0 and Omega_m today, when known. */
  readonly sigma8Today?: number;
  readonly omegaMatter?: number;
}

/**
 * Full mode: `build` makes the linear spectrum (and AP dilations) from the
 * cosmology parameters `names`. The models see the computed dilations and
 * f = the spectrum's large-scale growth rate unless f is a declared parameter.
 */
export function fullCosmologySource(names: readonly string[], cosmologyFor: (cosmology: ParameterValues) => CosmologyBuild, build: ModelsForSpectrum): ModelSource {
  let key = '';
  let cache: { cosmology: CosmologyBuild; models: readonly StatisticModel[] } | undefined;
  return {
    mode: 'full',
    providedNames: PROVIDED_QUANTITIES.full,
    requiredNames: names,
    prepare(values) {
      const cosmology: Record<string, number> = {};
      for (const n of names) cosmology[n] = values[n];
      const k = names.map((n) => cosmology[n]).join(',');
      if (!cache || k !== key) {
        const c = cosmologyFor(cosmology);
        cache = { cosmology: c, models: build(c.spectrum) };
        key = k;
      }
      const { spectrum } = cache.cosmology;
      const f = values.f ?? spectrum.growthRateLargeScale;
      const alphaPar = cache.cosmology.alphaPar ?? 1;
      const alphaPerp = cache.cosmology.alphaPerp ?? 1;
      return {
        models: cache.models,
        modelValues: { ...values, f, alphaPar, alphaPerp },
        provided: {
          sigma8Cold: spectrum.sigma8,
          fsigma8: f * spectrum.sigma8,
          growthRate: spectrum.growthRateLargeScale,
          alphaPar,
          alphaPerp,
          sigma8Today: cache.cosmology.sigma8Today ?? Number.NaN,
          omegaMatter: cache.cosmology.omegaMatter ?? Number.NaN,
        },
      };
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
    providedNames: PROVIDED_QUANTITIES['fixed-template'],
    requiredNames: TEMPLATE_PARAMETERS,
    prepare(values) {
      const q = values.templateAmplitude;
      if (!cache || cache.q !== q) cache = { q, models: build(scaledSpectrum(template, q)) };
      const sigma8 = q * template.sigma8;
      const f = values.fsigma8 / sigma8;
      return { models: cache.models, modelValues: { ...values, f }, provided: { sigma8Cold: sigma8, f } };
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
