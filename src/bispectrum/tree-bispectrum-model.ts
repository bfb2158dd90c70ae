import { InputError } from '../contracts/input-error.js';
import type { DataVectorEntry, LinearDecomposition, ParameterValues, StatisticModel } from '../contracts/statistic-model.js';
import { centreTriangleNodes, DEFAULT_ORIENTATION_NODES, DEFAULT_VOLUME_ORDER, effectiveTriangleNodes } from './bin-averaging.js';
import { continuousBinNodes } from './continuous-bin-nodes.js';
import { averageOverTriangleNodes } from './orientation-average.js';
import { checkMultipoles, exactPolynomialOrientationRule, orientationRule, type OrientationRule } from './orientation-rule.js';
import type { TriangleBins } from './triangle-bins.js';
import type { TriangleNodeSet } from './triangle-node-set.js';
import { TreeTemplateCombiner } from './compiled-template-combination.js';
import { TreeDirectIntegrand } from './tree-direct-integrand.js';
import { TreeMultipoleEvaluator } from './tree-multipole-evaluator.js';
import type { TreeBispectrumParameters } from './tree-template-terms.js';
import { TabulatedSpectrum } from './tabulated-spectrum.js';
import {
  checkWavenumbersInTable,
  isOrientationPolynomial,
  resolveTreeSettings,
  trueWavenumberRange,
  type ResolvedTreeSettings,
  type TreeBispectrumSettings,
} from './tree-settings.js';
import { userTriangleNodes } from './user-triangles.js';
import { discreteBoxBinAverage } from './lattice/discrete-box-average.js';
import { latticeMemoisedSpectrum } from './lattice/memoised-spectrum.js';
import type { TriangleIntegrand } from './triangle-integrand.js';
import { TreeTemplateIntegrand } from './tree-template-integrand.js';

export const BIN_AVERAGING_METHODS = ['centres', 'effective', 'continuous', 'box'] as const;
export type BinAveragingMethod = (typeof BIN_AVERAGING_METHODS)[number];

export interface TreeBispectrumModelOptions extends TreeBispectrumSettings {
  /** Triangle bins (from enumerateTriangleBins), or else `triangles`. */
  readonly bins?: TriangleBins;
  /** A user list of triangles (k1, k2, k3), evaluated as given. */
  readonly triangles?: readonly (readonly number[])[];
  /** Name of the triangle list in error messages (a file name). */
  readonly trianglesSource?: string;
  /** How bins are averaged; default 'continuous'. Ignored for `triangles`. */
  readonly averaging?: BinAveragingMethod;
  /** Even multipoles; default [0, 2]. */
  readonly multipoles?: readonly number[];
  /** Orientation nodes; default exact for the polynomial model, else DEFAULT_ORIENTATION_NODES. */
  readonly orientationNodes?: { readonly mu: number; readonly phi: number };
  /** Gauss–Legendre order of the continuous bin average; default DEFAULT_VOLUME_ORDER. */
  readonly volumeOrder?: number;
  /** Side of the periodic box (Mpc/h) for averaging 'box': the exact average over its lattice triangles, line of sight along z. */
  readonly boxSize?: number;
  /** Cache folder of the discrete-box averages (default $TREBLE_CACHE_DIR, else ~/.cache/treble). */
  readonly latticeCacheDir?: string;
  /** Re-tabulate the spectrum on a fine grid for fast lookups (TabulatedSpectrum); default true. */
  readonly tabulateSpectrum?: boolean;
}

/** Parameter names the model reads (docs/conventions.md, "Bispectrum"). */
export const TREE_BISPECTRUM_PARAMETERS = ['b1', 'b2', 'bG2', 'f', 'bispShotPower', 'bispShotConst', 'alphaPar', 'alphaPerp', 'bispSigmaV'] as const;
const LINEAR = ['b2', 'bG2', 'bispShotPower', 'bispShotConst'] as const;
/** Parameters whose change means new templates (the geometry of the integrand). */
const NON_POLYNOMIAL = ['alphaPar', 'alphaPerp', 'bispSigmaV'] as const;

export function parseBinAveraging(name: string, where = 'averaging'): BinAveragingMethod {
  const hit = BIN_AVERAGING_METHODS.find((m) => m === name);
  if (!hit) throw new InputError(`${where}: unknown bin averaging "${name}" (known: ${BIN_AVERAGING_METHODS.join(', ')})`);
  return hit;
}

/**
 * Default orientation nodes for a 1e-6 relative target on B_0 and B_2: exact
 * for the polynomial model (no damping, no AP, no IR resummation); 4 x 5 with
 * IR resummation alone; with fingers-of-god damping or AP, 4 + e mu nodes and
 * 6 + e phi nodes where e = max(0, ceil(3 sigma_v kMax) - 1) grows with the
 * damping reached at the largest wavenumber kMax
 * (tests/bispectrum/orientation-convergence.test.ts).
 */
