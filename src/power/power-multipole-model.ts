import { InputError } from '../contracts/input-error.js';
import type { DataVectorEntry, LinearDecomposition, ParameterValues, StatisticModel } from '../contracts/statistic-model.js';
import { buildPowerModelSetup, type PowerModelOptions, type PowerModelSetup } from './power-model-setup.js';
import {
  POWER_LINEAR_NAMES,
  POWER_PARAMETER_NAMES,
  powerParameterDefaults,
  resolvePowerParameters,
  type PowerParameters,
} from './power-parameters.js';
import { evaluatePowerMultipolesDirect } from './redshift-power-direct.js';
import {
  POWER_TEMPLATE_TERMS,
  buildPowerTemplates,
  combinePowerTemplates,
  powerTemplateCoefficients,
  type PowerTemplates,
} from './power-templates.js';

/**
 * Power-spectrum multipoles P_0, P_2, P_4 per k bin as a StatisticModel. Data
 * vector order: multipole-major (all bins of the first multipole, then the next),
 * blocks named "P0", "P2", "P4". Evaluation goes through templates built for the
 * current (alphaPar, alphaPerp); a change of either rebuilds them.
 */
export class PowerMultipoleModel implements StatisticModel {
  readonly entries: readonly DataVectorEntry[];
  readonly parameterNames = POWER_PARAMETER_NAMES;
  readonly defaults: ParameterValues;
  readonly linearParameterNames = POWER_LINEAR_NAMES;
  readonly setup: PowerModelSetup;
  private readonly defaultValues: PowerParameters;
  private cached: PowerTemplates | undefined;

  constructor(options: PowerModelOptions) {
    this.setup = buildPowerModelSetup(options);
    const { sampling } = this.setup;
    const entries: DataVectorEntry[] = [];
    for (const l of sampling.multipoles) {
      for (let i = 0; i < sampling.binCount; i++) entries.push({ block: `P${l}`, k: [sampling.effectiveK[i]] });
    }
    this.entries = entries;
    this.defaultValues = powerParameterDefaults(options.spectrum.growthRateLargeScale);
    this.defaults = { ...this.defaultValues };
  }

  /** Parameters with defaults filled in and checked. */
  resolve(params: ParameterValues): PowerParameters {
    return resolvePowerParameters(params, this.defaultValues);
  }

  /** Templates at the dilations of `params` (cached for the last pair). */
  templates(params: ParameterValues = {}): PowerTemplates {
    return this.templatesFor(this.resolve(params));
  }

  private templatesFor(p: PowerParameters): PowerTemplates {
    const c = this.cached;
    if (c && c.alphaPar === p.alphaPar && c.alphaPerp === p.alphaPerp) return c;
    this.cached = buildPowerTemplates(this.setup, p.alphaPar, p.alphaPerp);
    return this.cached;
  }

  evaluate(params: ParameterValues, out?: Float64Array): Float64Array {
    const p = this.resolve(params);
    const target = out ?? new Float64Array(this.entries.length);
    if (target.length !== this.entries.length) throw new RangeError(`output has length ${target.length}, the model ${this.entries.length}`);
    return combinePowerTemplates(this.templatesFor(p), powerTemplateCoefficients(p), target);
  }

  /** The same vector from the formula point by point, without templates. */
  evaluateDirect(params: ParameterValues, out?: Float64Array): Float64Array {
    return evaluatePowerMultipolesDirect(this.setup, this.resolve(params), out);
  }

  linearPart(params: ParameterValues, linear: readonly string[]): LinearDecomposition {
    const p = this.resolve(params);
    const templates = this.templatesFor(p);
    const coefficients = powerTemplateCoefficients(p);
    const columns: Float64Array[] = [];
    const seen = new Set<string>();
    for (const name of linear) {
      if (!POWER_LINEAR_NAMES.includes(name)) {
        throw new InputError(`linear parameter ${name} is not one the power model is linear in (${POWER_LINEAR_NAMES.join(', ')})`);
      }
      if (seen.has(name)) throw new InputError(`linear parameter ${name} is listed twice`);
      seen.add(name);
      const t = (POWER_TEMPLATE_TERMS as readonly string[]).indexOf(name);
      coefficients[t] = 0;
      columns.push(Float64Array.from(templates.columns[t]));
    }
    const offset = combinePowerTemplates(templates, coefficients, new Float64Array(this.entries.length));
    return { names: [...linear], offset, columns };
  }
}
