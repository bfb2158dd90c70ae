import { compileEmbeddedWasm, WasmArena, type EmbeddedWasmModule } from '../numerics/embedded-wasm.js';
import { combineTreeTemplates, templateBinCount } from './tree-template-combination.js';
import { TREE_TEMPLATE_SIZE, treeTemplateCoefficients, type TreeBispectrumParameters } from './tree-template-terms.js';
import { TREE_TEMPLATE_DOT_WASM } from './tree-template-dot-wasm.js';

interface DotExports {
  combine(nBins: number, nMultipoles: number, templates: number, coefficients: number, out: number): void;
}

/**
 * combineTreeTemplates for a sampler's inner loop: `load` copies a template set
 * into WebAssembly memory, and each `combine` is the same dot product in SIMD
 * (wasm/tree-template-dot.ts), several times faster for thousands of bins
 * (bench/bispectrum.bench.ts). One WebAssembly memory per combiner, reused for
 * every template set of the same size. Where WebAssembly SIMD is unavailable
 * it keeps the loaded array and calls combineTreeTemplates. Layouts as
 * combineTreeTemplates: templates [bin][multipole][value], out [multipole][bin].
 */
export class TreeTemplateCombiner {
  readonly multipoleCount: number;
  private readonly module: EmbeddedWasmModule | null;
  /** The array last loaded (a copy where WebAssembly is unavailable). */
  private loaded: Float64Array | undefined;
  private wasm: { arena: WasmArena<DotExports>; size: number; templates: number; coefficients: number; out: number } | undefined;

  constructor(multipoleCount: number) {
    this.multipoleCount = multipoleCount;
    this.module = compileEmbeddedWasm(TREE_TEMPLATE_DOT_WASM);
  }

  /** Whether the WebAssembly dot product is in use. */
  get compiled(): boolean {
    return this.module !== null;
  }

  /** Whether `templates` is the array last loaded. */
  holds(templates: Float64Array): boolean {
    return this.loaded === templates;
  }

  /** Take a template set (copied: later changes to the array need another `load`). */
  load(templates: Float64Array): void {
    templateBinCount(templates, this.multipoleCount);
    if (!this.module) {
      this.loaded = templates.slice();
      return;
    }
    if (this.wasm?.size !== templates.length) {
      const arena = new WasmArena<DotExports>(this.module, 'template combination');
      const values = templates.length / TREE_TEMPLATE_SIZE;
      this.wasm = { arena, size: templates.length, templates: arena.reserve(templates.byteLength), coefficients: arena.reserve(8 * TREE_TEMPLATE_SIZE), out: arena.reserve(8 * values) };
    }
    this.wasm.arena.f64(this.wasm.templates, templates.length).set(templates);
    this.loaded = templates;
  }

  /** B_l [multipole][bin] of the loaded templates for these parameters. */
  combine(params: TreeBispectrumParameters, out?: Float64Array): Float64Array {
    if (!this.loaded) throw new Error('TreeTemplateCombiner: combine before load');
    const w = this.wasm;
    if (!w) return combineTreeTemplates(this.loaded, this.multipoleCount, params, out);
    const n = w.size / TREE_TEMPLATE_SIZE;
    treeTemplateCoefficients(params, w.arena.f64(w.coefficients, TREE_TEMPLATE_SIZE));
    w.arena.exports.combine(n / this.multipoleCount, this.multipoleCount, w.templates, w.coefficients, w.out);
    const res = out ?? new Float64Array(n);
    res.set(w.arena.f64(w.out, n));
    return res;
  }
}
