import { InputError } from '../../contracts/input-error.js';
import { readNumericTable } from '../csv-table.js';
import type { MeasuredEntry } from '../data-vector.js';

/**
 * A covariance matrix file: CSV, one header line and one row per data-vector
 * entry, in data-vector order (docs/conventions.md). Header cell c names entry
 * c and must begin with its block ("P0", "B0", ...); the rest of the cell is
 * free (for example "P0 k=0.015"). Refused when the size or a block differs.
 */
export function readCovarianceMatrix(path: string, label: string, entries: readonly MeasuredEntry[]): Float64Array {
  const t = readNumericTable(path, label);
  const n = entries.length;
  if (t.header.length !== n || t.rowCount !== n) {
    throw new InputError(`${label}: a ${t.rowCount} x ${t.header.length} matrix does not match the data vector of ${n} entries`, { where: label });
  }
  t.header.forEach((h, c) => {
    const block = entries[c].block;
    if (!h.startsWith(block) || /\d/.test(h.charAt(block.length))) {
      throw new InputError(`${label}:1: column ${c + 1} is headed '${h}' but data-vector entry ${c + 1} belongs to block ${block}`, { where: `${label}:1:${c + 1}` });
    }
  });
  const m = new Float64Array(n * n);
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) m[r * n + c] = t.columns[c][r];
  return m;
}
