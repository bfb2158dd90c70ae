import { InputError, InputErrors } from '../contracts/input-error.js';

/**
 * A strict JSON reader for config files (RFC 8259 grammar) that remembers the
 * line of every key and refuses duplicate keys — which JSON.parse silently
 * resolves by keeping the last one, so that a parameter written twice, once
 * fixed and once free, would otherwise go unnoticed.
 * Key paths are dotted, with [i] for array elements: "parameters.b1.prior".
 */
export interface JsonWithLines {
  readonly value: unknown;
  /** Line (1-based) where the key of a path is written. */
  lineOf(path: string): number | undefined;
  /** "file:line" of a path, or just the file when the path is not in it. */
  where(path: string): string;
}

class Reader {
  pos = 0;
  line = 1;
  readonly lines = new Map<string, number>();
  readonly duplicates: string[] = [];

  constructor(readonly text: string, readonly file: string) {}

  fail(what: string): never {
    throw new InputError(`${this.file}:${this.line}: not valid JSON: ${what}`, { where: `${this.file}:${this.line}` });
  }

  space(): void {
    const t = this.text;
    while (this.pos < t.length) {
      const c = t[this.pos];
      if (c === '\n') this.line++;
      else if (c !== ' ' && c !== '\t' && c !== '\r') break;
      this.pos++;
    }
  }

  value(path: string): unknown {
    this.space();
    const c = this.text[this.pos];
    if (c === '{') return this.object(path);
    if (c === '[') return this.array(path);
    if (c === '"') return this.string();
    if (c === 't' || c === 'f' || c === 'n') return this.word();
    if (c === '-' || (c >= '0' && c <= '9')) return this.number();
    return this.fail(c === undefined ? 'unexpected end of file' : `unexpected character '${c}'`);
  }

  object(path: string): Record<string, unknown> {
    const out: Record<string, unknown> = {};
    this.pos++;
    this.space();
    if (this.text[this.pos] === '}') {
      this.pos++;
      return out;
    }
    for (;;) {
      this.space();
      if (this.text[this.pos] !== '"') this.fail('expected a quoted key');
      const keyLine = this.line;
      const key = this.string();
      const sub = path ? `${path}.${key}` : key;
      if (Object.prototype.hasOwnProperty.call(out, key)) this.duplicates.push(`${this.file}:${keyLine}: key "${sub}" appears twice (first on line ${this.lines.get(sub)})`);
      else this.lines.set(sub, keyLine);
      this.space();
      if (this.text[this.pos] !== ':') this.fail(`expected ':' after key "${key}"`);
      this.pos++;
      out[key] = this.value(sub);
      this.space();
      const c = this.text[this.pos++];
      if (c === '}') return out;
      if (c !== ',') this.fail(`expected ',' or '}' in the object${path ? ` "${path}"` : ''}`);
    }
  }

  array(path: string): unknown[] {
    const out: unknown[] = [];
    this.pos++;
    this.space();
    if (this.text[this.pos] === ']') {
      this.pos++;
      return out;
    }
    for (;;) {
      const sub = `${path}[${out.length}]`;
      this.space();
      this.lines.set(sub, this.line);
      out.push(this.value(sub));
      this.space();
      const c = this.text[this.pos++];
      if (c === ']') return out;
      if (c !== ',') this.fail(`expected ',' or ']' in the list "${path}"`);
    }
  }

  string(): string {
    const start = this.pos;
    this.pos++;
    const t = this.text;
    while (this.pos < t.length && t[this.pos] !== '"') {
      if (t[this.pos] === '\\') this.pos++;
      else if (t[this.pos] === '\n') this.fail('line break inside a string');
      this.pos++;
    }
    if (this.pos >= t.length) this.fail('unterminated string');
    this.pos++;
    try {
      return JSON.parse(t.slice(start, this.pos)) as string;
    } catch {
      return this.fail('bad escape in a string');
    }
  }

  word(): boolean | null {
    for (const [w, v] of [['true', true], ['false', false], ['null', null]] as const) {
      if (this.text.startsWith(w, this.pos)) {
        this.pos += w.length;
        return v;
      }
    }
    return this.fail('unknown literal');
  }

  number(): number {
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(this.text.slice(this.pos, this.pos + 64));
    if (!m) this.fail('bad number');
    this.pos += m[0].length;
    return Number(m[0]);
  }
}

export function parseJsonWithLines(text: string, file: string): JsonWithLines {
  const r = new Reader(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text, file);
  const value = r.value('');
  r.space();
  if (r.pos < r.text.length) r.fail('unexpected text after the end of the JSON value');
  if (r.duplicates.length) throw new InputErrors(r.duplicates, 'each key may appear once in an object');
  const lines = r.lines;
  return {
    value,
    lineOf: (path) => lines.get(path),
    where: (path) => (lines.has(path) ? `${file}:${lines.get(path)}` : file),
  };
}

/** A parsed JSON object (not an array, not null). */
export type JsonObject = Record<string, unknown>;

export function isJsonObject(v: unknown): v is JsonObject {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}
