import { EXP_TABLE, EXP_TABLE_LIMIT } from '../numerics/fast-exp.js';
import type { OrientationGeometry } from './tree-multipole-distorted.js';
import { TREE_MULTIPOLE_KERNEL_WASM } from './tree-multipole-kernel-wasm.js';
import { TREE_TEMPLATE_SIZE } from './tree-template-terms.js';
import type { SharedGridSplines } from '../numerics/cubic-spline.js';
import { compileEmbeddedWasm, WasmArena, type EmbeddedWasmModule } from '../numerics/embedded-wasm.js';

/** The damping of every loop: a and c of the mu-dependent BAO damping exp(-u^2 [a + c mu^2]), sigma_v^2 / 2. */
export interface LoopDamping {
  readonly aIR: number;
  readonly cIR: number;
  readonly halfSv2: number;
}

/** What the loops without AP need per evaluation: side powers (P_nw, damped-at-mu=0 wiggle) and the damping. */
export interface DampedSideInputs extends LoopDamping {
  readonly noWiggle: Float64Array;
  readonly wiggle: Float64Array;
}

/** Per-evaluation inputs of the B_l loop, as TreeMultipoleEvaluator prepares them. */
export interface MultipoleLoopInputs extends DampedSideInputs {
  readonly b1: number;
  readonly bG2: number;
  readonly f: number;
  readonly hb2: number;
  readonly hf: number;
  readonly stochConst: number;
  readonly stochP: number;
}

/** Per-evaluation inputs of the template loop: the side powers, damping and 1/nbar. */
export interface TemplateLoopInputs extends DampedSideInputs {
  readonly inverseDensity: number;
}

/**
 * Inputs of the template loop with AP distortion (tree-multipole-distorted.ts):
 * the spline tables of the tabulated spectrum, the damping exp(-q^2 Sigma^2 -
 * t^2 (a + c nu^2)) (a, c and Sigma^2 all zero without IR resummation), 1/nbar,
 * alpha_par and the dilation of tree-multipole-distorted.ts (`dilation`).
 */
export interface DistortedTemplateInputs extends LoopDamping {
  readonly splines: ReturnType<SharedGridSplines['packed']>;
  readonly sigma2: number;
  readonly inverseDensity: number;
  readonly alphaPar: number;
  readonly dilation: { readonly ip2: number; readonly iq2: number; readonly amp: number };
}

interface KernelExports {
  setExpTable(pointer: number): void;
  multipoles(...args: number[]): void;
  templates(...args: number[]): void;
}

/** Whether this runtime compiles the kernel (WebAssembly with SIMD). */
export function compiledKernelAvailable(): boolean {
  return compileEmbeddedWasm(TREE_MULTIPOLE_KERNEL_WASM) !== null;
}

/**
 * Orientation loops of TreeMultipoleEvaluator compiled to WebAssembly with
 * SIMD (wasm/tree-multipole-kernel.ts and wasm/tree-template-loop.ts, built
 * into tree-multipole-kernel-wasm.ts by `npm run build:wasm`): B_l without AP
 * distortion, and the averaged templates without and with AP distortion
 * (tree-multipole-distorted.ts). The same terms, two mu nodes per f64x2 vector
 * (and for B_l the phi sum in two chains), so rounding differs; faster than the
 * JavaScript loops on one core (bench/bispectrum.bench.ts). Each instance owns
 * a WebAssembly memory holding the geometry, copied once; per evaluation only
 * the side powers (or, with AP, the spline tables of the tabulated spectrum)
 * and a few constants go in. `create` returns undefined where WebAssembly SIMD
 * is not available; `accepts` and `acceptsDistorted` tell whether an
 * evaluation keeps the kernel's exp arguments in its table range
 * (0 <= x < 64); otherwise the JavaScript loop runs.
 */