export function defaultTreeOrientationRule(s: ResolvedTreeSettings, lMax: number, kMax: number): OrientationRule {
  if (isOrientationPolynomial(s)) return exactPolynomialOrientationRule(lMax);
  const minMu = Math.ceil((9 + lMax) / 4);
  if (s.velocityDispersion === 0 && s.alphaPar === 1 && s.alphaPerp === 1) {
    return orientationRule(Math.max(DEFAULT_ORIENTATION_NODES.mu, minMu), DEFAULT_ORIENTATION_NODES.phi - 1);
  }
  const e = Math.max(0, Math.ceil((3 * s.velocityDispersion * kMax) / Math.min(s.alphaPar, s.alphaPerp)) - 1);
  return orientationRule(Math.max(DEFAULT_ORIENTATION_NODES.mu + e, minMu), DEFAULT_ORIENTATION_NODES.phi + e);
}

/**
 * The tree-level redshift-space galaxy bispectrum multipoles on triangle bins as
 * a StatisticModel. Building it fixes the geometry (bin nodes, orientation
 * nodes); templates are computed for the current alphaPar, alphaPerp and
 * bispSigmaV and reused while those stay the same, so evaluating for new b1,
 * b2, bG2, f and stochastic amplitudes is a dot product per bin.
 */
export class TreeBispectrumModel implements StatisticModel {
  readonly entries: readonly DataVectorEntry[];
  readonly parameterNames: readonly string[] = TREE_BISPECTRUM_PARAMETERS;
  readonly linearParameterNames: readonly string[] = LINEAR;
  readonly defaults: ParameterValues;
  readonly multipoles: readonly number[];
  readonly nodes: TriangleNodeSet;
  private readonly options: TreeBispectrumModelOptions;
  private readonly userRule: OrientationRule | undefined;
  private cacheKey = '';
  private table: TabulatedSpectrum | undefined;
  private readonly evaluators = new Map<string, TreeMultipoleEvaluator>();
  private readonly kLo: number;
  private readonly kHi: number;
  private cachedTemplates: Float64Array | undefined;
  private readonly combiner: TreeTemplateCombiner;
  /** Bins and box side when averaging over the lattice of a periodic box. */
  private readonly box: { readonly bins: TriangleBins; readonly boxSize: number } | undefined;

  constructor(options: TreeBispectrumModelOptions) {
    const settings = resolveTreeSettings(options);
    this.options = options;
    this.multipoles = options.multipoles ?? [0, 2];
    checkMultipoles(this.multipoles);
    this.combiner = new TreeTemplateCombiner(this.multipoles.length);
    if ((options.bins === undefined) === (options.triangles === undefined)) {
      throw new InputError('bispectrum model: give exactly one of bins and triangles');
    }
    const labels: number[][] = [];
    if (options.triangles !== undefined) {
      this.nodes = userTriangleNodes(options.triangles, options.trianglesSource);
      options.triangles.forEach((t) => labels.push([...t]));
    } else {
      const bins = options.bins as TriangleBins;
      const method = parseBinAveraging(options.averaging ?? 'continuous');
      const order = options.volumeOrder ?? DEFAULT_VOLUME_ORDER;
      if (method === 'box') {
        if (!(Number.isFinite(options.boxSize) && (options.boxSize as number) > 0)) {
          throw new InputError(`bispectrum model: averaging "box" needs a positive boxSize in Mpc/h, got ${options.boxSize}`);
        }
        this.box = { bins, boxSize: options.boxSize as number };
      }
      // For 'box' the effective nodes only fix the wavenumber range checked against the linear spectrum.
      this.nodes =
        method === 'centres' ? centreTriangleNodes(bins) : method === 'effective' || method === 'box' ? effectiveTriangleNodes(bins, order) : continuousBinNodes(bins, order);
      for (let b = 0; b < bins.size; b++) labels.push(Array.from(bins.centres.subarray(3 * b, 3 * b + 3)));
    }
    let lo = Infinity;
    let hi = 0;
    for (const side of [this.nodes.k1, this.nodes.k2, this.nodes.k3]) for (const x of side) (lo = Math.min(lo, x)), (hi = Math.max(hi, x));
    this.kLo = lo;
    this.kHi = hi;
    this.userRule = options.orientationNodes ? orientationRule(options.orientationNodes.mu, options.orientationNodes.phi) : undefined;
    this.entries = this.multipoles.flatMap((l) => labels.map((k) => ({ block: `B${l}`, k })));
    this.defaults = {
      b1: 1,
      b2: 0,
      bG2: 0,
      f: settings.spectrum.growthRateLargeScale,
      bispShotPower: 1,
      bispShotConst: 1,
      alphaPar: settings.alphaPar,
      alphaPerp: settings.alphaPerp,
      bispSigmaV: settings.velocityDispersion,
    };
  }

  /** Templates [bin][multipole][value] for the non-polynomial parameters in `params`. */
  templates(params: ParameterValues = {}): Float64Array {
    const key = NON_POLYNOMIAL.map((n) => params[n] ?? this.defaults[n]).join('|');
    if (this.cachedTemplates && key === this.cacheKey) return this.cachedTemplates;
    const { settings, rule } = this.prepare(params);
    this.cachedTemplates = this.box ? this.boxAverage(new TreeTemplateIntegrand({ ...settings, spectrum: latticeMemoisedSpectrum(settings.spectrum, this.box.boxSize) })) : this.evaluatorFor(rule).templates(settings, false);
    this.cacheKey = key;
    return this.cachedTemplates;
  }

