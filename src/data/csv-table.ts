import { readFileSync } from 'node:fs';
import { InputError } from '../contracts/input-error.js';

/**
 * A numeric CSV table with one header line. Row numbers in messages are file
 * line numbers (the header is line 1); columns are named by their header and
 * their 1-based position, so a message reads "power.csv:7: column 3 (k_eff) ...".
 */
export interface NumericTable {
  readonly file: string;
  readonly header: readonly string[];
  /** Column-major values: columns[c][r] for data row r (0-based). */
  readonly columns: readonly Float64Array[];
  readonly rowCount: number;
  /** File line number of data row r. */
  lineOf(r: number): number;
}

function splitLine(line: string): string[] {
  return line.split(',').map((s) => s.trim());
}

/** Parse CSV text; blank lines and lines starting with '#' are skipped. */
export function parseNumericTable(text: string, file: string): NumericTable {
  const lines = text.split(/\r?\n/);
  let headerLine = -1;
  for (let i = 0; i < lines.length; i++) {
    const t = lines[i].trim();
    if (t !== '' && !t.startsWith('#')) {
      headerLine = i;
      break;
    }
  }
  if (headerLine < 0) throw new InputError(`${file}: no header line`, { where: file });
  const header = splitLine(lines[headerLine]);
  const seen = new Set<string>();
  header.forEach((h, c) => {
    if (h === '') throw new InputError(`${file}:${headerLine + 1}: column ${c + 1} has an empty header`, { where: `${file}:${headerLine + 1}:${c + 1}` });
    if (seen.has(h)) throw new InputError(`${file}:${headerLine + 1}: column ${c + 1} repeats the header '${h}'`, { where: `${file}:${headerLine + 1}:${c + 1}` });
    seen.add(h);
  });
  const raw: number[][] = header.map(() => []);
  const lineNumbers: number[] = [];
  for (let i = headerLine + 1; i < lines.length; i++) {
    const t = lines[i].trim();
    if (t === '' || t.startsWith('#')) continue;
    const cells = splitLine(lines[i]);
    if (cells.length !== header.length) {
      throw new InputError(`${file}:${i + 1}: ${cells.length} columns, the header has ${header.length}`, { where: `${file}:${i + 1}` });
    }
    cells.forEach((cell, c) => {
      const v = cell === '' ? Number.NaN : Number(cell);
      if (!Number.isFinite(v)) {
        throw new InputError(`${file}:${i + 1}: column ${c + 1} (${header[c]}) is not a finite number: '${cell}'`, { where: `${file}:${i + 1}:${c + 1}` });
      }
      raw[c].push(v);
    });
    lineNumbers.push(i + 1);
  }
  if (lineNumbers.length === 0) throw new InputError(`${file}: the table has a header but no rows`, { where: file });
  return {
    file,
    header,
    columns: raw.map((c) => Float64Array.from(c)),
    rowCount: lineNumbers.length,
    lineOf: (r) => lineNumbers[r],
  };
}

export function readNumericTable(path: string, label = path): NumericTable {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError(`${label}: cannot read the file (${(e as Error).message})`, { where: label });
  }
  return parseNumericTable(text, label);
}

/** The column with this header, or an InputError naming the file and the missing header. */
export function tableColumn(t: NumericTable, name: string): Float64Array {
  const c = t.header.indexOf(name);
  if (c < 0) throw new InputError(`${t.file}: missing column '${name}' (header: ${t.header.join(', ')})`, { where: t.file });
  return t.columns[c];
}

/** Location string of a cell for messages: "file:line:column (name)". */
export function cellWhere(t: NumericTable, r: number, name: string): string {
  return `${t.file}:${t.lineOf(r)}: column ${t.header.indexOf(name) + 1} (${name})`;
}
