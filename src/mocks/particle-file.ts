import { readNumericTable, tableColumn } from '../data/csv-table.js';

/** Particle positions (Mpc/h) from a CSV table with columns x, y, z (others ignored), 3 per particle. */
export function readParticleTable(path: string): Float64Array {
  const t = readNumericTable(path, path);
  const cols = ['x', 'y', 'z'].map((c) => tableColumn(t, c));
  const out = new Float64Array(3 * t.rowCount);
  for (let r = 0; r < t.rowCount; r++) for (let a = 0; a < 3; a++) out[3 * r + a] = cols[a][r];
  return out;
}