export class CompiledMultipoleKernel {
  private readonly arena: WasmArena<KernelExports>;
  private readonly binCount: number;
  private readonly multipoleCount: number;
  private readonly muPairs: number;
  private readonly phiCount: number;
  private readonly kMax2: number;
  private readonly at: Record<
    'start' | 'k1' | 'k2' | 'k3' | 'cos12' | 'sin12' | 'weight' | 'pairs' | 'index' | 'mu' | 'los' | 'muWeights' | 'nw' | 'w' | 'consts' | 'acc' | 'out' | 'templateAcc' | 'templateOut',
    number
  >;
  private readonly distinct: number;
  /** Where the AP loop's spline tables go, reserved on first use (grid points held). */
  private gridSize = 0;
  private gridAt: { x: number; values: number } | undefined;

  static create(geometry: OrientationGeometry, pairKernels: Float64Array, sideIndex: Int32Array, distinctLengths: number, kMax: number): CompiledMultipoleKernel | undefined {
    const module = compileEmbeddedWasm(TREE_MULTIPOLE_KERNEL_WASM);
    return module ? new CompiledMultipoleKernel(module, geometry, pairKernels, sideIndex, distinctLengths, kMax) : undefined;
  }

  private constructor(module: EmbeddedWasmModule, g: OrientationGeometry, pairKernels: Float64Array, sideIndex: Int32Array, distinctLengths: number, kMax: number) {
    const arena = new WasmArena<KernelExports>(module, 'B_l orientation loop');
    this.arena = arena;
    const { nodes, muCount, phiCount, multipoleCount: nm } = g;
    this.binCount = nodes.binCount;
    this.multipoleCount = nm;
    this.phiCount = phiCount;
    this.muPairs = Math.ceil(muCount / 2);
    this.kMax2 = kMax * kMax;
    this.distinct = distinctLengths;
    // Mu nodes in pairs (lane = mu node parity); an odd last pair gets a padding lane of weight 0.
    const pairs = this.muPairs;
    const mu = new Float64Array(2 * pairs).fill(0.5);
    const los = new Float64Array(2 * pairs * phiCount);
    const muWeights = new Float64Array(2 * pairs * nm);
    for (let j = 0; j < muCount; j++) {
      const jj = j >> 1;
      const lane = j & 1;
      mu[2 * jj + lane] = g.mu[j];
      for (let p = 0; p < phiCount; p++) los[2 * (jj * phiCount + p) + lane] = g.lineOfSightSide2[j * phiCount + p];
      for (let m = 0; m < nm; m++) muWeights[2 * (jj * nm + m) + lane] = g.muWeights[j * nm + m];
    }
    const put = (a: Float64Array | Int32Array) => arena.put(a);
    arena.exports.setExpTable(put(EXP_TABLE));
    this.at = {
      start: put(nodes.start),
      k1: put(nodes.k1),
      k2: put(nodes.k2),
      k3: put(nodes.k3),
      cos12: put(g.cos12),
      sin12: put(g.sin12),
      weight: put(nodes.weight),
      pairs: put(pairKernels),
      index: put(sideIndex),
      mu: put(mu),
      los: put(los),
      muWeights: put(muWeights),
      nw: arena.reserve(8 * distinctLengths),
      w: arena.reserve(8 * distinctLengths),
      consts: arena.reserve(8 * 14),
      acc: arena.reserve(8 * nm),
      out: arena.reserve(8 * nm * nodes.binCount),
      templateAcc: arena.reserve(16 * nm * TREE_TEMPLATE_SIZE),
      templateOut: arena.reserve(8 * nm * TREE_TEMPLATE_SIZE * nodes.binCount),
    };
  }

  /** Whether every exp argument of this evaluation stays in 0 <= x < 64 (u^2 <= k^2, mu^2 <= 1). */
  accepts(v: LoopDamping): boolean {
    return this.inTableRange(v, 0, this.kMax2);
  }

