import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { homedir } from 'node:os';
import { join } from 'node:path';

/**
 * On-disk cache of discrete-box averages. One JSON file per key under
 * <cache folder>/lattice-averages/<sha256 of the key>.json, the folder being
 * the `cacheDir` option, else $TREBLE_CACHE_DIR, else ~/.cache/treble. The file
 * repeats its key, which is compared in full on reading (a hash collision or an
 * edited file is a miss, never a wrong answer).
 */
export const LATTICE_CACHE_FORMAT = 1;

export type LatticeCacheKey = Readonly<Record<string, string | number | boolean | readonly number[]>>;

export interface LatticeCacheEntry {
  readonly counts: Float64Array;
  readonly values: Float64Array;
  /** Seconds the computation took when the entry was written. */
  readonly seconds: number;
}

export function latticeCacheFolder(cacheDir?: string): string {
  return join(cacheDir ?? process.env.TREBLE_CACHE_DIR ?? join(homedir(), '.cache', 'treble'), 'lattice-averages');
}

export function latticeCachePath(key: LatticeCacheKey, cacheDir?: string): string {
  const name = createHash('sha256').update(JSON.stringify({ format: LATTICE_CACHE_FORMAT, ...key })).digest('hex').slice(0, 32);
  return join(latticeCacheFolder(cacheDir), `${name}.json`);
}

export function readLatticeCache(key: LatticeCacheKey, cacheDir?: string): LatticeCacheEntry | null {
  const path = latticeCachePath(key, cacheDir);
  if (!existsSync(path)) return null;
  let stored: { format?: number; key?: unknown; counts?: unknown; values?: unknown; seconds?: unknown };
  try {
    stored = JSON.parse(readFileSync(path, 'utf8'));
  } catch {
    return null;
  }
  if (stored.format !== LATTICE_CACHE_FORMAT || JSON.stringify(stored.key) !== JSON.stringify(key)) return null;
  if (!Array.isArray(stored.counts) || !Array.isArray(stored.values)) return null;
  // JSON writes NaN (a bin without lattice triangles) as null.
  const numbers = (a: unknown[]): Float64Array => Float64Array.from(a, (v) => (typeof v === 'number' ? v : Number.NaN));
  return { counts: numbers(stored.counts), values: numbers(stored.values), seconds: Number(stored.seconds) };
}

export function writeLatticeCache(key: LatticeCacheKey, entry: LatticeCacheEntry, cacheDir?: string): string {
  const path = latticeCachePath(key, cacheDir);
  mkdirSync(latticeCacheFolder(cacheDir), { recursive: true });
  const text = JSON.stringify({
    format: LATTICE_CACHE_FORMAT,
    key,
    written: new Date().toISOString(),
    seconds: entry.seconds,
    counts: Array.from(entry.counts),
    values: Array.from(entry.values),
  });
  const partial = `${path}.${process.pid}.partial`;
  writeFileSync(partial, text);
  renameSync(partial, path);
  return path;
}
