import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** data-demo/ in the working directory, else the one shipped above the installed module. */
export function findDemoFolder(): string {
  if (existsSync(join('data-demo', 'fit.json'))) return resolve('data-demo');
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 5; i++) {
    const candidate = join(dir, 'data-demo');
    if (existsSync(join(candidate, 'fit.json'))) return candidate;
    dir = resolve(dir, '..');
  }
  return resolve('data-demo');
}
