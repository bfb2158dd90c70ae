import { InputError } from '../../contracts/input-error.js';
import type { LinearDecomposition, ParameterValues, StatisticModel } from '../../contracts/statistic-model.js';
import type { MeasuredEntry } from '../../data/data-vector.js';

/**
 * Several StatisticModels (the power multipoles, the bispectrum) side by side
 * as one model of the bundle's full data vector. Their entries, concatenated,
 * must be the bundle's entries in order: same block, and every wavenumber of
 * the model entry inside the measured bin (|k_model - centre| <= dk/2).
 * A linear parameter is a column over all models (zero where a model does not
 * read it); a model that reads it must be linear in it.
 */
export class CompositeModel {
  readonly size: number;
  private readonly offsets: readonly number[];

  constructor(readonly models: readonly StatisticModel[], entries: readonly MeasuredEntry[], dk: { P?: number; B?: number }) {
    let at = 0;
    const offsets: number[] = [];
    for (const [mi, m] of models.entries()) {
      offsets.push(at);
      for (const [j, e] of m.entries.entries()) {
        const d = entries[at + j];
        const where = `model ${mi + 1}, entry ${j + 1}`;
        if (!d) throw new InputError(`${where} (${e.block}): the models have more entries than the data vector (${entries.length})`);
        const width = dk[d.statistic] ?? 0;
        const fits = e.block === d.block && e.k.length === d.k.length && e.k.every((k, s) => Math.abs(k - d.k[s]) <= 0.5 * width * (1 + 1e-9));
        if (!fits) throw new InputError(`${where} is ${e.block} at k = ${e.k.join(', ')} but data-vector entry ${at + j + 1} is ${d.block} in the bin centred at k = ${d.k.join(', ')}`);
      }
      at += m.entries.length;
    }
    if (at !== entries.length) throw new InputError(`the models have ${at} entries, the data vector ${entries.length}`);
    this.size = at;
    this.offsets = offsets;
  }

  /** Names any model reads. */
  get parameterNames(): string[] {
    return [...new Set(this.models.flatMap((m) => m.parameterNames))];
  }

  /** Refuse to marginalise a name no model is linear in, or one a model reads non-linearly. */
  checkLinear(names: readonly string[]): void {
    for (const name of names) {
      const readers = this.models.filter((m) => m.parameterNames.includes(name));
      if (readers.length === 0) throw new InputError(`parameters.${name}: marginalised analytically, but no model reads it`, { where: `parameters.${name}` });
      readers.forEach((m, i) => {
        if (!m.linearParameterNames.includes(name)) throw new InputError(`parameters.${name}: marginalised analytically, but model ${i + 1} is not linear in it (linear: ${m.linearParameterNames.join(', ')})`, { where: `parameters.${name}` });
      });
    }
  }

  evaluate(params: ParameterValues, out = new Float64Array(this.size)): Float64Array {
    this.models.forEach((m, i) => out.set(m.evaluate(params), this.offsets[i]));
    return out;
  }

  linearPart(params: ParameterValues, linear: readonly string[]): LinearDecomposition {
    const offset = new Float64Array(this.size);
    const columns = linear.map(() => new Float64Array(this.size));
    this.models.forEach((m, i) => {
      const mine = linear.filter((n) => m.linearParameterNames.includes(n));
      const part = m.linearPart(params, mine);
      offset.set(part.offset, this.offsets[i]);
      part.names.forEach((n, j) => columns[linear.indexOf(n)].set(part.columns[j], this.offsets[i]));
    });
    return { names: [...linear], offset, columns };
  }
}
