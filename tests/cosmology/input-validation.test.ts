import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/contracts/input-error.js';
import { validateCosmology } from '../../src/cosmology/cosmology-parameters.js';
import { parseLinearTheoryConfig } from '../../src/cosmology/linear-theory-config.js';
import { parsePowerTable } from '../../src/cosmology/power-table.js';

const good = { h: 0.68, omegaB: 0.0224, omegaCdm: 0.12, ns: 0.965, lnAs: 3.05 };

function messageOf(fn: () => unknown): string {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    return (err as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('cosmology parameters', () => {
  it('fills the defaults', () => {
    const p = validateCosmology(good);
    expect(p).toMatchObject({ mNu: 0, massiveNuCount: 3, w0: -1, wa: 0, tCmb: 2.7255, nEff: 3.044 });
  });
  it.each([
    [{ ...good, hubble: 70 }, /cosmology\.hubble: unknown key/],
    [{ ...good, h: undefined }, /cosmology\.h: missing/],
    [{ ...good, ns: Number.NaN }, /cosmology\.ns: must be a number/],
    [{ ...good, mNu: -0.1 }, /cosmology\.mNu = -0\.1 is out of range \[0, 3\]/],
    [{ ...good, omegaB: -0.02 }, /cosmology\.omegaB = -0\.02 is out of range/],
    [{ ...good, omegaCdm: -0.1 }, /cosmology\.omegaCdm = -0\.1 is out of range/],
    [{ ...good, h: 67 }, /cosmology\.h = 67 is out of range \[0\.4, 1\]/],
    [{ ...good, sigma8: 0.8 }, /exactly one amplitude/],
    [{ ...good, lnAs: undefined }, /exactly one amplitude/],
    [{ ...good, massiveNuCount: 2.5 }, /massiveNuCount = 2\.5 must be an integer/],
    [{ ...good, h: '0.7' }, /cosmology\.h: must be a number/],
  ])('rejects %j', (raw, pattern) => {
    expect(messageOf(() => validateCosmology(raw))).toMatch(pattern);
  });
  it('reports several problems at once', () => {
    const msg = messageOf(() => validateCosmology({ h: 2, omegaB: -1, ns: 1, lnAs: 3 }));
    expect(msg).toMatch(/^3 problems/);
    expect(msg).toMatch(/cosmology\.h = 2/);
    expect(msg).toMatch(/cosmology\.omegaB = -1/);
    expect(msg).toMatch(/cosmology\.omegaCdm: missing/);
  });
});

describe('linear-theory config file', () => {
  const text = ['{', '  "redshift": 0.5,', '  "cosmology": {', '    "h": 1.7,', '    "omegaB": 0.022,', '    "omegaCdm": 0.12,', '    "ns": 0.96,', '    "lnAs": 3.0,', '    "neutrinos": 0.06', '  }', '}'].join('\n');
  it('names field, file and line of each problem', () => {
    const msg = messageOf(() => parseLinearTheoryConfig(text, 'run.json'));
    expect(msg).toMatch(/cosmology\.h \(run\.json:4\) = 1\.7 is out of range \[0\.4, 1\]/);
    expect(msg).toMatch(/cosmology\.neutrinos \(run\.json:9\): unknown key/);
  });
  it('rejects a missing redshift and invalid JSON', () => {
    expect(messageOf(() => parseLinearTheoryConfig('{"cosmology": {}}', 'a.json'))).toMatch(/redshift \(a\.json\): missing/);
    expect(messageOf(() => parseLinearTheoryConfig('{"redshift": 0.5,', 'b.json'))).toMatch(/^b\.json: not valid JSON/);
  });
  it('accepts a good config', () => {
    const c = parseLinearTheoryConfig(JSON.stringify({ redshift: 1, cosmology: good }), 'c.json');
    expect(c.redshift).toBe(1);
    expect(c.cosmology.h).toBe(0.68);
  });
});

describe('power-spectrum tables', () => {
  const rows = (n: number) => Array.from({ length: n }, (_, i) => `${(0.001 * 1.5 ** i).toPrecision(6)} ${(1000 / (1 + i)).toFixed(3)}`);
  it('reads whitespace or comma separated columns with comments and a header', () => {
    const t = parsePowerTable(['# made for a test', 'k, P', ...rows(12).map((r) => r.replace(' ', ', ')), ''].join('\n'), 'p.csv');
    expect(t.k.length).toBe(12);
    expect(t.p[0]).toBe(1000);
    expect(parsePowerTable(rows(12).join('\n') + '  # trailing comment', 'p.txt').k.length).toBe(12);
  });
  it('rejects non-increasing k with file and line', () => {
    const lines = rows(12);
    lines[5] = lines[4];
    expect(messageOf(() => parsePowerTable(['# header comment', ...lines].join('\n'), 'p.txt'))).toMatch(/^p\.txt:7: k = .* does not increase \(previous row 6/);
  });
  it('rejects non-positive P, NaN and a wrong column count', () => {
    const lines = rows(12);
    expect(messageOf(() => parsePowerTable([...lines.slice(0, 3), '0.01 -5', ...lines.slice(3)].join('\n'), 't'))).toMatch(/^t:4: P = -5 must be positive/);
    expect(messageOf(() => parsePowerTable([...lines.slice(0, 3), '0.01 0', ...lines.slice(3)].join('\n'), 't'))).toMatch(/^t:4: P = 0 must be positive/);
    expect(messageOf(() => parsePowerTable([...lines.slice(0, 2), 'nan 5', ...lines.slice(2)].join('\n'), 't'))).toMatch(/^t:3: k = "nan" is not a finite number/);
    expect(messageOf(() => parsePowerTable([...lines.slice(0, 2), '0.1 5 7', ...lines.slice(2)].join('\n'), 't'))).toMatch(/^t:3: expected 2 columns/);
  });
  it('rejects fewer than 10 rows', () => {
    expect(messageOf(() => parsePowerTable(rows(9).join('\n'), 'short.txt'))).toMatch(/^short\.txt: 9 data rows, .* at least 10/);
  });
});
