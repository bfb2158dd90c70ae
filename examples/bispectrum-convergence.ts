/**
 * Convergence of the continuous bin average of the tree-level bispectrum in the
 * Gauss–Legendre order of the bin-volume quadrature (docs/bispectrum-convergence.md).
 * Run: npx tsx examples/bispectrum-convergence.ts
 * Prints a markdown table: max over bins of |B_l(order)/B_l(reference) - 1|, and
 * of |B_2 - B_2(reference)| / |B_0(reference)| (B_2 crosses zero in a few bins).
 */
import { continuousBinNodes, enumerateTriangleBins, orientationRule, shellGrid, TreeMultipoleEvaluator } from '../src/bispectrum/index.js';
import { linearPowerFromCosmology, readLinearTheoryConfig } from '../src/cosmology/index.js';

const config = readLinearTheoryConfig(new URL('../data-demo/demo-cosmology.json', import.meta.url).pathname);
const spectrum = linearPowerFromCosmology(config.cosmology, config.redshift);
const params = { b1: 2, b2: 0.4, bG2: -0.3, f: spectrum.growthRateLargeScale, bispShotPower: 1, bispShotConst: 1 };
const settings = { spectrum, numberDensity: 3e-4, velocityDispersion: 4 };
const rule = orientationRule(6, 8);

console.log('| binning | order | volume nodes | max rel. error B_0 | max rel. error B_2 | max B_2 error / B_0 |');
console.log('| --- | --- | --- | --- | --- | --- |');
for (const [kMin, kMax, dk, orders, refOrder] of [
  [0.01, 0.15, 0.01, [2, 3, 4, 5, 6], 9],
  [0.01, 0.2, 0.005, [2, 3, 4, 5], 7],
] as const) {
  const bins = enumerateTriangleBins(shellGrid(kMin, kMax, dk));
  const run = (order: number) => {
    const nodes = continuousBinNodes(bins, order);
    return { n: nodes.weight.length, v: new TreeMultipoleEvaluator(nodes, [0, 2], rule).evaluate(settings, params) };
  };
  const ref = run(refOrder).v;
  for (const order of orders) {
    const { n, v } = run(order);
    let e0 = 0;
    let e2 = 0;
    let e20 = 0;
    for (let b = 0; b < bins.size; b++) {
      e0 = Math.max(e0, Math.abs(v[b] / ref[b] - 1));
      e2 = Math.max(e2, Math.abs(v[bins.size + b] / ref[bins.size + b] - 1));
      e20 = Math.max(e20, Math.abs(v[bins.size + b] - ref[bins.size + b]) / Math.abs(ref[b]));
    }
    console.log(`| ${bins.size} bins, ${kMin}–${kMax}, dk ${dk} | ${order} | ${n} | ${e0.toExponential(1)} | ${e2.toExponential(1)} | ${e20.toExponential(1)} |`);
  }
}
