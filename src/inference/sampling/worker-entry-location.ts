import { existsSync } from 'node:fs';

/**
 * Where the worker entry is. From source (tsx, vitest) it is the sibling
 * worker-entry.ts, which needs tsx in the worker; from the build it is
 * dist/sampling-worker.js (tsup.config.ts), beside or above the bundle chunk
 * this module was built into.
 */
export function samplingWorkerEntry(): { url: URL; typescript: boolean } {
  const here = import.meta.url;
  if (here.endsWith('.ts')) return { url: new URL('./worker-entry.ts', here), typescript: true };
  for (const rel of ['./sampling-worker.js', '../sampling-worker.js', '../../sampling-worker.js']) {
    const url = new URL(rel, here);
    if (existsSync(url)) return { url, typescript: false };
  }
  throw new Error(`sampling worker entry not found near ${here}; was the package built with its worker entry?`);
}
