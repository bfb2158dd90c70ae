import type { DataVectorEntry, LinearDecomposition, ParameterValues, StatisticModel } from '../../../../src/contracts/statistic-model.js';

/**
 * A test-support StatisticModel: m_i = amp * shape(k_i; tilt) + sum_j theta_j column_j(k_i),
 * non-linear in `amp`, `tilt` and exactly linear in the named `linear` parameters.
 * Columns are powers of k: column_j = (k / 0.1)^j, so they are independent.
 */
export class ToyModel implements StatisticModel {
  readonly parameterNames: readonly string[];
  readonly defaults: ParameterValues;
  constructor(
    readonly entries: readonly DataVectorEntry[],
    readonly linearParameterNames: readonly string[],
    private readonly prefix = '',
  ) {
    this.parameterNames = [`${prefix}amp`, `${prefix}tilt`, ...linearParameterNames];
    this.defaults = Object.fromEntries(this.parameterNames.map((n) => [n, n.endsWith('amp') ? 1 : 0]));
  }

  private k(i: number): number {
    return this.entries[i].k.reduce((a, b) => a + b, 0) / this.entries[i].k.length;
  }

  private column(j: number): Float64Array {
    return Float64Array.from(this.entries, (_, i) => (this.k(i) / 0.1) ** j);
  }

  private base(p: ParameterValues): Float64Array {
    const amp = p[`${this.prefix}amp`] ?? 1;
    const tilt = p[`${this.prefix}tilt`] ?? 0;
    return Float64Array.from(this.entries, (_, i) => amp * 100 * (this.k(i) / 0.1) ** (-1 + tilt));
  }

  evaluate(p: ParameterValues, out?: Float64Array): Float64Array {
    const m = this.base(p);
    this.linearParameterNames.forEach((n, j) => {
      const c = this.column(j);
      for (let i = 0; i < m.length; i++) m[i] += (p[n] ?? 0) * c[i];
    });
    if (out) {
      out.set(m);
      return out;
    }
    return m;
  }

  linearPart(p: ParameterValues, linear: readonly string[]): LinearDecomposition {
    const rest = { ...p };
    for (const n of linear) rest[n] = 0;
    return { names: [...linear], offset: this.evaluate(rest), columns: linear.map((n) => this.column(this.linearParameterNames.indexOf(n))) };
  }
}

/** Entries of one P block on k = k0 + i dk. */
export function powerEntries(block: string, k0: number, dk: number, n: number): DataVectorEntry[] {
  return Array.from({ length: n }, (_, i) => ({ block, k: [k0 + i * dk] }));
}
