/**
 * `npm run bench [name ...]`: runs every bench/*.bench.ts (or the named ones),
 * prints each result as JSON and writes it to bench/results/<name>.json.
 */
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { machine, type Benchmark } from './harness.js';

const here = dirname(fileURLToPath(import.meta.url));
const wanted = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => wanted.length === 0 || wanted.includes(f.replace(/\.bench\.ts$/, '')))
  .sort();
if (files.length === 0) {
  console.error(`no benchmarks found${wanted.length ? ` for ${wanted.join(', ')}` : ''}`);
  process.exit(2);
}
mkdirSync(join(here, 'results'), { recursive: true });
for (const file of files) {
  const mod = (await import(pathToFileURL(join(here, file)).href)) as { default: Benchmark };
  const bench = mod.default;
  process.stderr.write(`running ${bench.name} ...\n`);
  const result = { name: bench.name, date: new Date().toISOString(), machine: machine(), results: await bench.run() };
  const text = JSON.stringify(result, null, 2);
  console.log(text);
  writeFileSync(join(here, 'results', `${bench.name}.json`), `${text}\n`);
}
