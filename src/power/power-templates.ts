import { irResummedPower } from '../perturbation/ir-resummed-power.js';
import { apVolumeFactor } from './alcock-paczynski.js';
import { reduceToMultipoles } from './bin-sampling.js';
import { trueCoordinates, type PowerModelSetup } from './power-model-setup.js';
import type { PowerParameters } from './power-parameters.js';

/**
 * At fixed linear power and fixed (alphaPar, alphaPerp) the multipole vector is
 *   b1^2 T_b1b1 + b1 f T_b1f + f^2 T_ff + sum_a theta_a T_a
 * over the counterterm and stochastic amplitudes theta_a (the expansion of the
 * formula in redshift-power-direct.ts). Each T is a bin-averaged multipole
 * vector, so re-evaluation is a dot product of length POWER_TEMPLATE_TERMS.length.
 */
export const POWER_TEMPLATE_TERMS = ['b1*b1', 'b1*f', 'f*f', 'pCt0', 'pCt2', 'pCt4', 'pCtFog', 'pStochConst', 'pStochK2Mu2'] as const;

export interface PowerTemplates {
  readonly alphaPar: number;
  readonly alphaPerp: number;
  readonly terms: readonly string[];
  /** One multipole vector (multipole-major, like the model's entries) per term. */
  readonly columns: readonly Float64Array[];
}

export function buildPowerTemplates(setup: PowerModelSetup, alphaPar: number, alphaPerp: number): PowerTemplates {
  const { spectrum, sampling, nbar, dampingGrowthRate } = setup;
  const { q, nu } = trueCoordinates(setup, alphaPar, alphaPerp);
  const volume = apVolumeFactor(alphaPar, alphaPerp);
  const n = q.length;
  const point = POWER_TEMPLATE_TERMS.map(() => new Float64Array(n));
  let lastQ = Number.NaN;
  let r = 0;
  for (let j = 0; j < n; j++) {
    const q2 = q[j] * q[j];
    const n2 = nu[j] * nu[j];
    if (q[j] !== lastQ) {
      r = spectrum.growthRate(q[j]) / spectrum.growthRateLargeScale; // points of equal q are adjacent
      lastQ = q[j];
    }
    const pv = irResummedPower(spectrum, q[j], nu[j], dampingGrowthRate) * volume;
    const kmu2 = (sampling.k[j] * sampling.mu[j]) ** 2;
    point[0][j] = pv;
    point[1][j] = 2 * r * n2 * pv;
    point[2][j] = r * r * n2 * n2 * pv;
    point[3][j] = -q2 * pv;
    point[4][j] = -q2 * n2 * pv;
    point[5][j] = -q2 * n2 * n2 * pv;
    point[6][j] = -q2 * q2 * n2 * n2 * pv;
    point[7][j] = 1 / nbar;
    point[8][j] = kmu2 / nbar;
  }
  const size = sampling.weights.length * sampling.binCount;
  const columns = point.map((v) => reduceToMultipoles(sampling, v, new Float64Array(size)));
  return { alphaPar, alphaPerp, terms: POWER_TEMPLATE_TERMS, columns };
}

/** Coefficients of the template terms, in POWER_TEMPLATE_TERMS order. */
export function powerTemplateCoefficients(p: PowerParameters): Float64Array {
  return Float64Array.of(p.b1 * p.b1, p.b1 * p.f, p.f * p.f, p.pCt0, p.pCt2, p.pCt4, p.pCtFog, p.pStochConst, p.pStochK2Mu2);
}

/** out = sum_t coefficients[t] columns[t]. */
export function combinePowerTemplates(templates: PowerTemplates, coefficients: Float64Array, out: Float64Array): Float64Array {
  const { columns } = templates;
  out.fill(0);
  for (let t = 0; t < columns.length; t++) {
    const c = coefficients[t];
    if (c === 0) continue;
    const col = columns[t];
    for (let e = 0; e < out.length; e++) out[e] += c * col[e];
  }
  return out;
}
