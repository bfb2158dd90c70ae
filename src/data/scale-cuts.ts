import { InputError, InputErrors } from '../contracts/input-error.js';
import type { MeasuredEntry } from './data-vector.js';

/**
 * Scale cuts, applied by index to the data vector, the model vector and the
 * covariance together (the covariance is cut before it is factorised).
 *
 * Per block ("P0", "B0", ...) or per statistic ("P", "B", applying to each of
 * its blocks; a block's own entry wins key by key):
 *   P: keep kMin <= k <= kMax;
 *   B: keep kMin <= smallest side, largest side <= kMax, and
 *      smallest / largest >= minSideRatio (a shape filter against squeezed triangles).
 * `blocks` lists the blocks to use (default: all). `wavenumbers` says whether the
 * limits compare with bin centres (default) or effective wavenumbers.
 */
export interface BlockCut {
  readonly kMin?: number;
  readonly kMax?: number;
  readonly minSideRatio?: number;
}

export interface ScaleCuts {
  readonly blocks?: readonly string[];
  readonly limits?: Readonly<Record<string, BlockCut>>;
  readonly wavenumbers?: 'centre' | 'effective';
}

export interface DataSelection {
  /** Indices into the full data vector, increasing. */
  readonly indices: Int32Array;
  readonly entries: readonly MeasuredEntry[];
  /** Kept / total entries per block, for printing. */
  readonly perBlock: Readonly<Record<string, { kept: number; total: number }>>;
}

function checkCut(key: string, c: BlockCut, problems: string[]): void {
  for (const k of Object.keys(c)) if (!['kMin', 'kMax', 'minSideRatio'].includes(k)) problems.push(`cuts.limits.${key}.${k} is not a known key (kMin, kMax, minSideRatio)`);
  for (const k of ['kMin', 'kMax', 'minSideRatio'] as const) {
    const v = c[k];
    if (v !== undefined && (typeof v !== 'number' || !Number.isFinite(v) || v < 0)) problems.push(`cuts.limits.${key}.${k} must be a number >= 0, got ${JSON.stringify(v)}`);
  }
  if (c.kMin !== undefined && c.kMax !== undefined && c.kMin > c.kMax) problems.push(`cuts.limits.${key}: kMin (${c.kMin}) exceeds kMax (${c.kMax})`);
  if (key.startsWith('P') && c.minSideRatio !== undefined) problems.push(`cuts.limits.${key}.minSideRatio applies only to bispectrum blocks`);
}

export function selectData(entries: readonly MeasuredEntry[], cuts: ScaleCuts = {}): DataSelection {
  const blocks = [...new Set(entries.map((e) => e.block))];
  const problems: string[] = [];
  for (const b of cuts.blocks ?? []) if (!blocks.includes(b)) problems.push(`cuts.blocks: '${b}' is not in the data vector (blocks: ${blocks.join(', ')})`);
  const limits = cuts.limits ?? {};
  for (const [key, c] of Object.entries(limits)) {
    if (key !== 'P' && key !== 'B' && !blocks.includes(key)) problems.push(`cuts.limits.${key}: no such block or statistic (blocks: ${blocks.join(', ')}; or P, B)`);
    else checkCut(key, c, problems);
  }
  if (cuts.wavenumbers !== undefined && cuts.wavenumbers !== 'centre' && cuts.wavenumbers !== 'effective') problems.push(`cuts.wavenumbers must be "centre" or "effective", got ${JSON.stringify(cuts.wavenumbers)}`);
  if (problems.length) throw new InputErrors(problems);

  const use = new Set(cuts.blocks ?? blocks);
  const effective = cuts.wavenumbers === 'effective';
  const kept: number[] = [];
  const perBlock: Record<string, { kept: number; total: number }> = {};
  entries.forEach((e, i) => {
    const tally = (perBlock[e.block] ??= { kept: 0, total: 0 });
    tally.total++;
    if (!use.has(e.block)) return;
    const c = { ...limits[e.statistic], ...limits[e.block] };
    const k = effective ? e.kEffective : e.k;
    const largest = Math.max(...k);
    const smallest = Math.min(...k);
    if (c.kMin !== undefined && smallest < c.kMin) return;
    if (c.kMax !== undefined && largest > c.kMax) return;
    if (c.minSideRatio !== undefined && smallest / largest < c.minSideRatio) return;
    tally.kept++;
    kept.push(i);
  });
  if (kept.length === 0) throw new InputError('cuts: the scale cuts leave no data (every entry of every block is removed)', { where: 'cuts' });
  const indices = Int32Array.from(kept);
  return { indices, entries: kept.map((i) => entries[i]), perBlock };
}

/** v[indices]. */
export function selectVector(v: Float64Array, indices: Int32Array): Float64Array {
  const out = new Float64Array(indices.length);
  for (let a = 0; a < indices.length; a++) out[a] = v[indices[a]];
  return out;
}

/** The sub-matrix M[indices, indices] of a row-major n x n matrix. */
export function selectMatrix(m: Float64Array, n: number, indices: Int32Array): Float64Array {
  const p = indices.length;
  const out = new Float64Array(p * p);
  for (let a = 0; a < p; a++) {
    const row = indices[a] * n;
    for (let b = 0; b < p; b++) out[a * p + b] = m[row + indices[b]];
  }
  return out;
}
