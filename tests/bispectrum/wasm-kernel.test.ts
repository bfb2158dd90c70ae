import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { continuousBinNodes } from '../../src/bispectrum/continuous-bin-nodes.js';
import { averageOverTriangleNodes } from '../../src/bispectrum/orientation-average.js';
import { orientationRule } from '../../src/bispectrum/orientation-rule.js';
import { TreeDirectIntegrand } from '../../src/bispectrum/tree-direct-integrand.js';
import { compiledKernelAvailable } from '../../src/bispectrum/compiled-multipole-kernel.js';
import { TreeMultipoleEvaluator } from '../../src/bispectrum/tree-multipole-evaluator.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { compileWasmKernel, renderGeneratedModule, WASM_KERNELS } from '../../scripts/wasm-kernel-build.js';
import { TreeTemplateCombiner } from '../../src/bispectrum/compiled-template-combination.js';
import { combineTreeTemplates } from '../../src/bispectrum/tree-template-combination.js';
import { TREE_TEMPLATE_SIZE } from '../../src/bispectrum/tree-template-terms.js';
import { Random } from '../../src/numerics/random.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

// The WebAssembly B_l loop (compiled-multipole-kernel.ts) against the JavaScript loop it compiles and
// against the generic orientation average; both are this project's own code, so the checks are
// agreement to rounding (common practice for a port of a loop), plus provenance of the embedded bytes.
const spectrum = analyticSpectrum();
const params = { b1: 2.1, b2: -0.4, bG2: 0.2, f: 0.8, bispShotPower: 0.7, bispShotConst: 1.3 };
const bins = enumerateTriangleBins(shellGrid(0.02, 0.1, 0.02));
const nodes = continuousBinNodes(bins, 3);

/** Largest |a - b| over multipoles and bins, in units of the bin's largest |B_l| in b; layout [multipole][bin]. */
function maxScaledDifference(a: Float64Array, b: Float64Array, binCount: number): number {
  const nm = b.length / binCount;
  let e = 0;
  for (let bin = 0; bin < binCount; bin++) {
    let scale = 0;
    for (let m = 0; m < nm; m++) scale = Math.max(scale, Math.abs(b[m * binCount + bin]));
    for (let m = 0; m < nm; m++) e = Math.max(e, Math.abs(a[m * binCount + bin] - b[m * binCount + bin]) / scale);
  }
  return e;
}

/** Largest |a - b| over templates [bin][multipole][term], in units of the largest |b| of the same bin and term. */
function maxTemplateDifference(a: Float64Array, b: Float64Array, nm: number): number {
  const T = TREE_TEMPLATE_SIZE;
  const binCount = b.length / (nm * T);
  let worst = 0;
  for (let bin = 0; bin < binCount; bin++) {
    for (let t = 0; t < T; t++) {
      let scale = 0;
      for (let m = 0; m < nm; m++) scale = Math.max(scale, Math.abs(b[(bin * nm + m) * T + t]));
      for (let m = 0; m < nm; m++) worst = Math.max(worst, Math.abs(a[(bin * nm + m) * T + t] - b[(bin * nm + m) * T + t]) / scale);
    }
  }
  return worst;
}

/** The generic average, [bin][multipole], as [multipole][bin]. */
function genericMultipoles(settings: Record<string, unknown>, multipoles: number[], rule: ReturnType<typeof orientationRule>): Float64Array {
  const g = averageOverTriangleNodes(nodes, new TreeDirectIntegrand(settings as never, params), multipoles, rule);
  const nm = multipoles.length;
  const out = new Float64Array(g.length);
  for (let bin = 0; bin < nodes.binCount; bin++) for (let m = 0; m < nm; m++) out[m * nodes.binCount + bin] = g[bin * nm + m];
  return out;
}

