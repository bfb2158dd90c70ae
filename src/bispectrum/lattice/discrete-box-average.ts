import { createHash } from 'node:crypto';
import type { TriangleBins } from '../triangle-bins.js';
import type { TriangleIntegrand } from '../triangle-integrand.js';
import { integrandFingerprint } from './integrand-fingerprint.js';
import { checkLatticeInputs, latticeBinAverage, latticeTriangleCounts, type LatticeBinAverage } from './lattice-bin-average.js';
import { readLatticeCache, writeLatticeCache, type LatticeCacheKey } from './lattice-cache.js';

/**
 * The discrete-box bin average as a fourth averaging choice for the models:
 * [bin][multipole][value] like the centre, effective and continuous averages,
 * computed once per (binning, box size, multipoles, integrand identity) and then
 * read from the on-disk cache (lattice-cache.ts).
 */
export interface DiscreteBoxOptions {
  /** Even multipoles; default [0, 2]. */
  readonly multipoles?: readonly number[];
  /** See LatticeAverageOptions; default true. */
  readonly evenInMu?: boolean;
  /** Cache folder; default $TREBLE_CACHE_DIR, else ~/.cache/treble. */
  readonly cacheDir?: string;
  /** false: compute without reading or writing the cache. Default true. */
  readonly cache?: boolean;
  /** Extra identity of the integrand (e.g. a model version) added to the cache key. */
  readonly label?: string;
}

export interface DiscreteBoxAverage extends LatticeBinAverage {
  readonly fromCache: boolean;
  /** Seconds the lattice sums took (when first computed, for a cached result). */
  readonly seconds: number;
}

function binningKey(bins: TriangleBins, boxSize: number): Record<string, number | string> {
  const g = bins.shells;
  const hash = createHash('sha256').update(new Uint8Array(bins.indices.buffer, bins.indices.byteOffset, bins.indices.byteLength)).digest('hex');
  return { boxSize, kMin: g.kMin, dk: g.dk, shellCount: g.count, bins: hash.slice(0, 32) };
}

function shellRange(bins: TriangleBins): [number, number] {
  const g = bins.shells;
  return [Math.max(g.kMin - g.dk / 2, 1e-3 * g.dk), g.kMin + (g.count - 0.5) * g.dk];
}

export function discreteBoxBinAverage(
  bins: TriangleBins,
  boxSize: number,
  integrand: TriangleIntegrand,
  options: DiscreteBoxOptions = {},
): DiscreteBoxAverage {
  const multipoles = options.multipoles ?? [0, 2];
  const evenInMu = options.evenInMu ?? true;
  checkLatticeInputs(bins, boxSize, multipoles);
  const [kLo, kHi] = shellRange(bins);
  const key: LatticeCacheKey = {
    ...binningKey(bins, boxSize),
    multipoles,
    evenInMu,
    integrandSize: integrand.size,
    integrand: integrandFingerprint(integrand, kLo, kHi),
    label: options.label ?? '',
  };
  const useCache = options.cache ?? true;
  const base = { boxSize, multipoles: [...multipoles], size: integrand.size };
  if (useCache) {
    const hit = readLatticeCache(key, options.cacheDir);
    if (hit && hit.values.length === bins.size * multipoles.length * integrand.size && hit.counts.length === bins.size) {
      return { ...base, counts: hit.counts, values: hit.values, fromCache: true, seconds: hit.seconds };
    }
  }
  const t0 = performance.now();
  const fresh = latticeBinAverage(bins, boxSize, multipoles, integrand, { evenInMu });
  const seconds = (performance.now() - t0) / 1000;
  if (useCache) writeLatticeCache(key, { counts: fresh.counts, values: fresh.values, seconds }, options.cacheDir);
  return { ...fresh, fromCache: false, seconds };
}

/** Exact lattice triangle counts per bin, cached like discreteBoxBinAverage. */
export function discreteBoxTriangleCounts(bins: TriangleBins, boxSize: number, options: Pick<DiscreteBoxOptions, 'cacheDir' | 'cache'> = {}): Float64Array {
  checkLatticeInputs(bins, boxSize, [0]);
  const key: LatticeCacheKey = { ...binningKey(bins, boxSize), integrand: 'counts only' };
  const useCache = options.cache ?? true;
  if (useCache) {
    const hit = readLatticeCache(key, options.cacheDir);
    if (hit && hit.counts.length === bins.size) return hit.counts;
  }
  const t0 = performance.now();
  const counts = latticeTriangleCounts(bins, boxSize);
  if (useCache) writeLatticeCache(key, { counts, values: new Float64Array(0), seconds: (performance.now() - t0) / 1000 }, options.cacheDir);
  return counts;
}