  /** Exact average over the box's lattice triangles, [bin][multipole][value], cached on disk; refuses bins without lattice triangles. */
  private boxAverage(integrand: TriangleIntegrand): Float64Array {
    const box = this.box as NonNullable<typeof this.box>;
    const avg = discreteBoxBinAverage(box.bins, box.boxSize, integrand, { multipoles: this.multipoles, cacheDir: this.options.latticeCacheDir });
    const empty = Array.from(avg.counts).findIndex((c) => c === 0);
    if (empty >= 0) {
      const c = Array.from(box.bins.centres.subarray(3 * empty, 3 * empty + 3));
      throw new InputError(`bispectrum model: triangle bin ${empty + 1} (${c.join(', ')}) holds no triangle of the box lattice (L = ${box.boxSize} Mpc/h); drop it or use a larger box`);
    }
    return avg.values;
  }

  /** The direct path: B_l from TreeDirectIntegrand on the same nodes, rule and spectrum (layout of evaluate). */
  evaluateDirect(params: ParameterValues): Float64Array {
    const { settings, rule } = this.prepare(params);
    const direct = new TreeDirectIntegrand(settings, this.polynomialParameters(params));
    const avg = this.box ? this.boxAverage(direct) : averageOverTriangleNodes(this.nodes, direct, this.multipoles, rule);
    const nb = this.nodes.binCount;
    const nm = this.multipoles.length;
    const out = new Float64Array(nb * nm);
    for (let b = 0; b < nb; b++) for (let m = 0; m < nm; m++) out[m * nb + b] = avg[b * nm + m];
    return out;
  }

  /** Geometry (pair kernels, Legendre weights) per orientation rule, built once. */
  private evaluatorFor(rule: OrientationRule): TreeMultipoleEvaluator {
    const key = `${rule.muCount}x${rule.phiCount}`;
    let hit = this.evaluators.get(key);
    if (!hit) {
      hit = new TreeMultipoleEvaluator(this.nodes, this.multipoles, rule);
      this.evaluators.set(key, hit);
    }
    return hit;
  }

  private prepare(params: ParameterValues): { settings: ResolvedTreeSettings; rule: OrientationRule } {
    const [alphaPar, alphaPerp, sigma] = NON_POLYNOMIAL.map((n) => params[n] ?? this.defaults[n]);
    const settings = resolveTreeSettings({ ...this.options, alphaPar, alphaPerp, velocityDispersion: sigma });
    checkWavenumbersInTable(settings, this.kLo, this.kHi, 'bispectrum model');
    const rule = this.userRule ?? defaultTreeOrientationRule(settings, Math.max(...this.multipoles), this.kHi);
    if (this.options.tabulateSpectrum === false) return { settings, rule };
    const [qLo, qHi] = trueWavenumberRange(settings, this.kLo, this.kHi);
    if (!this.table || qLo < this.table.kMin || qHi > this.table.kMax) {
      // Re-tabulate with room for moderate AP changes before the next re-tabulation.
      const src = settings.spectrum;
      this.table = new TabulatedSpectrum(src, Math.max(src.kMin, qLo / 1.1), Math.min(src.kMax, qHi * 1.1));
    }
    return { settings: { ...settings, spectrum: this.table }, rule };
  }

  evaluate(params: ParameterValues, out?: Float64Array): Float64Array {
    const templates = this.templates(params);
    // Template arrays are never changed in place here: a new array is a new set.
    if (!this.combiner.holds(templates)) this.combiner.load(templates);
    return this.combiner.combine(this.polynomialParameters(params), out);
  }

  linearPart(params: ParameterValues, linear: readonly string[]): LinearDecomposition {
    for (const name of linear) {
      if (!(LINEAR as readonly string[]).includes(name)) {
        throw new InputError(`bispectrum model: "${name}" is not a linear parameter (linear: ${LINEAR.join(', ')})`);
      }
    }
    const zeroed: Record<string, number> = { ...this.defaults, ...params };
    for (const name of linear) zeroed[name] = 0;
    const offset = this.evaluate(zeroed);
    const columns = linear.map((name) => {
      const col = this.evaluate({ ...zeroed, [name]: 1 });
      for (let i = 0; i < col.length; i++) col[i] -= offset[i];
      return col;
    });
    return { names: [...linear], offset, columns };
  }

  private polynomialParameters(params: ParameterValues): TreeBispectrumParameters {
    const v = (n: string) => {
      const x = params[n] ?? this.defaults[n];
      if (!Number.isFinite(x)) throw new InputError(`bispectrum model: parameter ${n} must be a finite number, got ${x}`);
      return x;
    };
    return { b1: v('b1'), b2: v('b2'), bG2: v('bG2'), f: v('f'), bispShotPower: v('bispShotPower'), bispShotConst: v('bispShotConst') };
  }
}
