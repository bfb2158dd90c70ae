import { describe, expect, it } from 'vitest';
import { parseNumericTable } from '../../src/data/csv-table.js';
import { entryLabel } from '../../src/data/data-vector.js';
import { loadBundleRealisations, loadMeasurementBundle } from '../../src/data/measurement-bundle.js';
import { baseBundle, bispectrumCsv, powerCsv, withMocks, writeBundle } from './support/write-bundle.js';

describe('CSV tables', () => {
  it('names file, line and column of a cell that is not a number', () => {
    expect(() => parseNumericTable('a,b\n1,2\n3,x\n', 't.csv')).toThrow(/^t\.csv:3: column 2 \(b\) is not a finite number: 'x'/);
    expect(() => parseNumericTable('a,b\n1,2\n3\n', 't.csv')).toThrow(/t\.csv:3: 1 columns, the header has 2/);
    expect(() => parseNumericTable('# only a comment\n', 't.csv')).toThrow(/t\.csv: no header line/);
    expect(() => parseNumericTable('a,a\n1,2\n', 't.csv')).toThrow(/column 2 repeats the header 'a'/);
  });

  it('skips comments and blank lines but keeps file line numbers', () => {
    const t = parseNumericTable('# c\na,b\n\n1,2\n# x\n3,4\n', 't.csv');
    expect(t.rowCount).toBe(2);
    expect(t.lineOf(1)).toBe(6);
    expect([...t.columns[1]]).toEqual([2, 4]);
  });
});

describe('measurement bundle', () => {
  it('loads P0, P2 and B0 into one data vector, multipole-major, P before B', () => {
    const b = loadMeasurementBundle(writeBundle(baseBundle()));
    const blocks = b.dataVector.entries.map((e) => e.block);
    expect(blocks.slice(0, 5).every((x) => x === 'P0')).toBe(true);
    expect(blocks.slice(5, 10).every((x) => x === 'P2')).toBe(true);
    expect(blocks.slice(10).every((x) => x === 'B0')).toBe(true);
    // Triangle bins of 3 shells with i >= j >= l: 1 + 3 + 6 = 10, all with c1 - c2 - c3 < 1.5 dk.
    expect(b.bispectrum?.size).toBe(10);
    expect(b.dataVector.values.length).toBe(20);
    const e = b.dataVector.entries[10];
    expect(e.k).toEqual([0.03, 0.03, 0.03]);
    expect(e.shells).toEqual([0, 0, 0]);
    expect(entryLabel(e)).toBe('B0[0.03,0.03,0.03]');
    expect(b.metadata.volume).toBe(1e9);
  });

  it('lists every metadata problem by key', () => {
    const bad = baseBundle();
    bad.metadata = { ...bad.metadata, format: 'x', redshift: -1, numberDensity: 0, lineOfSight: 'sideways', surveyVolume: 5, extra: 1 };
    let message = '';
    try {
      loadMeasurementBundle(writeBundle(bad));
    } catch (e) {
      message = (e as Error).message;
    }
    for (const key of ['format', 'redshift', 'numberDensity', 'lineOfSight', 'boxSize', 'extra']) expect(message).toContain(`measurement.json: ${key}`);
  });

  it('names the folder when there is no metadata file', () => {
    expect(() => loadMeasurementBundle('/nonexistent/bundle')).toThrow(/\/nonexistent\/bundle\/measurement\.json: cannot read the file/);
  });

  it('refuses a box measurement with a survey line of sight', () => {
    const bad = baseBundle();
    bad.metadata = { ...bad.metadata, lineOfSight: 'midpoint' };
    expect(() => loadMeasurementBundle(writeBundle(bad))).toThrow(/lineOfSight must be a box axis/);
  });

  it('refuses bins off the shell grid, effective k outside the shell, unsorted rows and k1 < k2', () => {
    const cases: [string, (t: string) => string, RegExp][] = [
      ['power.csv', (t) => t.replace('0.0400,', '0.0410,'), /power\.csv:4: column 1 \(k_centre\) = 0\.041 is not on the shell grid/],
      ['power.csv', (t) => t.replace('0.0300,0.0310', '0.0300,0.0360'), /power\.csv:3: column 2 \(k_eff\) = 0\.036 lies outside its shell/],
      ['power.csv', (t) => t.split('\n').filter((_, i) => i !== 2).join('\n') + '0.0300,0.0310,3600,1,1\n', /power\.csv:6: bins must be listed once each in increasing/],
      ['bispectrum.csv', (t) => t.replace('0.0500,0.0300,0.0300,0.0520,0.0320,0.0320', '0.0300,0.0500,0.0300,0.0320,0.0520,0.0320'), /bispectrum\.csv:3: triangle centres must satisfy k1 >= k2 >= k3/],
      ['power.csv', (t) => t.replace('P2', 'P3'), /power\.csv: column 5 'P3' is neither a bin column nor an even multipole/],
      ['bispectrum.csv', (t) => t.replace('triangles', 'count'), /bispectrum\.csv: missing column 'triangles'/],
    ];
    for (const [file, edit, message] of cases) {
      const b = baseBundle();
      b.files[file] = edit(b.files[file]);
      expect(() => loadMeasurementBundle(writeBundle(b))).toThrow(message);
    }
  });

  it('reads mock realisations in data-vector order and refuses mocks with other bins', () => {
    const dir = writeBundle(withMocks(baseBundle(), 4));
    const mocks = loadBundleRealisations(loadMeasurementBundle(dir));
    expect(mocks).toHaveLength(4);
    expect(mocks[0]).toHaveLength(20);
    const bad = withMocks(baseBundle(), 3);
    bad.files['mocks/power/0001.csv'] = powerCsv(4);
    expect(() => loadBundleRealisations(loadMeasurementBundle(writeBundle(bad)))).toThrow(/mocks\/power\/0001\.csv: 4 bins, the measurement power\.csv has 5/);
    const bad2 = withMocks(baseBundle(), 3);
    bad2.files['mocks/bispectrum/0002.csv'] = bispectrumCsv(2);
    expect(() => loadBundleRealisations(loadMeasurementBundle(writeBundle(bad2)))).toThrow(/0002\.csv: 4 bins, the measurement bispectrum\.csv has 10/);
  });
});
