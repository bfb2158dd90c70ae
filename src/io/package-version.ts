import { readFileSync } from 'node:fs';

/** Package version, read from package.json next to src/ or dist/. */
function readVersion(): string {
  for (const rel of ['../../package.json', '../package.json']) {
    try {
      const text = readFileSync(new URL(rel, import.meta.url), 'utf8');
      const parsed = JSON.parse(text) as { name?: string; version?: string };
      if (parsed.name === 'treble' && parsed.version) return parsed.version;
    } catch {
      // try the next candidate location
    }
  }
  return '0.0.0';
}

export const version = readVersion();
