import { existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { discreteBoxBinAverage, discreteBoxTriangleCounts } from '../../../src/bispectrum/lattice/discrete-box-average.js';
import { latticeCacheFolder } from '../../../src/bispectrum/lattice/lattice-cache.js';
import { latticeBinAverage } from '../../../src/bispectrum/lattice/lattice-bin-average.js';
import type { TriangleIntegrand } from '../../../src/bispectrum/triangle-integrand.js';
import { fixtureBins, fixtureIntegrand, loadLatticeFixture } from './support/fixture.js';
import { analyticTreeIntegrand } from './support/analytic-tree-integrand.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-lattice-cache-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const c = loadLatticeFixture().cases[1];
const bins = fixtureBins(c.kMin, c.dk, c.shellCount);

describe('discrete-box average with its disk cache', () => {
  it('computes once, then reads the identical result from the cache', () => {
    const cacheDir = join(dir, 'a');
    const first = discreteBoxBinAverage(bins, c.boxSize, fixtureIntegrand, { multipoles: [0, 2, 4], cacheDir });
    expect(first.fromCache).toBe(false);
    expect(readdirSync(latticeCacheFolder(cacheDir)).length).toBe(1);
    const second = discreteBoxBinAverage(bins, c.boxSize, fixtureIntegrand, { multipoles: [0, 2, 4], cacheDir });
    expect(second.fromCache).toBe(true);
    expect(Array.from(second.values)).toEqual(Array.from(first.values));
    expect(Array.from(second.counts)).toEqual(c.counts); // numpy brute force, tests/fixtures/numpy-lattice
  });

  it('misses when the integrand, the multipoles, the box or the label change', () => {
    const cacheDir = join(dir, 'b');
    const base = analyticTreeIntegrand(1.0);
    expect(discreteBoxBinAverage(bins, c.boxSize, base, { cacheDir }).fromCache).toBe(false);
    expect(discreteBoxBinAverage(bins, c.boxSize, base, { cacheDir }).fromCache).toBe(true);
    expect(discreteBoxBinAverage(bins, c.boxSize, analyticTreeIntegrand(1.001), { cacheDir }).fromCache).toBe(false);
    expect(discreteBoxBinAverage(bins, c.boxSize, base, { cacheDir, multipoles: [0] }).fromCache).toBe(false);
    expect(discreteBoxBinAverage(bins, c.boxSize * 1.01, base, { cacheDir }).fromCache).toBe(false);
    expect(discreteBoxBinAverage(bins, c.boxSize, base, { cacheDir, label: 'v2' }).fromCache).toBe(false);
    expect(readdirSync(latticeCacheFolder(cacheDir)).length).toBe(5);
  });

  it('recomputes rather than trusting a damaged cache file, and writes nothing with cache: false', () => {
    const cacheDir = join(dir, 'c');
    const integrand = analyticTreeIntegrand(1.0);
    discreteBoxBinAverage(bins, c.boxSize, integrand, { cacheDir });
    const [file] = readdirSync(latticeCacheFolder(cacheDir));
    writeFileSync(join(latticeCacheFolder(cacheDir), file), '{"format": 1, "key": {}');
    const again = discreteBoxBinAverage(bins, c.boxSize, integrand, { cacheDir });
    expect(again.fromCache).toBe(false);
    expect(discreteBoxBinAverage(bins, c.boxSize, integrand, { cacheDir }).fromCache).toBe(true);
    const off = join(dir, 'off');
    discreteBoxBinAverage(bins, c.boxSize, integrand, { cacheDir: off, cache: false });
    expect(existsSync(latticeCacheFolder(off))).toBe(false);
  });

  it('keeps empty bins (no lattice triangle) as NaN with count 0 through the cache', () => {
    const cacheDir = join(dir, 'd');
    const thin = fixtureBins(0.01, 0.003, 6); // shells 0.48 k_f wide at L = 1000: some hold no vector
    const integrand: TriangleIntegrand = { size: 1, evaluate: (k1, _k2, _k3, _m1, _m2, _m3, out, o) => void (out[o] = k1) };
    const first = discreteBoxBinAverage(thin, 1000, integrand, { cacheDir, multipoles: [0] });
    const empty = Array.from(first.counts.keys()).filter((b) => first.counts[b] === 0);
    expect(empty.length).toBeGreaterThan(0);
    const second = discreteBoxBinAverage(thin, 1000, integrand, { cacheDir, multipoles: [0] });
    expect(second.fromCache).toBe(true);
    for (const b of empty) expect(Number.isNaN(second.values[b])).toBe(true);
    expect(Array.from(second.counts)).toEqual(Array.from(first.counts));
  });

  it('caches the counts alone', () => {
    const cacheDir = join(dir, 'e');
    expect(Array.from(discreteBoxTriangleCounts(bins, c.boxSize, { cacheDir }))).toEqual(c.counts);
    expect(readdirSync(latticeCacheFolder(cacheDir)).length).toBe(1);
    expect(Array.from(discreteBoxTriangleCounts(bins, c.boxSize, { cacheDir }))).toEqual(c.counts);
  });

  it('gives the same tree-like average with and without the z -> -z reduction (the integrand is even in mu)', () => {
    const integrand = analyticTreeIntegrand(1.0);
    const even = latticeBinAverage(bins, c.boxSize, [0, 2], integrand, { evenInMu: true });
    const general = latticeBinAverage(bins, c.boxSize, [0, 2], integrand, { evenInMu: false });
    for (let n = 0; n < even.values.length; n++) {
      // Rounding only: relative to the monopole of the same bin and component
      // (layout [bin][2 multipoles][2 values]).
      const scale = Math.abs(general.values[Math.floor(n / 4) * 4 + (n % 2)]);
      expect(Math.abs(even.values[n] - general.values[n]) / scale).toBeLessThan(1e-12);
    }
  });
});
