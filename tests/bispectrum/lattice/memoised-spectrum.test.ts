import { describe, expect, it } from 'vitest';
import type { LinearSpectrum } from '../../../src/contracts/linear-spectrum.js';
import { latticeMemoisedSpectrum } from '../../../src/bispectrum/lattice/memoised-spectrum.js';

function countingSpectrum(): { spectrum: LinearSpectrum; calls: () => number } {
  let calls = 0;
  const spectrum: LinearSpectrum = {
    redshift: 0.5,
    kMin: 1e-4,
    kMax: 10,
    power: (k) => (calls++, k / (1 + (k / 0.02) ** 2)),
    powerNoWiggle: (k) => (calls++, 0.9 * k / (1 + (k / 0.02) ** 2)),
    growthRate: () => 0.8,
    growthRateLargeScale: 0.8,
    sigma2BAO: 30,
    deltaSigma2BAO: 5,
    sigma8: 0.6,
  };
  return { spectrum, calls: () => calls };
}

describe('lattice-memoised spectrum', () => {
  it('returns identical values and asks the wrapped spectrum once per lattice wavenumber', () => {
    const { spectrum, calls } = countingSpectrum();
    const boxSize = 1500;
    const kf = (2 * Math.PI) / boxSize;
    const memo = latticeMemoisedSpectrum(spectrum, boxSize);
    for (let pass = 0; pass < 3; pass++) {
      for (let a = 1; a < 3000; a += 7) {
        const k = kf * Math.sqrt(a);
        expect(memo.power(k)).toBe(spectrum.power(k));
        expect(memo.powerNoWiggle(k)).toBe(spectrum.powerNoWiggle(k));
      }
    }
    // 3 passes x 429 wavenumbers x 2 functions asked directly, plus 429 x 2 once through the memo.
    expect(calls()).toBe(3 * 429 * 2 + 429 * 2);
  });

  it('passes wavenumbers off the lattice straight through, never returning a neighbour value', () => {
    const { spectrum } = countingSpectrum();
    const memo = latticeMemoisedSpectrum(spectrum, 1000);
    const kf = (2 * Math.PI) / 1000;
    const k = kf * Math.sqrt(50);
    expect(memo.power(k)).toBe(spectrum.power(k));
    const near = k * (1 + 1e-9); // rounds to the same integer a
    expect(memo.power(near)).toBe(spectrum.power(near));
    expect(memo.power(near)).not.toBe(spectrum.power(k));
    expect(memo.power(1e4)).toBe(spectrum.power(1e4)); // beyond 1024 k_f
  });
});
