import { describe, expect, it } from 'vitest';
import { fundamentalFrequency, latticeShell } from '../../src/numerics/lattice-shell.js';

describe('lattice shells', () => {
  it('counts the integer vectors of small shells exactly (sums of three squares, OEIS A005875)', () => {
    // r_3(n) for n = 0..5 is 1, 6, 12, 8, 6, 24 (OEIS A005875).
    const L = 2 * Math.PI; // k_f = 1
    const kf = fundamentalFrequency(L);
    const r3 = [1, 6, 12, 8, 6, 24];
    for (let n = 0; n < r3.length; n++) {
      const shell = latticeShell(L, Math.sqrt(n) * kf, Math.sqrt(n + 0.5) * kf);
      expect(shell.count).toBe(r3[n]);
    }
  });

  it('uses the half-open rule: a vector on the upper edge belongs to the next shell', () => {
    const L = 2 * Math.PI;
    const below = latticeShell(L, 0.5, 2);
    const above = latticeShell(L, 2, 2.5);
    expect(Array.from(below.normSquared).includes(4)).toBe(false);
    expect(Array.from(above.normSquared).filter((n) => n === 4).length).toBe(6);
  });

  it('approaches the continuum mode count 4 pi k^2 dk / k_f^3 for thick shells (common practice)', () => {
    const L = 3000; // shell 0.095-0.105 h/Mpc is ~48 k_f out and ~5 k_f thick
    const kf = fundamentalFrequency(L);
    const shell = latticeShell(L, 0.095, 0.105);
    const continuum = (4 * Math.PI * (0.105 ** 3 - 0.095 ** 3)) / 3 / kf ** 3;
    expect(Math.abs(shell.count / continuum - 1)).toBeLessThan(0.01);
  });
});
