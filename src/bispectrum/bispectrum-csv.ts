import { InputError } from '../contracts/input-error.js';
import type { TreeBispectrumModel } from './tree-bispectrum-model.js';

const fmt = (v: number) => Number(v.toPrecision(10)).toString();

/**
 * CSV of bispectrum multipoles per triangle: header `k1,k2,k3[,shape],B<l>...`
 * (k in h/Mpc, B in (Mpc/h)^6), one row per bin or listed triangle, with the
 * values of `model.evaluate` (layout [multipole][bin]).
 */
export function bispectrumMultipoleCsv(model: TreeBispectrumModel, values: Float64Array, shapes?: readonly string[]): string {
  const nb = model.nodes.binCount;
  const header = ['k1', 'k2', 'k3', ...(shapes ? ['shape'] : []), ...model.multipoles.map((l) => `B${l}`)];
  const lines = [header.join(',')];
  for (let b = 0; b < nb; b++) {
    const k = model.entries[b].k;
    const cells = [fmt(k[0]), fmt(k[1]), fmt(k[2]), ...(shapes ? [shapes[b]] : [])];
    for (let m = 0; m < model.multipoles.length; m++) cells.push(fmt(values[m * nb + b]));
    lines.push(cells.join(','));
  }
  return `${lines.join('\n')}\n`;
}

/**
 * A triangle list as CSV text: three numbers k1, k2, k3 per line (h/Mpc),
 * comma or whitespace separated; an optional header line and lines starting
 * with '#' are skipped. Errors name the source and line.
 */
export function parseTriangleListCsv(text: string, source: string): number[][] {
  const rows: number[][] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const line = raw.trim();
    if (line === '' || line.startsWith('#')) return;
    const cells = line.split(/[\s,]+/);
    const values = cells.map(Number);
    if (values.some((v) => !Number.isFinite(v))) {
      if (rows.length === 0 && i === 0) return; // header
      throw new InputError(`${source}:${i + 1}: expected three numbers k1, k2, k3, got "${line}"`);
    }
    if (values.length !== 3) throw new InputError(`${source}:${i + 1}: expected three numbers k1, k2, k3, got ${values.length}`);
    rows.push(values);
  });
  if (rows.length === 0) throw new InputError(`${source}: no triangles found`);
  return rows;
}
