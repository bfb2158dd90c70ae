import { describe, expect, it } from 'vitest';
import { parseJsonWithLines } from '../../src/io/json-with-lines.js';

describe('JSON with key lines', () => {
  const text = '{\n  "a": 1,\n  "b": {\n    "c": [1, 2.5e-3, -0],\n    "d": "x\\"y"\n  },\n  "e": [ {"f": true}, null ]\n}\n';

  it('parses exactly like JSON.parse (ECMA-404 grammar)', () => {
    expect(parseJsonWithLines(text, 'x.json').value).toEqual(JSON.parse(text));
  });

  it('knows the line of every key path', () => {
    const j = parseJsonWithLines(text, 'x.json');
    expect(j.lineOf('a')).toBe(2);
    expect(j.lineOf('b.c')).toBe(4);
    expect(j.lineOf('b.d')).toBe(5);
    expect(j.lineOf('e[0].f')).toBe(7);
    expect(j.where('b.c')).toBe('x.json:4');
    expect(j.where('zzz')).toBe('x.json');
  });

  it('refuses duplicate keys, naming both lines', () => {
    expect(() => parseJsonWithLines('{\n "p": {\n  "b1": {"value": 1},\n  "b1": {"prior": {}}\n }\n}', 'c.json')).toThrow(
      /c\.json:4: key "p\.b1" appears twice \(first on line 3\)/,
    );
  });

  it('names the line of a syntax error', () => {
    expect(() => parseJsonWithLines('{\n "a": 1,\n "b": ,\n}', 'c.json')).toThrow(/c\.json:3: not valid JSON/);
    expect(() => parseJsonWithLines('{"a": 1} x', 'c.json')).toThrow(/after the end/);
  });
});
