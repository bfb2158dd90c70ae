import { describe, expect, it } from 'vitest';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { latticeTriangleCounts } from '../../src/bispectrum/lattice/lattice-bin-average.js';
import { fundamentalFrequency } from '../../src/numerics/lattice-shell.js';
import { triangleGeometryByFft } from '../../src/mocks/bispectrum-multipoles.js';
import { binsNeedingShift } from '../../src/mocks/triangle-sums.js';

describe('FFT triangle counts against the exact lattice enumeration (src/bispectrum/lattice)', () => {
  it('agree bin by bin on a 32^3 mesh with shells up to 14.25 k_f, shifted sums included', () => {
    const mesh = { n: 32, boxSize: 1000 };
    const kf = fundamentalFrequency(mesh.boxSize);
    const bins = enumerateTriangleBins(shellGrid(1.5 * kf, 13.5 * kf, 1.5 * kf));
    expect(binsNeedingShift(mesh, bins).reduce((a, v) => a + v, 0)).toBeGreaterThan(5);
    const fft = triangleGeometryByFft(mesh, bins).counts;
    const exact = latticeTriangleCounts(bins, mesh.boxSize);
    expect(Array.from(fft)).toEqual(Array.from(exact));
  });
});
