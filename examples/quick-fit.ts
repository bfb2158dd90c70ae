/**
 * Library example: the quick best fit of the bundled invented demo data
 * (data-demo/fit.json) without sampling, printed with its chi-square.
 * Run: npx tsx examples/quick-fit.ts
 */
import { findBestFit, readRunConfig } from '../src/index.js';

const config = readRunConfig(new URL('../data-demo/fit.json', import.meta.url).pathname);
const best = await findBestFit(config, { workers: 0 });
for (const a of best.assumptions) console.log(`${a.key}: ${a.value}`);
console.log('\nbest fit:', Object.fromEntries(Object.entries(best.values).map(([k, v]) => [k, Number(v.toPrecision(5))])));
console.log(`chi2 = ${best.chi2.toFixed(1)} for ${best.dof} dof, p = ${best.pValue.toPrecision(3)}`);
