import { readFileSync } from 'node:fs';
import { InputError } from '../contracts/input-error.js';

/** A user power-spectrum table: k in h/Mpc (strictly increasing), P in (Mpc/h)^3 (positive). */
export interface PowerTable {
  readonly k: Float64Array;
  readonly p: Float64Array;
  /** File name (or label) the table came from, for messages. */
  readonly source: string;
}

export const MIN_TABLE_ROWS = 10;

/**
 * Parse a two-column table. Columns are separated by whitespace or commas;
 * '#' starts a comment; blank lines are skipped; a first non-comment line that
 * is not numeric is taken as a header. Every problem names source:line.
 */
export function parsePowerTable(text: string, source = 'table'): PowerTable {
  const ks: number[] = [];
  const ps: number[] = [];
  const lines = text.split(/\r?\n/);
  let seenData = false;
  let headerSkipped = false;
  let lastLine = 0;
  for (let i = 0; i < lines.length; i++) {
    const lineNo = i + 1;
    const body = lines[i].replace(/#.*/, '').trim();
    if (body === '') continue;
    const cells = body.split(/[\s,]+/).filter((c) => c !== '');
    const values = cells.map((c) => Number(c));
    const looksLikeHeader = cells.some((c) => Number.isNaN(Number(c)) && !/^[+-]?(nan|inf(inity)?)$/i.test(c));
    if (!seenData && !headerSkipped && looksLikeHeader) {
      headerSkipped = true;
      continue;
    }
    seenData = true;
    if (cells.length !== 2) {
      throw new InputError(`${source}:${lineNo}: expected 2 columns (k, P), found ${cells.length}`);
    }
    const [k, p] = values;
    if (!Number.isFinite(k)) throw new InputError(`${source}:${lineNo}: k = "${cells[0]}" is not a finite number`);
    if (!Number.isFinite(p)) throw new InputError(`${source}:${lineNo}: P = "${cells[1]}" is not a finite number`);
    if (!(k > 0)) throw new InputError(`${source}:${lineNo}: k = ${k} must be positive (h/Mpc)`);
    if (!(p > 0)) throw new InputError(`${source}:${lineNo}: P = ${p} must be positive ((Mpc/h)^3)`);
    if (ks.length > 0 && !(k > ks[ks.length - 1])) {
      throw new InputError(`${source}:${lineNo}: k = ${k} does not increase (previous row ${lastLine} has k = ${ks[ks.length - 1]})`);
    }
    ks.push(k);
    ps.push(p);
    lastLine = lineNo;
  }
  if (ks.length < MIN_TABLE_ROWS) {
    throw new InputError(`${source}: ${ks.length} data rows, a power-spectrum table needs at least ${MIN_TABLE_ROWS}`);
  }
  return { k: Float64Array.from(ks), p: Float64Array.from(ps), source };
}

export function readPowerTable(path: string): PowerTable {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: cannot read the power-spectrum table (${(err as NodeJS.ErrnoException).code ?? String(err)})`);
  }
  return parsePowerTable(text, path);
}
