import { InputErrors } from '../../contracts/input-error.js';
import { logPriorDensity, priorProblems, type PriorSpec } from './priors.js';
import { compileSafeExpression, type SafeExpression } from './safe-expression.js';

/**
 * The parameters of a fit, JSON-serialisable, one entry per name, in order:
 *   { "value": 0.6736 }                                  fixed;
 *   { "prior": {...}, "start"?: number }                 free, sampled (theta, in declared order);
 *   { "prior": {...}, "marginalise": true }             free, marginalised analytically
 *                                                        (prior gaussian without bounds, or flat);
 *   { "derived": "f * sigma8" }                          derived by a safe expression of parameters
 *                                                        declared above it and of the quantities the
 *                                                        model provides (for example sigma8).
 */
export type ParameterSpec =
  | { readonly value: number }
  | { readonly prior: PriorSpec; readonly start?: number; readonly marginalise?: boolean }
  | { readonly derived: string };

export type ParameterSpecs = Readonly<Record<string, ParameterSpec>>;

export interface MarginalisedParameter {
  readonly name: string;
  /** Gaussian prior mean and sigma; sigma = Infinity for a flat prior. */
  readonly mean: number;
  readonly sigma: number;
}

export class ParameterSpace {
  /** Sampled parameters, in theta order. */
  readonly free: readonly string[];
  readonly priors: readonly PriorSpec[];
  readonly starts: Float64Array;
  readonly fixed: Readonly<Record<string, number>>;
  readonly marginalised: readonly MarginalisedParameter[];
  readonly derived: readonly { readonly name: string; readonly expression: SafeExpression }[];

  /** `provided`: names of quantities the model computes, usable in derived expressions. */
  constructor(specs: ParameterSpecs, provided: readonly string[] = []) {
    const problems: string[] = [];
    const free: string[] = [];
    const priors: PriorSpec[] = [];
    const starts: number[] = [];
    const fixed: Record<string, number> = {};
    const marginalised: MarginalisedParameter[] = [];
    const derived: { name: string; expression: SafeExpression }[] = [];
    const known = new Set<string>(provided);
    if (typeof specs !== 'object' || specs === null) throw new InputErrors(['parameters must be an object of named parameter entries']);
    for (const [name, s] of Object.entries(specs)) {
      const key = `parameters.${name}`;
      if (!/^[A-Za-z][A-Za-z0-9_]*$/.test(name)) problems.push(`${key}: a parameter name must be letters, digits and _, starting with a letter`);
      if (typeof s !== 'object' || s === null) {
        problems.push(`${key} must be an object: { value }, { prior }, or { derived }`);
        continue;
      }
      const kinds = ['value', 'prior', 'derived'].filter((k) => k in s);
      if (kinds.length !== 1) {
        problems.push(`${key} must have exactly one of value, prior, derived (found ${kinds.join(', ') || 'none'})`);
        continue;
      }
      const allowedKeys = { value: ['value'], prior: ['prior', 'start', 'marginalise'], derived: ['derived'] }[kinds[0]] as string[];
      for (const k of Object.keys(s)) if (!allowedKeys.includes(k)) problems.push(`${key}.${k} is not a key of a ${kinds[0]} parameter (${allowedKeys.join(', ')})`);
      if ('value' in s) {
        if (typeof s.value !== 'number' || !Number.isFinite(s.value)) problems.push(`${key}.value must be a finite number, got ${JSON.stringify(s.value)}`);
        fixed[name] = s.value;
      } else if ('prior' in s) {
        const pp = priorProblems(s.prior, `${key}.prior`);
        problems.push(...pp);
        if (s.marginalise !== undefined && typeof s.marginalise !== 'boolean') problems.push(`${key}.marginalise must be true or false`);
        if (s.marginalise) {
          const p = s.prior;
          if (pp.length === 0 && !(p.kind === 'flat' || (p.kind === 'gaussian' && p.min === undefined && p.max === undefined))) {
            problems.push(`${key}: analytic marginalisation needs a gaussian prior without bounds or a flat prior, got ${p.kind}${p.kind === 'gaussian' ? ' with bounds' : ''}`);
          }
          if (s.start !== undefined) problems.push(`${key}.start has no use for a marginalised parameter`);
          marginalised.push({ name, mean: p.kind === 'gaussian' ? p.mean : 0, sigma: p.kind === 'gaussian' ? p.sigma : Infinity });
        } else {
          if (pp.length === 0 && s.prior.kind === 'flat') problems.push(`${key}: a flat (improper) prior is only allowed with "marginalise": true`);
          if (s.start !== undefined && (typeof s.start !== 'number' || !Number.isFinite(s.start))) problems.push(`${key}.start must be a finite number`);
          free.push(name);
          priors.push(s.prior);
          starts.push(s.start ?? defaultStart(s.prior));
        }
      } else {
        try {
          derived.push({ name, expression: compileSafeExpression(s.derived, known, `${key}.derived`) });
        } catch (e) {
          problems.push((e as Error).message);
        }
      }
      if (provided.includes(name)) problems.push(`${key} clashes with a quantity the model provides (${provided.join(', ')})`);
      known.add(name);
    }
    free.forEach((n, i) => {
      if (problems.length === 0 && !Number.isFinite(logPriorDensity(priors[i], starts[i]))) problems.push(`parameters.${n}.start (${starts[i]}) lies outside its prior`);
    });
    if (problems.length) throw new InputErrors(problems);
    this.free = free;
    this.priors = priors;
    this.starts = Float64Array.from(starts);
    this.fixed = fixed;
    this.marginalised = marginalised;
    this.derived = derived;
  }

  get dimension(): number {
    return this.free.length;
  }

  /** Sum of the log prior densities of the sampled parameters (-Infinity outside a support). */
  logPrior(theta: Float64Array): number {
    let s = 0;
    for (let i = 0; i < this.priors.length; i++) s += logPriorDensity(this.priors[i], theta[i]);
    return s;
  }

  /**
   * Named values at theta: fixed, sampled, then derived in declaration order.
   * `provided` quantities (from the model) are visible to derived expressions and included.
   */
  values(theta: Float64Array, provided: Readonly<Record<string, number>> = {}): Record<string, number> {
    const out: Record<string, number> = { ...provided, ...this.fixed };
    for (let i = 0; i < this.free.length; i++) out[this.free[i]] = theta[i];
    for (const d of this.derived) out[d.name] = d.expression.evaluate(out);
    return out;
  }
}

function defaultStart(p: PriorSpec): number {
  switch (p.kind) {
    case 'uniform':
      return 0.5 * (p.min + p.max);
    case 'gaussian':
      return Math.min(Math.max(p.mean, p.min ?? -Infinity), p.max ?? Infinity);
    case 'log-uniform':
      return Math.sqrt(p.min * p.max);
    case 'flat':
      return 0;
  }
}
