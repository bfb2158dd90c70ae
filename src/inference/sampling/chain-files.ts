import { closeSync, existsSync, fsyncSync, ftruncateSync, openSync, readFileSync, renameSync, writeSync } from 'node:fs';
import { InputError } from '../../contracts/input-error.js';
import { ChainHistory } from './chain-history.js';

/**
 * The three files of a run with output stem S:
 *   S.csv        chain rows, appended at each checkpoint
 *   S.json       sidecar: what was run and, at the end, its diagnostics
 *   S.state.json checkpoint: sampler and generator state, and the byte
 *                length of S.csv it matches
 */
export interface ChainFilePaths {
  readonly chain: string;
  readonly sidecar: string;
  readonly state: string;
}

export function chainFilePaths(stem: string): ChainFilePaths {
  return { chain: `${stem}.csv`, sidecar: `${stem}.json`, state: `${stem}.state.json` };
}

/** Header line: step, member index, log-posterior, then the parameters. */
export function chainCsvHeader(memberLabel: string, names: readonly string[]): string {
  return `step,${memberLabel},logPosterior,${names.join(',')}\n`;
}

/**
 * CSV lines for history steps [from, to): step numbers count from 1 (the
 * state after the first move); numbers in shortest round-trip form, so
 * reading them back gives the same doubles.
 */
export function chainCsvRows(history: ChainHistory, from: number, to: number): string {
  let text = '';
  for (let s = from; s < to; s++) {
    for (let m = 0; m < history.members; m++) {
      const row = history.row(s, m);
      let line = `${s + 1},${m}`;
      for (let k = 0; k < row.length; k++) line += `,${row[k]}`;
      text += `${line}\n`;
    }
  }
  return text;
}

/** Append text and flush it to disk. Returns the file's new byte length. */
export function appendDurably(path: string, text: string, bytesBefore: number): number {
  const fd = openSync(path, 'a');
  try {
    const buffer = Buffer.from(text, 'utf8');
    writeSync(fd, buffer);
    fsyncSync(fd);
    return bytesBefore + buffer.length;
  } finally {
    closeSync(fd);
  }
}

/** Write JSON through a temporary file and a rename, so a kill never leaves half a file. */
export function writeJsonAtomically(path: string, value: unknown): void {
  const tmp = `${path}.tmp`;
  const fd = openSync(tmp, 'w');
  try {
    writeSync(fd, `${JSON.stringify(value, null, 1)}\n`);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  renameSync(tmp, path);
}

export function readRunJson<T>(path: string, field: string): T {
  try {
    return JSON.parse(readFileSync(path, 'utf8')) as T;
  } catch (err) {
    throw new InputError(`${field}: ${path} is not readable JSON (${(err as Error).message})`);
  }
}

/**
 * Cut the chain file back to the `bytes` a checkpoint recorded (dropping rows
 * written after it) and read its rows into a history.
 */
export function readChainCsv(path: string, bytes: number, header: string, members: number, dim: number): ChainHistory {
  if (!existsSync(path)) throw new InputError(`output: chain file ${path} is missing; cannot resume`);
  const fd = openSync(path, 'r+');
  try {
    ftruncateSync(fd, bytes);
  } finally {
    closeSync(fd);
  }
  const text = readFileSync(path, 'utf8');
  if (!text.startsWith(header)) throw new InputError(`output: ${path} has another header than this run's: ${JSON.stringify(header.trim())}`);
  const lines = text.slice(header.length).split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  if (lines.length % members !== 0) throw new InputError(`output: ${path} holds ${lines.length} rows, not a whole number of steps of ${members}`);
  const history = new ChainHistory(members, dim, lines.length / members + 1024);
  const positions = new Float64Array(members * dim);
  const logPosterior = new Float64Array(members);
  for (let s = 0; s < lines.length / members; s++) {
    for (let m = 0; m < members; m++) {
      const cells = lines[s * members + m].split(',');
      if (cells.length !== dim + 3) throw new InputError(`output: ${path}:${s * members + m + 2} has ${cells.length} columns, expected ${dim + 3}`);
      logPosterior[m] = Number(cells[2]);
      for (let p = 0; p < dim; p++) positions[m * dim + p] = Number(cells[3 + p]);
    }
    history.append(positions, logPosterior);
  }
  return history;
}
