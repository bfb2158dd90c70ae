import { compileEmbeddedWasm, WasmArena, type EmbeddedWasmModule } from '../numerics/embedded-wasm.js';
import { combineTreeTemplates } from './tree-template-combination.js';
import { TREE_TEMPLATE_SIZE, treeTemplateCoefficients, type TreeBispectrumParameters } from './tree-template-terms.js';
import { TREE_TEMPLATE_DOT_WASM } from './tree-template-dot-wasm.js';

interface DotExports {
  combine(nBins: number, nMultipoles: number, templates: number, coefficients: number, out: number): void;
}

let compiled: EmbeddedWasmModule | null | undefined;

/**
 * combineTreeTemplates for a sampler's inner loop: the templates are copied
 * into WebAssembly memory when they change (compared by identity) and each call
 * is the same dot product in SIMD (wasm/tree-template-dot.ts), several times
 * faster for thousands of bins (bench/bispectrum.bench.ts). One WebAssembly
 * memory per combiner, reused for every template set of the same size. Where
 * WebAssembly SIMD is unavailable it calls combineTreeTemplates. Layouts as
 * combineTreeTemplates: templates [bin][multipole][value], out [multipole][bin].
 * The copy is keyed on the array's identity: pass a new array for new template
 * values (every template builder here returns one), not the same one changed in place.
 */
export class TreeTemplateCombiner {
  readonly multipoleCount: number;
  private current: Float64Array | undefined;
  private wasm: { arena: WasmArena<DotExports>; size: number; templates: number; coefficients: number; out: number } | undefined;

  constructor(multipoleCount: number) {
    this.multipoleCount = multipoleCount;
    if (compiled === undefined) compiled = compileEmbeddedWasm(TREE_TEMPLATE_DOT_WASM);
  }

  /** Whether the WebAssembly dot product is in use. */
  get compiled(): boolean {
    return compiled !== null;
  }

  combine(templates: Float64Array, params: TreeBispectrumParameters, out?: Float64Array): Float64Array {
    const stride = this.multipoleCount * TREE_TEMPLATE_SIZE;
    if (!compiled || templates.length % stride !== 0) return combineTreeTemplates(templates, this.multipoleCount, params, out);
    const bins = templates.length / stride;
    const n = bins * this.multipoleCount;
    if (this.wasm?.size !== templates.length) {
      const arena = new WasmArena<DotExports>(compiled, 'template combination');
      this.wasm = { arena, size: templates.length, templates: arena.reserve(templates.byteLength), coefficients: arena.reserve(8 * TREE_TEMPLATE_SIZE), out: arena.reserve(8 * n) };
      this.current = undefined;
    }
    const w = this.wasm;
    if (this.current !== templates) {
      w.arena.f64(w.templates, templates.length).set(templates);
      this.current = templates;
    }
    treeTemplateCoefficients(params, w.arena.f64(w.coefficients, TREE_TEMPLATE_SIZE));
    w.arena.exports.combine(bins, this.multipoleCount, w.templates, w.coefficients, w.out);
    const res = out ?? new Float64Array(n);
    res.set(w.arena.f64(w.out, n));
    return res;
  }
}
