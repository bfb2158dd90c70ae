import type { JointLikelihood } from '../../inference/likelihood/joint-likelihood.js';
import { describeBispectrumModel } from './model-options.js';
import type { RunConfig } from './run-config.js';

/**
 * What a fit assumed, printed before it runs and written into its summary and
 * report: model order, scale cuts, covariance source, likelihood form,
 * cosmology mode and the treatment of every parameter.
 */
export interface Assumption {
  readonly key: string;
  readonly value: string;
}

const POWER_MODEL =
  'P_l: linear redshift-space (Kaiser) power with leading-order IR resummation of the BAO, k^2 mu^2n P counterterms and stochastic terms — no one-loop terms';

export function fitAssumptions(config: RunConfig, likelihood: JointLikelihood): Assumption[] {
  const d = likelihood.describe();
  const cuts = config.likelihood.cuts ? JSON.stringify(config.likelihood.cuts) : 'none (all bins of the bundle)';
  const s = config.sampler;
  const out: Assumption[] = [
    { key: 'model order', value: `${POWER_MODEL}; ${describeBispectrumModel(config.likelihood.models)}` },
    { key: 'scale cuts', value: `${cuts}; kept per block: ${d.blocks}` },
    { key: 'covariance', value: String(d.covariance) },
    { key: 'likelihood', value: `${d.likelihood}, ${d.dataPoints} data points` },
    { key: 'cosmology', value: Object.entries(likelihood.source.describe()).map(([k, v]) => `${k} = ${v}`).join('; ') },
    { key: 'sampled', value: String(d.sampled) },
    { key: 'marginalised analytically', value: String(d.marginalised) },
    { key: 'fixed', value: String(d.fixed) || 'none' },
    { key: 'derived', value: String(d.derived) },
    { key: 'sampler', value: `${s.method === 'chains' ? 'independent adaptive-Metropolis chains' : 'Goodman–Weare stretch-move ensemble'}, seed ${s.seed}${Object.keys(s.settings).length ? `, ${Object.entries(s.settings).map(([k, v]) => `${k} = ${v}`).join(', ')}` : ''}` },
  ];
  return out;
}
