import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/contracts/input-error.js';
import { latticeBinAverage, latticeTriangleCounts } from '../../../src/bispectrum/lattice/lattice-bin-average.js';
import { fixtureBins, fixtureIntegrand, loadLatticeFixture } from './support/fixture.js';

const fixture = loadLatticeFixture();

describe('exact discrete-box triangle average', () => {
  for (const c of fixture.cases) {
    const bins = fixtureBins(c.kMin, c.dk, c.shellCount);

    it(`lists the same bins as the numpy enumeration (${c.name})`, () => {
      expect(Array.from(bins.indices)).toEqual(c.bins.flat());
    });

    it(`counts every lattice triangle exactly as a brute-force numpy enumeration (${c.name})`, () => {
      // Source: tests/fixtures/numpy-lattice/lattice_triangles.py (all pairs, no symmetry used).
      expect(Array.from(latticeTriangleCounts(bins, c.boxSize))).toEqual(c.counts);
    });

    for (const evenInMu of [true, false]) {
      it(`averages analytic integrands as the numpy enumeration, multipoles 0, 2, 4 (${c.name}, evenInMu=${evenInMu})`, () => {
        const avg = latticeBinAverage(bins, c.boxSize, c.multipoles, fixtureIntegrand, { evenInMu });
        expect(Array.from(avg.counts)).toEqual(c.counts);
        // Component 5 (mu1 + mu1 mu2) is not even in mu, so only the general mode may average it.
        const checked = evenInMu ? [0, 1, 2, 3, 4] : [0, 1, 2, 3, 4, 5];
        for (let b = 0; b < bins.size; b++) {
          for (let m = 0; m < c.multipoles.length; m++) {
            for (const t of checked) {
              const ref = c.averages[b][m][t] as number;
              const got = avg.values[(b * c.multipoles.length + m) * avg.size + t];
              // Sums in a different order: rounding only (scale set by the monopole of the component).
              const scale = Math.abs(c.averages[b][0][t] as number) + 1e-300;
              expect(Math.abs(got - ref) / scale).toBeLessThan(1e-11);
            }
          }
        }
      });
    }
  }

  // Continuum count of ordered triangles in a bin: V123 / k_f^6 with
  // V123 = 8 pi^2 int k1 k2 k3 [triangle closes] dk1 dk2 dk3, which is
  // 8 pi^2 c1 c2 c3 dk^3 when the whole bin closes and about half of that on a
  // closed isosceles edge c1 = c2 + c3 (Scoccimarro 2004, PRD 70, 083007;
  // Sefusatti et al. 2006, PRD 74, 023522). Lattice-point discrepancy of a shell
  // of radius R ~ 6-20 k_f and width ~3 k_f is a percent or two (Gauss sphere
  // problem, common practice), so a few percent per triangle bin.
  const { boxSize, kMin, dk, shellCount, bins: continuum } = fixture.continuum;
  const asymptoticBins = fixtureBins(kMin, dk, shellCount);
  const asymptoticCounts = latticeTriangleCounts(asymptoticBins, boxSize);
  const kf = (2 * Math.PI) / boxSize;
  const centreFormula = (b: number): number => {
    const [c1, c2, c3] = asymptoticBins.centres.subarray(3 * b, 3 * b + 3);
    return (8 * Math.PI ** 2 * c1 * c2 * c3 * dk ** 3) / kf ** 6;
  };

  it('matches 8 pi^2 c1 c2 c3 dk^3 / k_f^6 where the whole bin closes (L = 1000, k = 6-20 k_f)', () => {
    let seen = 0;
    for (let b = 0; b < asymptoticBins.size; b++) {
      const [c1, c2, c3] = asymptoticBins.centres.subarray(3 * b, 3 * b + 3);
      if (c1 - c2 - c3 > -1.5 * dk + 1e-9) continue;
      seen++;
      expect(Math.abs(asymptoticCounts[b] / centreFormula(b) - 1)).toBeLessThan(0.05);
    }
    expect(seen).toBeGreaterThan(10);
  });

  it('matches the scipy continuum count, about half the centre formula on closed isosceles edges (L = 1000)', () => {
    let edges = 0;
    for (let b = 0; b < asymptoticBins.size; b++) {
      expect(Array.from(asymptoticBins.indices.subarray(3 * b, 3 * b + 3))).toEqual(continuum[b].bin);
      const volume = continuum[b].continuum;
      // Slivers (c1 - c2 - c3 = dk: under 3% of the bin closes) hold too few points for a few-percent check.
      if (volume < 0.25 * centreFormula(b)) continue;
      const [c1, c2, c3] = asymptoticBins.centres.subarray(3 * b, 3 * b + 3);
      if (Math.abs(c1 - c2 - c3) < 1e-9 && c2 === c3) {
        edges++;
        expect(Math.abs(asymptoticCounts[b] / centreFormula(b) - 0.5)).toBeLessThan(0.1);
      }
      expect(Math.abs(asymptoticCounts[b] / volume - 1)).toBeLessThan(0.05);
    }
    expect(edges).toBe(2); // (0.08, 0.04, 0.04) and (0.12, 0.06, 0.06)
  });

  it('rejects bad input with InputError', () => {
    const bins = fixtureBins(0.02, 0.02, 3);
    expect(() => latticeTriangleCounts(bins, 0)).toThrow(InputError);
    expect(() => latticeTriangleCounts(bins, Number.NaN)).toThrow(InputError);
    expect(() => latticeBinAverage(bins, 500, [1], fixtureIntegrand)).toThrow(InputError);
    expect(() => latticeBinAverage(bins, 500, [], fixtureIntegrand)).toThrow(InputError);
    expect(() => latticeBinAverage(bins, 500, [0], { size: 0, evaluate() {} })).toThrow(InputError);
  });
});
