import { InputError } from '../../contracts/input-error.js';
import { loadMeasurementBundle } from '../../data/measurement-bundle.js';
import { createJointLikelihood } from '../../inference/likelihood/joint-likelihood-options.js';
import { modelVectorAt } from './model-at-point.js';
import type { RunConfig } from './run-config.js';

/**
 * The model of a run config over the bundle's whole data vector as CSV, at the
 * sampled parameters' starts (or the truth, when the config names one) with
 * `overrides` on top; the analytically marginalised parameters at their
 * conditional best fit there. Columns: block, k1[, k2, k3], data, sigma
 * (square root of the covariance diagonal; empty for cut entries), model,
 * (data - model) / sigma, and whether the entry survives the cuts.
 */
export function evaluateModelCsv(config: RunConfig, options: { at?: 'start' | 'truth'; overrides?: Readonly<Record<string, number>> } = {}): string {
  const likelihood = createJointLikelihood(config.likelihood);
  const bundle = loadMeasurementBundle(config.likelihood.bundle);
  const free = likelihood.parameters.free;
  if (options.at === 'truth' && !config.truth) throw new InputError(`${config.file}: --at truth needs a "truth" file in the config`);
  const base: Record<string, number> = options.at === 'truth' && config.truth ? { ...config.truth } : {};
  const theta = Float64Array.from(free, (name, i) => options.overrides?.[name] ?? base[name] ?? likelihood.parameters.starts[i]);
  for (const name of Object.keys(options.overrides ?? {})) {
    if (!free.includes(name)) throw new InputError(`--set ${name}: not a sampled parameter of this config (sampled: ${free.join(', ')})`);
  }
  const point = likelihood.pointAt(theta, { bestFit: true });
  const model = modelVectorAt(likelihood, bundle, { ...point.values, ...(point.marginalised ?? {}) });
  const kept = new Map<number, number>();
  likelihood.selection.indices.forEach((i, a) => kept.set(i, a));
  const n = likelihood.covariance.size;
  const lines = ['block,k1,k2,k3,data,sigma,model,residual_sigma,kept'];
  bundle.dataVector.entries.forEach((e, i) => {
    const a = kept.get(i);
    const sigma = a === undefined ? Number.NaN : Math.sqrt(likelihood.covariance.matrix[a * n + a]);
    const data = bundle.dataVector.values[i];
    const k = [e.k[0], e.k[1] ?? '', e.k[2] ?? ''];
    lines.push([e.block, ...k, data, Number.isNaN(sigma) ? '' : sigma, model[i], Number.isNaN(sigma) ? '' : (data - model[i]) / sigma, a === undefined ? 'no' : 'yes'].join(','));
  });
  const header = [`# model of ${config.file} at ${options.at ?? 'start'}${options.overrides && Object.keys(options.overrides).length ? ` with ${Object.entries(options.overrides).map(([k, v]) => `${k}=${v}`).join(', ')}` : ''}`, `# chi2 = ${point.chi2.toFixed(3)} for ${point.dof} dof over the kept entries`];
  return `${[...header, ...lines].join('\n')}\n`;
}
