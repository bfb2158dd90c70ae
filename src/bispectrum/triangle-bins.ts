import { InputError } from '../contracts/input-error.js';

/**
 * Triangle bins on a grid of k shells (docs/conventions.md, "Binning"):
 * shell centres c_n = kMin + n dk, shell n = [c_n - dk/2, c_n + dk/2);
 * bins (i, j, l) with i >= j >= l (so c_i >= c_j >= c_l), kept when part of
 * the bin volume can close a triangle, c_i - c_j - c_l < 1.5 dk, and listed in
 * lexicographic order of (i, j, l).
 */
export interface ShellGrid {
  /** Centre of the first shell, h/Mpc. */
  readonly kMin: number;
  /** Shell width, h/Mpc. */
  readonly dk: number;
  /** Number of shells. */
  readonly count: number;
}

export interface TriangleBins {
  readonly shells: ShellGrid;
  /** Number of triangle bins. */
  readonly size: number;
  /** Shell indices, 3 per bin: [i1, j1, l1, i2, j2, l2, ...] with i >= j >= l. */
  readonly indices: Int32Array;
  /** Bin-centre wavenumbers, 3 per bin: c_i >= c_j >= c_l. */
  readonly centres: Float64Array;
}

export function shellGrid(kMin: number, kMax: number, dk: number): ShellGrid {
  if (!(dk > 0) || !Number.isFinite(dk)) throw new InputError(`triangle bins: dk must be positive, got ${dk}`);
  if (!(kMin > 0) || !Number.isFinite(kMin)) throw new InputError(`triangle bins: the first centre kMin must be positive, got ${kMin}`);
  if (!(kMax >= kMin) || !Number.isFinite(kMax)) throw new InputError(`triangle bins: kMax (${kMax}) must be at least kMin (${kMin})`);
  if (kMin - dk / 2 < 0) throw new InputError(`triangle bins: the first shell [kMin - dk/2, ...) starts below k = 0 (kMin=${kMin}, dk=${dk})`);
  const count = Math.floor((kMax - kMin) / dk + 1e-9) + 1;
  return { kMin, dk, count };
}

/** Centre of shell n. */
export function shellCentre(g: ShellGrid, n: number): number {
  return g.kMin + n * g.dk;
}

/**
 * All triangle bins of a shell grid. Shell indices are ordered so that the
 * first side has the largest centre: i >= j >= l, and bins are listed in
 * lexicographic order of (i, j, l).
 */
export function enumerateTriangleBins(g: ShellGrid): TriangleBins {
  const idx: number[] = [];
  for (let i = 0; i < g.count; i++) {
    const c1 = shellCentre(g, i);
    for (let j = 0; j <= i; j++) {
      const c2 = shellCentre(g, j);
      for (let l = 0; l <= j; l++) {
        const c3 = shellCentre(g, l);
        if (c1 - c2 - c3 < 1.5 * g.dk - 1e-12 * g.dk) idx.push(i, j, l);
      }
    }
  }
  const indices = Int32Array.from(idx);
  const centres = new Float64Array(indices.length);
  for (let n = 0; n < indices.length; n++) centres[n] = shellCentre(g, indices[n]);
  return { shells: g, size: indices.length / 3, indices, centres };
}