  /** B_l, layout [multipole][bin] (a new array). */
  multipoles(v: MultipoleLoopInputs): Float64Array {
    const { arena, at } = this;
    this.putSidePowers(v);
    arena.f64(at.consts, 10).set([v.b1, v.bG2, v.f, v.hb2, v.hf, v.stochConst, v.stochP, v.aIR, v.cIR, v.halfSv2]);
    arena.exports.multipoles(
      this.binCount, at.start, at.k1, at.k2, at.k3, at.cos12, at.sin12, at.weight, at.pairs, at.index, at.nw, at.w,
      this.muPairs, this.phiCount, at.mu, at.los, at.muWeights, this.multipoleCount, at.consts, at.acc, at.out,
    );
    return arena.f64(at.out, this.multipoleCount * this.binCount).slice();
  }

  /** Averaged templates, layout [bin][multipole][value] (a new array). */
  templates(v: TemplateLoopInputs): Float64Array {
    this.putSidePowers(v);
    // AP switch off; the AP slots (alpha_par, 1/alpha_par^2, 1/alpha_perp^2, amplitude, Sigma^2, spline) unused.
    return this.runTemplates([v.aIR, v.cIR, v.halfSv2, v.inverseDensity, 0, 1, 1, 1, 1, 0, 0, 0, 0, 0], 0, 0);
  }

  /** Whether the AP template loop keeps every exp argument in 0 <= x < 64 (true lengths up to kMax / min alpha). */
  acceptsDistorted(v: DistortedTemplateInputs): boolean {
    return this.inTableRange(v, v.sigma2, this.kMax2 * Math.max(v.dilation.ip2, v.dilation.iq2));
  }

  /** exp(-q^2 Sigma^2 - t^2 (a + c nu^2)) and the fingers-of-god exp in the table for q^2 <= q2Max (t^2 <= q^2, nu^2 <= 1). */
  private inTableRange(v: LoopDamping, sigma2: number, q2Max: number): boolean {
    return v.aIR >= 0 && v.cIR >= 0 && sigma2 >= 0 && (sigma2 + v.aIR + v.cIR) * q2Max < EXP_TABLE_LIMIT && v.halfSv2 * 3 * q2Max < EXP_TABLE_LIMIT;
  }

  /** Averaged templates with AP distortion, layout [bin][multipole][value] (a new array). */
  distortedTemplates(v: DistortedTemplateInputs): Float64Array {
    const { x, values, x0, invStep, step2over6, last } = v.splines;
    if (x.length > this.gridSize) {
      this.gridSize = x.length;
      this.gridAt = { x: this.arena.reserve(8 * x.length), values: this.arena.reserve(32 * x.length) };
    }
    const g = this.gridAt as { x: number; values: number };
    this.arena.f64(g.x, x.length).set(x);
    this.arena.f64(g.values, values.length).set(values);
    const { ip2, iq2, amp } = v.dilation;
    const consts = [v.aIR, v.cIR, v.halfSv2, v.inverseDensity, 1, v.alphaPar, ip2, iq2, amp, v.sigma2, x0, invStep, step2over6, last];
    return this.runTemplates(consts, g.x, g.values);
  }

  private runTemplates(consts: number[], grid: number, records: number): Float64Array {
    const { arena, at } = this;
    arena.f64(at.consts, consts.length).set(consts);
    arena.exports.templates(
      this.binCount, at.start, at.k1, at.k2, at.k3, at.cos12, at.sin12, at.weight, at.pairs, at.index, at.nw, at.w,
      this.muPairs, this.phiCount, at.mu, at.los, at.muWeights, this.multipoleCount, at.consts, grid, records, at.templateAcc, at.templateOut,
    );
    return arena.f64(at.templateOut, this.multipoleCount * TREE_TEMPLATE_SIZE * this.binCount).slice();
  }

  private putSidePowers(v: DampedSideInputs): void {
    this.arena.f64(this.at.nw, this.distinct).set(v.noWiggle);
    this.arena.f64(this.at.w, this.distinct).set(v.wiggle);
  }
}
