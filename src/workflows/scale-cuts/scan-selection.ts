import { InputError } from '../../contracts/input-error.js';
import { parseShapeClass } from '../../bispectrum/shape-classes.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { selectData, type DataSelection, type ScaleCuts } from '../../data/scale-cuts.js';
import { dataEntryShapeClass, type DataEntryShapeClass } from './shape-class-chi2.js';

/**
 * The data kept at one step of a scale-cut scan: the base cuts with the
 * scanned statistic's kMax replaced (for every block of that statistic), then
 * the bispectrum entries of the excluded shape classes removed. A bin whose
 * centre equals kMax up to a relative 1e-9 is kept (centres kMin + n dk carry
 * rounding errors).
 */
export function scanSelection(bundle: MeasurementBundle, base: ScaleCuts, statistic: 'P' | 'B', kMax: number, excludeShapes: readonly string[]): { selection: DataSelection; classes: DataEntryShapeClass[] } {
  const limit = kMax * (1 + 1e-9);
  const limits: Record<string, object> = { ...base.limits };
  for (const key of Object.keys(limits)) if (key.startsWith(statistic)) limits[key] = { ...limits[key], kMax: limit };
  limits[statistic] = { ...base.limits?.[statistic], kMax: limit };
  const cut = selectData(bundle.dataVector.entries, { ...base, limits });
  const excluded = new Set(excludeShapes.map((s) => parseShapeClass(s, 'excludeShapes')));
  const dk = bundle.bispectrum?.dk ?? 0;
  const keep: number[] = [];
  const classes: DataEntryShapeClass[] = [];
  cut.entries.forEach((e, a) => {
    const c = dataEntryShapeClass(e, dk);
    if (c !== 'power' && excluded.has(c)) return;
    keep.push(a);
    classes.push(c);
  });
  if (keep.length === 0) throw new InputError(`scan: at kMax = ${kMax} the cuts and shape exclusions leave no data`, { where: 'excludeShapes' });
  const perBlock: Record<string, { kept: number; total: number }> = {};
  for (const [b, t] of Object.entries(cut.perBlock)) perBlock[b] = { kept: 0, total: t.total };
  const entries = keep.map((a) => cut.entries[a]);
  for (const e of entries) perBlock[e.block].kept++;
  return { selection: { indices: Int32Array.from(keep, (a) => cut.indices[a]), entries, perBlock }, classes };
}
