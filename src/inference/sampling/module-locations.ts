import { existsSync } from 'node:fs';

/** The first candidate (relative to this module) that exists, else an error naming what was looked for. */
function firstExisting(candidates: readonly string[], what: string): URL {
  for (const rel of candidates) {
    const url = new URL(rel, import.meta.url);
    if (existsSync(url)) return url;
  }
  throw new Error(`${what} not found near ${import.meta.url}; was the package built with it?`);
}

const fromSource = import.meta.url.endsWith('.ts');

/**
 * Where the worker entry is. From source (tsx, vitest) it is the sibling
 * worker-entry.ts, which needs tsx in the worker; from the build it is
 * dist/sampling-worker.js (tsup.config.ts), beside or above the bundle chunk
 * this module was built into.
 */
export function samplingWorkerEntry(): { url: URL; typescript: boolean } {
  if (fromSource) return { url: new URL('./worker-entry.ts', import.meta.url), typescript: true };
  return { url: firstExisting(['./sampling-worker.js', '../sampling-worker.js', '../../sampling-worker.js'], 'sampling worker entry'), typescript: false };
}

/**
 * The treble library entry (src/index.ts from source, dist/index.js from the
 * build) as a file: URL, for log-posterior references to library exports,
 * e.g. { module: trebleLibraryModule(), exportName: 'createJointLogPosterior', options }.
 */
export function trebleLibraryModule(): string {
  if (fromSource) return new URL('../../index.ts', import.meta.url).href;
  return firstExisting(['./index.js', '../index.js', '../../index.js'], 'treble library entry').href;
}
