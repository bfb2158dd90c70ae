import type { TriangleBins } from '../bispectrum/triangle-bins.js';
import { InputError } from '../contracts/input-error.js';
import { cellWhere, tableColumn, type NumericTable } from './csv-table.js';

/**
 * One measured statistic read from its CSV table: the bins (one wavenumber per
 * bin for P, three for B) and one value column per multipole.
 *   power:      k_centre, k_eff, modes, P0[, P2, P4, ...]
 *   bispectrum: k1_centre, k2_centre, k3_centre, k1_eff, k2_eff, k3_eff, triangles, B0[, B2, ...]
 */
export interface StatisticTable {
  readonly statistic: 'P' | 'B';
  readonly file: string;
  readonly dk: number;
  /** Number of bins (rows). */
  readonly size: number;
  /** Wavenumbers per bin: 1 for P, 3 for B. */
  readonly sides: 1 | 3;
  /** Bin centres, `sides` per bin. */
  readonly centres: Float64Array;
  /** Effective (mean) wavenumbers, `sides` per bin. */
  readonly effective: Float64Array;
  /** Shell index of each centre on the grid c_n = c_0 + n dk, `sides` per bin. */
  readonly shells: Int32Array;
  /** Mode count (P) or fundamental-triangle count (B) per bin. */
  readonly counts: Float64Array;
  /** Multipole orders, ascending. */
  readonly multipoles: readonly number[];
  /** Values per multipole, in `multipoles` order. */
  readonly values: readonly Float64Array[];
}

const SIDE_NAMES = { P: { centre: ['k_centre'], eff: ['k_eff'], count: 'modes' }, B: { centre: ['k1_centre', 'k2_centre', 'k3_centre'], eff: ['k1_eff', 'k2_eff', 'k3_eff'], count: 'triangles' } } as const;

export function readStatisticTable(t: NumericTable, statistic: 'P' | 'B', dk: number): StatisticTable {
  const names = SIDE_NAMES[statistic];
  const sides = names.centre.length as 1 | 3;
  const size = t.rowCount;
  const centreCols = names.centre.map((n) => tableColumn(t, n));
  const effCols = names.eff.map((n) => tableColumn(t, n));
  const counts = Float64Array.from(tableColumn(t, names.count));
  const known = new Set<string>([...names.centre, ...names.eff, names.count]);
  const multipoles: number[] = [];
  const valueCols: Float64Array[] = [];
  t.header.forEach((h, c) => {
    if (known.has(h)) return;
    const m = new RegExp(`^${statistic}(\\d+)$`).exec(h);
    if (!m || Number(m[1]) % 2 !== 0) {
      throw new InputError(`${t.file}: column ${c + 1} '${h}' is neither a bin column nor an even multipole ${statistic}0, ${statistic}2, ...`, { where: `${t.file}:1:${c + 1}` });
    }
    multipoles.push(Number(m[1]));
    valueCols.push(Float64Array.from(t.columns[c]));
  });
  if (multipoles.length === 0) throw new InputError(`${t.file}: no multipole column (${statistic}0, ${statistic}2, ...)`, { where: t.file });
  const order = multipoles.map((_, i) => i).sort((a, b) => multipoles[a] - multipoles[b]);

  const centres = new Float64Array(size * sides);
  const effective = new Float64Array(size * sides);
  let c0 = Infinity;
  for (const col of centreCols) for (const v of col) c0 = Math.min(c0, v);
  const shells = new Int32Array(size * sides);
  for (let r = 0; r < size; r++) {
    if (!(counts[r] > 0)) throw new InputError(`${cellWhere(t, r, names.count)} must be positive, got ${counts[r]}`, { where: `${t.file}:${t.lineOf(r)}` });
    for (let s = 0; s < sides; s++) {
      const c = centreCols[s][r];
      const e = effCols[s][r];
      const n = Math.round((c - c0) / dk);
      if (!(c > 0) || Math.abs(c - c0 - n * dk) > 1e-6 * dk) {
        throw new InputError(`${cellWhere(t, r, names.centre[s])} = ${c} is not on the shell grid ${c0} + n * ${dk}`, { where: `${t.file}:${t.lineOf(r)}` });
      }
      // Half-open shell [c - dk/2, c + dk/2) (docs/conventions.md, "Binning"), with rounding slack.
      if (!(e >= c - 0.5 * dk * (1 + 1e-9)) || !(e <= c + 0.5 * dk * (1 + 1e-9))) {
        throw new InputError(`${cellWhere(t, r, names.eff[s])} = ${e} lies outside its shell [${c - dk / 2}, ${c + dk / 2})`, { where: `${t.file}:${t.lineOf(r)}` });
      }
      centres[r * sides + s] = c;
      effective[r * sides + s] = e;
      shells[r * sides + s] = n;
    }
    if (sides === 3) {
      const [i, j, l] = [shells[3 * r], shells[3 * r + 1], shells[3 * r + 2]];
      if (!(i >= j && j >= l)) throw new InputError(`${t.file}:${t.lineOf(r)}: triangle centres must satisfy k1 >= k2 >= k3`, { where: `${t.file}:${t.lineOf(r)}` });
    }
    if (r > 0 && !binAfter(shells, sides, r)) {
      throw new InputError(`${t.file}:${t.lineOf(r)}: bins must be listed once each in increasing (lexicographic) order of their shells`, { where: `${t.file}:${t.lineOf(r)}` });
    }
  }
  return {
    statistic,
    file: t.file,
    dk,
    size,
    sides,
    centres,
    effective,
    shells,
    counts,
    multipoles: order.map((i) => multipoles[i]),
    values: order.map((i) => valueCols[i]),
  };
}

/** True when bin r comes strictly after bin r - 1 in lexicographic shell order. */
function binAfter(shells: Int32Array, sides: number, r: number): boolean {
  for (let s = 0; s < sides; s++) {
    const a = shells[(r - 1) * sides + s];
    const b = shells[r * sides + s];
    if (b !== a) return b > a;
  }
  return false;
}

/** Refuse a mock table whose bins or multipoles differ from the measurement's. */
export function checkSameBins(reference: StatisticTable, other: StatisticTable): void {
  if (other.size !== reference.size) throw new InputError(`${other.file}: ${other.size} bins, the measurement ${reference.file} has ${reference.size}`, { where: other.file });
  if (other.multipoles.join() !== reference.multipoles.join()) {
    throw new InputError(`${other.file}: multipoles ${other.multipoles.join(', ')} differ from ${reference.multipoles.join(', ')} in ${reference.file}`, { where: other.file });
  }
  for (let i = 0; i < reference.shells.length; i++) {
    if (other.shells[i] !== reference.shells[i] || Math.abs(other.centres[i] - reference.centres[i]) > 1e-6 * reference.dk) {
      throw new InputError(`${other.file}: bin ${Math.floor(i / reference.sides) + 1} has other centres than in ${reference.file}`, { where: other.file });
    }
  }
}

/** Smallest bin centre of a table (the first shell of its grid). */
export function firstCentre(t: StatisticTable): number {
  let c = Infinity;
  for (const v of t.centres) c = Math.min(c, v);
  return c;
}

/** The triangle bins of a bispectrum table, on its own shell grid (src/bispectrum/triangle-bins.ts). */
export function triangleBinsOf(t: StatisticTable): TriangleBins {
  let top = 0;
  for (const s of t.shells) top = Math.max(top, s);
  return { shells: { kMin: firstCentre(t), dk: t.dk, count: top + 1 }, size: t.size, indices: Int32Array.from(t.shells), centres: Float64Array.from(t.centres) };
}
