import { InputError } from '../contracts/input-error.js';
import type { ParameterValues } from '../contracts/statistic-model.js';

/**
 * Parameters of the power-spectrum multipole model (docs/conventions.md, power
 * section). The model is exactly linear in the counterterm and stochastic
 * amplitudes, and a polynomial of degree 2 in (b1, f) at fixed alphas.
 */
export const POWER_COUNTERTERM_NAMES = ['pCt0', 'pCt2', 'pCt4', 'pCtFog'] as const;
export const POWER_STOCHASTIC_NAMES = ['pStochConst', 'pStochK2Mu2'] as const;
export const POWER_LINEAR_NAMES: readonly string[] = [...POWER_COUNTERTERM_NAMES, ...POWER_STOCHASTIC_NAMES];
export const POWER_PARAMETER_NAMES: readonly string[] = ['b1', 'f', 'alphaPar', 'alphaPerp', ...POWER_LINEAR_NAMES];

export interface PowerParameters {
  readonly b1: number;
  /** Large-scale growth rate; f(k) = f growthRate(k) / growthRateLargeScale. */
  readonly f: number;
  readonly alphaPar: number;
  readonly alphaPerp: number;
  /** Counterterms -k^2 (pCt0 + pCt2 mu^2 + pCt4 mu^4) P, in (Mpc/h)^2. */
  readonly pCt0: number;
  readonly pCt2: number;
  readonly pCt4: number;
  /** Fingers-of-god counterterm -pCtFog k^4 mu^4 P, in (Mpc/h)^4. */
  readonly pCtFog: number;
  /** Stochastic term (pStochConst + pStochK2Mu2 k^2 mu^2) / nbar; Poisson: 1 and 0. */
  readonly pStochConst: number;
  readonly pStochK2Mu2: number;
}

export function powerParameterDefaults(growthRate: number): PowerParameters {
  return {
    b1: 1,
    f: growthRate,
    alphaPar: 1,
    alphaPerp: 1,
    pCt0: 0,
    pCt2: 0,
    pCt4: 0,
    pCtFog: 0,
    pStochConst: 1,
    pStochK2Mu2: 0,
  };
}

/** Fill missing values from `defaults`; other names (a joint fit's) are ignored. */
export function resolvePowerParameters(params: ParameterValues, defaults: PowerParameters): PowerParameters {
  const out: Record<string, number> = {};
  for (const name of POWER_PARAMETER_NAMES) {
    const v = params[name] ?? defaults[name as keyof PowerParameters];
    if (!Number.isFinite(v)) throw new InputError(`parameter ${name} must be a finite number, got ${v}`);
    out[name] = v;
  }
  for (const name of ['alphaPar', 'alphaPerp']) {
    if (!(out[name] > 0)) throw new InputError(`parameter ${name} must be positive, got ${out[name]}`);
  }
  return out as unknown as PowerParameters;
}
