import { InputError } from '../contracts/input-error.js';
import { fundamentalFrequency, latticeShell } from '../numerics/lattice-shell.js';
import { powerBinEdges, validatePowerKBins, type PowerKBins } from './k-bins.js';

/**
 * The discrete wavevectors of a periodic box of side L (line of sight = z axis)
 * in each power-spectrum k bin, grouped by (|n|^2, n_z^2): every vector of a
 * group has the same k and |mu|, so a model even in mu is evaluated once per group.
 */
export interface LatticeBinModes {
  /** Number of wavevectors in the shell, n and -n both counted (independent complex modes: half of it). */
  readonly modeCount: number;
  /** Mean |k| over the wavevectors, h/Mpc. */
  readonly meanK: number;
  /** One entry per (|n|^2, n_z^2) group: k, |mu| and the number of vectors. */
  readonly k: Float64Array;
  readonly mu: Float64Array;
  readonly multiplicity: Float64Array;
}

/** Recent results by (boxSize, bins): they do not depend on the spectrum, so models for new spectra reuse them. */
const cache = new Map<string, readonly LatticeBinModes[]>();
const CACHE_SIZE = 8;

/**
 * Mode groups, counts and mean k of every bin; the zero vector is never a mode.
 * The result is shared between callers: do not modify its arrays.
 */
export function latticeBinModes(boxSize: number, bins: PowerKBins): readonly LatticeBinModes[] {
  if (!Number.isFinite(boxSize) || boxSize <= 0) throw new InputError(`boxSize must be a positive length in Mpc/h, got ${boxSize}`);
  validatePowerKBins(bins);
  const key = `${boxSize}|${bins.kMin}|${bins.dk}|${bins.count}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const modes = enumerateBinModes(boxSize, bins);
  if (cache.size >= CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  cache.set(key, modes);
  return modes;
}

function enumerateBinModes(boxSize: number, bins: PowerKBins): LatticeBinModes[] {
  const kf = fundamentalFrequency(boxSize);
  const out: LatticeBinModes[] = [];
  for (let i = 0; i < bins.count; i++) {
    const [lo, hi] = powerBinEdges(bins, i);
    const shell = latticeShell(boxSize, lo, hi);
    // Key n^2 * stride + n_z^2 with n_z^2 <= n^2 < stride: exact while stride^2 < 2^53.
    const stride = Math.ceil((hi / kf) ** 2) + 1;
    const groups = new Map<number, number>();
    for (let v = 0; v < shell.count; v++) {
      const n2 = shell.normSquared[v];
      if (n2 === 0) continue;
      const nz = shell.vectors[3 * v + 2];
      const key = n2 * stride + nz * nz;
      groups.set(key, (groups.get(key) ?? 0) + 1);
    }
    const size = groups.size;
    const k = new Float64Array(size);
    const mu = new Float64Array(size);
    const multiplicity = new Float64Array(size);
    let count = 0;
    let sumK = 0;
    let g = 0;
    // Sorted by (|n|^2, n_z^2): groups of equal k sit together, so models can reuse what depends on k alone.
    for (const [key, m] of [...groups].sort((a, b) => a[0] - b[0])) {
      const n2 = Math.floor(key / stride);
      const nz2 = key - n2 * stride;
      k[g] = kf * Math.sqrt(n2);
      mu[g] = Math.sqrt(nz2 / n2);
      multiplicity[g] = m;
      count += m;
      sumK += m * k[g];
      g++;
    }
    if (count === 0) {
      throw new InputError(`bins: shell ${i} [${lo}, ${hi}) h/Mpc holds no wavevector of a box of side ${boxSize} Mpc/h`, {
        hint: `the fundamental frequency is ${kf} h/Mpc; widen bins.dk or enlarge the box`,
      });
    }
    out.push({ modeCount: count, meanK: sumK / count, k, mu, multiplicity });
  }
  return out;
}