describe('compiled B_l and template loops (WebAssembly SIMD)', () => {
  for (const kernel of WASM_KERNELS) {
    it(`the embedded bytes of ${kernel.generated} are a fresh build of ${kernel.source}`, async () => {
      const bytes = await compileWasmKernel(kernel);
      expect(readFileSync(kernel.generated, 'utf8')).toBe(renderGeneratedModule(kernel, bytes));
    }, 60_000);
  }

  it('compiles on this runtime (Node 20 has WebAssembly SIMD), so the default path is the compiled one', () => {
    expect(compiledKernelAvailable()).toBe(true);
  });

  const cases: { name: string; rule: [number, number]; multipoles: number[]; extra: Record<string, number | boolean> }[] = [
    { name: 'IR resummation, 4 x 5 rule, B_0 and B_2', rule: [4, 5], multipoles: [0, 2], extra: {} },
    { name: 'IR and fingers-of-god damping, odd mu count, four multipoles', rule: [5, 6], multipoles: [0, 2, 4, 6], extra: { velocityDispersion: 4 } },
    { name: 'one multipole, one mu node', rule: [1, 3], multipoles: [2], extra: { velocityDispersion: 2 } },
  ];
  for (const c of cases) {
    it(`equals the JavaScript loop to 1e-13 and the generic average to 1e-12 of the largest |B_l| (${c.name})`, () => {
      const rule = orientationRule(...c.rule);
      const settings = { spectrum, numberDensity: 2e-4, ...c.extra };
      const compiled = new TreeMultipoleEvaluator(nodes, c.multipoles, rule).evaluate(settings, params, false);
      const js = new TreeMultipoleEvaluator(nodes, c.multipoles, rule, { compiledKernel: false }).evaluate(settings, params, false);
      const generic = genericMultipoles(settings, c.multipoles, rule);
      expect(maxScaledDifference(compiled, js, nodes.binCount)).toBeLessThan(1e-13);
      expect(maxScaledDifference(compiled, generic, nodes.binCount)).toBeLessThan(1e-12);
    });
  }

  for (const c of cases) {
    it(`its template loop equals the JavaScript template loop to 1e-13 of the largest |template| per bin and term (${c.name})`, () => {
      const rule = orientationRule(...c.rule);
      const settings = { spectrum, numberDensity: 2e-4, ...c.extra };
      const compiled = new TreeMultipoleEvaluator(nodes, c.multipoles, rule).templates(settings, false);
      const js = new TreeMultipoleEvaluator(nodes, c.multipoles, rule, { compiledKernel: false }).templates(settings, false);
      expect(compiled.length).toBe(js.length);
      const nm = c.multipoles.length;
      expect(maxTemplateDifference(compiled, js, nm)).toBeLessThan(1e-13);
      // Combined, the compiled templates give the compiled direct B_l (issue #3: template = direct to 1e-10).
      const direct = new TreeMultipoleEvaluator(nodes, c.multipoles, rule).evaluate(settings, params, false);
      expect(maxScaledDifference(combineTreeTemplates(compiled, nm, params), direct, nodes.binCount)).toBeLessThan(1e-12);
    });
  }

  const apCases: { name: string; rule: [number, number]; multipoles: number[]; extra: Record<string, number | boolean> }[] = [
    { name: 'IR resummation, alpha_par 1.03, alpha_perp 0.97', rule: [4, 6], multipoles: [0, 2], extra: { alphaPar: 1.03, alphaPerp: 0.97 } },
    { name: 'IR and fingers-of-god damping, odd mu count, four multipoles', rule: [5, 7], multipoles: [0, 2, 4, 6], extra: { alphaPar: 0.96, alphaPerp: 1.02, velocityDispersion: 4 } },
    { name: 'no IR resummation, one mu node', rule: [1, 3], multipoles: [2], extra: { alphaPar: 1.01, alphaPerp: 1.04, irResummation: false } },
  ];
  for (const c of apCases) {
    it(`its AP template loop equals the JavaScript AP loop to 1e-13 per bin and term (${c.name})`, () => {
      const rule = orientationRule(...c.rule);
      const settings = { spectrum, numberDensity: 2e-4, ...c.extra };
      const compiled = new TreeMultipoleEvaluator(nodes, c.multipoles, rule).templates(settings);
      const js = new TreeMultipoleEvaluator(nodes, c.multipoles, rule, { compiledKernel: false }).templates(settings);
      const nm = c.multipoles.length;
      expect(compiled.length).toBe(js.length);
      expect(maxTemplateDifference(compiled, js, nm)).toBeLessThan(1e-13);
      // Combined, they give the direct AP loop's B_l.
      const direct = new TreeMultipoleEvaluator(nodes, c.multipoles, rule).evaluate(settings, params);
      expect(maxScaledDifference(combineTreeTemplates(compiled, nm, params), direct, nodes.binCount)).toBeLessThan(1e-12);
    });
  }

  it('falls back to the JavaScript loop when an exp argument would leave the table (0 <= x < 64)', () => {
    // sigma_v^2 / 2 * 3 k^2 >= 64 at the largest side: the compiled kernel declines.
    const rule = orientationRule(4, 5);
    const settings = { spectrum, numberDensity: 2e-4, velocityDispersion: 60 };
    const compiled = new TreeMultipoleEvaluator(nodes, [0, 2], rule).evaluate(settings, params, false);
    expect(maxScaledDifference(compiled, genericMultipoles(settings, [0, 2], rule), nodes.binCount)).toBeLessThan(1e-12);
  });
});

describe('compiled template combination (WebAssembly SIMD)', () => {
  it('equals combineTreeTemplates to 1e-14 for random templates and parameters, and follows each loaded set', () => {
    const rng = new Random(5);
    const combiner = new TreeTemplateCombiner(2);
    expect(combiner.compiled).toBe(true);
    for (const bins of [3, 477, 477, 50]) {
      const templates = Float64Array.from({ length: bins * 2 * TREE_TEMPLATE_SIZE }, () => rng.uniform() - 0.3);
      const params = { b1: 1 + rng.uniform(), b2: rng.uniform() - 0.5, bG2: -rng.uniform(), f: 0.5 + rng.uniform(), bispShotPower: rng.uniform(), bispShotConst: rng.uniform() };
      const js = combineTreeTemplates(templates, 2, params);
      const out = new Float64Array(js.length);
      combiner.load(templates);
      // The combiner holds a copy: changing the array afterwards does not change the result.
      templates.fill(0);
      const wasm = combiner.combine(params, out);
      expect(wasm).toBe(out);
      let scale = 0;
      for (const v of js) scale = Math.max(scale, Math.abs(v));
      for (let i = 0; i < js.length; i++) expect(Math.abs(wasm[i] - js[i]) / scale).toBeLessThan(1e-14);
    }
  });

  it('refuses templates whose length does not fit the multipole count, as combineTreeTemplates does', () => {
    expect(() => new TreeTemplateCombiner(2).load(new Float64Array(2 * TREE_TEMPLATE_SIZE + 1))).toThrow(/not a multiple/);
  });
});
