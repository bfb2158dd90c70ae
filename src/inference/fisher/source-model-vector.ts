import type { ParameterValues, StatisticModel } from '../../contracts/statistic-model.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { CompositeModel } from '../likelihood/composite-model.js';
import type { ModelSource } from '../likelihood/model-source.js';

/**
 * The full-length model vector of a bundle as a function of named parameter
 * values, through a likelihood's ModelSource (so cosmology parameters rebuild
 * the linear spectrum and the AP dilations exactly as in a fit), and the exact
 * columns of the parameters the models are linear in. Full vectors are
 * memoised by parameter values: Fisher matrices of several data cuts then
 * share one set of model evaluations.
 */
export class SourceModelVector {
  private composite: { models: readonly StatisticModel[]; model: CompositeModel } | undefined;
  private readonly memo = new Map<string, Float64Array>();

  constructor(
    readonly bundle: MeasurementBundle,
    readonly source: ModelSource,
  ) {}

  private compositeFor(models: readonly StatisticModel[]): CompositeModel {
    if (this.composite?.models !== models) {
      const { bundle } = this;
      this.composite = { models, model: new CompositeModel(models, bundle.dataVector.entries, { P: bundle.power?.dk, B: bundle.bispectrum?.dk }) };
    }
    return this.composite.model;
  }

  /** Names the composite model is exactly linear in (every model reading the name is linear in it). */
  linearNames(values: ParameterValues): string[] {
    const models = this.source.prepare(values).models;
    return this.compositeFor(models).parameterNames.filter((n) => models.every((m) => !m.parameterNames.includes(n) || m.linearParameterNames.includes(n)));
  }

  evaluate(values: ParameterValues): Float64Array {
    const key = Object.entries(values)
      .sort(([a], [b]) => (a < b ? -1 : 1))
      .map(([k, v]) => `${k}=${v}`)
      .join(',');
    let v = this.memo.get(key);
    if (!v) {
      const prepared = this.source.prepare(values);
      v = this.compositeFor(prepared.models).evaluate(prepared.modelValues);
      this.memo.set(key, v);
    }
    return v;
  }

  /** d model / d name for each of `linear` (names the models are linear in), at `values`. */
  linearColumns(values: ParameterValues, linear: readonly string[]): Record<string, Float64Array> {
    const prepared = this.source.prepare(values);
    const part = this.compositeFor(prepared.models).linearPart(prepared.modelValues, linear);
    return Object.fromEntries(linear.map((n, j) => [n, part.columns[j]]));
  }
}
