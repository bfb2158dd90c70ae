import { InputError } from '../contracts/input-error.js';
import { singleNodePerBin, type TriangleNodeSet } from './triangle-node-set.js';

/**
 * A user-supplied list of triangles (k1, k2, k3) in h/Mpc, evaluated as given:
 * the first listed side carries the Legendre weight. Each row must have three
 * positive sides that close (no side longer than the sum of the other two, up
 * to a relative 1e-12); `source` names the list in error messages.
 */
export function userTriangleNodes(rows: readonly (readonly number[])[], source = 'triangle list'): TriangleNodeSet {
  if (rows.length === 0) throw new InputError(`${source}: no triangles given`);
  const n = rows.length;
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  rows.forEach((row, r) => {
    if (row.length !== 3) throw new InputError(`${source}: row ${r + 1} has ${row.length} values, expected k1, k2, k3`);
    const [a, b, c] = row;
    if (![a, b, c].every((x) => Number.isFinite(x) && x > 0)) {
      throw new InputError(`${source}: row ${r + 1} (${row.join(', ')}) needs three positive finite wavenumbers`);
    }
    const longest = Math.max(a, b, c);
    if (longest > (a + b + c - longest) * (1 + 1e-12)) {
      throw new InputError(`${source}: row ${r + 1} (${row.join(', ')}) cannot close: the longest side exceeds the sum of the other two`);
    }
    k1[r] = a;
    k2[r] = b;
    k3[r] = c;
  });
  return singleNodePerBin(k1, k2, k3);
}
