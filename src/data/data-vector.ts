import type { DataVectorEntry } from '../contracts/statistic-model.js';
import type { StatisticTable } from './statistic-table.js';

/**
 * The measured data vector: blocks P0, P2, ... (each over the k bins in
 * increasing k) then B0, B2, ... (each over the triangle bins in table order).
 * This is the order of a covariance-matrix file and of every model vector.
 */
export interface MeasuredEntry extends DataVectorEntry {
  readonly statistic: 'P' | 'B';
  readonly ell: number;
  /** Bin centres (one for P, three with k1 >= k2 >= k3 for B). */
  readonly k: readonly number[];
  readonly kEffective: readonly number[];
  /** Shell indices of the centres on their grid. */
  readonly shells: readonly number[];
  /** Mode count (P) or fundamental-triangle count (B). */
  readonly count: number;
  /** Row of the bin in its table (0-based). */
  readonly bin: number;
}

export interface DataVector {
  readonly entries: readonly MeasuredEntry[];
  readonly values: Float64Array;
}

export function assembleDataVector(tables: readonly (StatisticTable | undefined)[]): DataVector {
  const entries: MeasuredEntry[] = [];
  const values: number[] = [];
  for (const t of tables) {
    if (!t) continue;
    t.multipoles.forEach((ell, m) => {
      for (let b = 0; b < t.size; b++) {
        const sl = (a: ArrayLike<number>) => Array.from({ length: t.sides }, (_, s) => a[b * t.sides + s]);
        entries.push({ block: `${t.statistic}${ell}`, statistic: t.statistic, ell, k: sl(t.centres), kEffective: sl(t.effective), shells: sl(t.shells), count: t.counts[b], bin: b });
        values.push(t.values[m][b]);
      }
    });
  }
  return { entries, values: Float64Array.from(values) };
}

/** Values of one table (a measurement or one mock) in data-vector order. */
export function tableValues(tables: readonly (StatisticTable | undefined)[]): Float64Array {
  return assembleDataVector(tables).values;
}

/** A short label for an entry, e.g. "P2[k=0.105]" or "B0[0.12,0.1,0.05]". */
export function entryLabel(e: DataVectorEntry): string {
  return `${e.block}[${e.k.length === 1 ? 'k=' : ''}${e.k.map((v) => Number(v.toPrecision(6))).join(',')}]`;
}
