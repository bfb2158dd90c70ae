import { kernelF2, kernelG2, kernelGalileonTidal } from '../perturbation/kernels.js';
import { multipoleWeights, type OrientationRule } from './orientation-rule.js';
import { expNegative } from '../numerics/fast-exp.js';
import { NodeSidePowers } from './node-side-powers.js';
import { TabulatedSpectrum } from './tabulated-spectrum.js';
import type { TriangleNodeSet } from './triangle-node-set.js';
import type { TreeBispectrumParameters } from './tree-template-terms.js';
import { dilation, distortedMultipoles, distortedTemplates, type OrientationGeometry } from './tree-multipole-distorted.js';
import { addPairTemplates } from './tree-template-integrand.js';
import { TREE_TEMPLATE_SIZE } from './tree-template-terms.js';
import { checkWavenumbersInTable, isOrientationPolynomial, resolveTreeSettings, type ResolvedTreeSettings, type TreeBispectrumSettings } from './tree-settings.js';
import { TreeAngularMoments } from './tree-angular-moments.js';
import { combineTreeTemplates } from './tree-template-combination.js';
import { directLoopConstants } from './tree-loop-constants.js';
import { CompiledMultipoleKernel } from './compiled-multipole-kernel.js';

/**
 * Full evaluation of B_l — or of the averaged templates — on a fixed geometry
 * (bin nodes, orientation rule, multipoles) for a new linear spectrum: the
 * averages of TreeDirectIntegrand and TreeTemplateIntegrand made fast.
 * Geometry that does not depend on cosmology (cosines between the sides, F2, G2
 * and sigma^2 of each pair at each node, Legendre weights per mu node, the
 * distinct side lengths) is built once. Per evaluation the
 * spectrum is re-tabulated (TabulatedSpectrum) and, without AP distortion,
 * P_nw and the damped-at-mu=0 wiggle of each side are looked up once per node
 * (NodeSidePowers); the orientation loop works with the line-of-sight
 * components u_i = k_i mu_i (u1 + u2 + u3 = 0) and only adds the mu-dependent
 * part of the BAO damping,
 *   exp(-k^2 Sigma_tot^2(mu)) = exp(-k^2 Sigma^2) exp(-u^2 [a + c mu^2]),
 *   a = f (2 + f) Sigma^2 - f^2 delta Sigma^2, c = f^2 delta Sigma^2
 * (ir-resummed-power.ts), the kernels' mu terms and the fingers-of-god factor.
 * The rule is a product rule (orientation-rule.ts): the Legendre weight is
 * applied once per mu node to the sum over phi.
 * With AP distortion the true wavenumbers change with orientation and the loops
 * of tree-multipole-distorted.ts look the spectrum up per orientation point.
 * When no P depends on its angle (isOrientationPolynomial: no IR damping left
 * in the loop — IR off or angle-averaged —, no fingers-of-god damping, no AP)
 * the orientation averages are precomputed per node instead
 * (tree-angular-moments.ts, built on first use). Otherwise, without AP
 * distortion, B_l comes from the same loop compiled to WebAssembly
 * (compiled-multipole-kernel.ts, built on first use), and so do the averaged
 * templates, with or without AP distortion (for a tabulated spectrum), unless
 * the evaluator is built with `compiledKernel` false or the kernel is
 * unavailable; the JavaScript loops here and in tree-multipole-distorted.ts
 * are their reference and fallback.
 * Output layouts: B_l [multipole][bin] as combineTreeTemplates; templates
 * [bin][multipole][value] as the averagers.
 */
export class TreeMultipoleEvaluator {
  readonly nodes: TriangleNodeSet;
  readonly multipoles: readonly number[];
  readonly rule: OrientationRule;
  /** Mu nodes, their Legendre weights and the per-point and per-node angles of the product rule. */
  private readonly geometry: OrientationGeometry;
  private readonly sidePowers: NodeSidePowers;
  private moments: TreeAngularMoments | undefined;
  /** Per node, pairs (12, 23, 31): F2, G2, sigma^2 — 9 values. */
  private readonly pairKernels: Float64Array;
  private readonly kLo: number;
  private readonly kHi: number;
  /** Whether to use the WebAssembly loops (B_l and templates); the kernel itself, once built (null: unavailable). */
  private readonly useCompiled: boolean;
  private compiled: CompiledMultipoleKernel | null | undefined;

  constructor(nodes: TriangleNodeSet, multipoles: readonly number[], rule: OrientationRule, options: { readonly compiledKernel?: boolean } = {}) {
    this.useCompiled = options.compiledKernel ?? true;
    this.nodes = nodes;
    this.multipoles = multipoles;
    this.rule = rule;
    const weights = multipoleWeights(rule, multipoles);
    const nm = multipoles.length;
    const mu = new Float64Array(rule.muCount);
    const muWeights = new Float64Array(rule.muCount * nm);
    for (let j = 0; j < rule.muCount; j++) {
      mu[j] = rule.mu1[j * rule.phiCount];
      for (let m = 0; m < nm; m++) muWeights[j * nm + m] = weights[j * rule.phiCount * nm + m];
    }
    this.sidePowers = new NodeSidePowers(nodes);
    const n = nodes.k1.length;
    const cos12 = new Float64Array(n);
    const sin12 = new Float64Array(n);
    this.pairKernels = new Float64Array(9 * n);
    let lo = Infinity;
    let hi = 0;
    for (let i = 0; i < n; i++) {
      const k = [nodes.k1[i], nodes.k2[i], nodes.k3[i]];
      for (let p = 0; p < 3; p++) {
        const a = k[p];
        const b = k[(p + 1) % 3];
        const c = k[(p + 2) % 3];
        const cab = Math.min(1, Math.max(-1, (c * c - a * a - b * b) / (2 * a * b)));
        if (p === 0) {
          cos12[i] = cab;
          sin12[i] = Math.sqrt(1 - cab * cab);
        }
        this.pairKernels[9 * i + 3 * p] = kernelF2(a, b, cab);
        this.pairKernels[9 * i + 3 * p + 1] = kernelG2(a, b, cab);
        this.pairKernels[9 * i + 3 * p + 2] = kernelGalileonTidal(cab);
        lo = Math.min(lo, a);
        hi = Math.max(hi, a);
      }
    }
    this.kLo = lo;
    this.kHi = hi;
    this.geometry = {
      nodes,
      multipoleCount: nm,
      muCount: rule.muCount,
      phiCount: rule.phiCount,
      mu,
      muWeights,
      lineOfSightSide2: rule.sinMu1.map((v, o) => v * rule.cosPhi[o]),
      cos12,
      sin12,
    };
  }

  /** B_l, layout [multipole][bin]; `tabulate` false uses the spectrum as given. */
  evaluate(settings: TreeBispectrumSettings | ResolvedTreeSettings, params: TreeBispectrumParameters, tabulate = true): Float64Array {
    const s = this.prepare(settings, tabulate);
    if (s.alphaPar !== 1 || s.alphaPerp !== 1) return distortedMultipoles(this.geometry, s, params);
    if (isOrientationPolynomial(s)) return combineTreeTemplates(this.angularMoments().templates(s, this.sidePowers), this.multipoles.length, params);
    return this.undistorted(s, params);
  }

  /** Averaged templates [bin][multipole][value] (tree-template-terms.ts), as averaging TreeTemplateIntegrand. */
  templates(settings: TreeBispectrumSettings | ResolvedTreeSettings, tabulate = true): Float64Array {
    const s = this.prepare(settings, tabulate);
    if (s.alphaPar !== 1 || s.alphaPerp !== 1) return this.compiledDistortedTemplates(s) ?? distortedTemplates(this.geometry, s);
    if (isOrientationPolynomial(s)) return this.angularMoments().templates(s, this.sidePowers);
    return this.undistortedTemplates(s);
  }

  /** The per-node angular averages of the polynomial model, built on first use (tree-angular-moments.ts). */
  angularMoments(): TreeAngularMoments {
    this.moments ??= new TreeAngularMoments(this.geometry, this.pairKernels);
    return this.moments;
  }

  private prepare(settings: TreeBispectrumSettings | ResolvedTreeSettings, tabulate: boolean): ResolvedTreeSettings {
    const s0 = 'inverseDensity' in settings ? settings : resolveTreeSettings(settings);
    checkWavenumbersInTable(s0, this.kLo, this.kHi, 'bispectrum evaluation');
    if (!tabulate) return s0;
    const aMin = Math.min(s0.alphaPar, s0.alphaPerp);
    const aMax = Math.max(s0.alphaPar, s0.alphaPerp);
    return { ...s0, spectrum: new TabulatedSpectrum(s0.spectrum, this.kLo / aMax, this.kHi / aMin) };
  }

  private undistortedTemplates(s: ResolvedTreeSettings): Float64Array {
    const { k1: K1, k2: K2, k3: K3, weight, start, binCount } = this.nodes;
    const nm = this.multipoles.length;
    const T = TREE_TEMPLATE_SIZE;
    const out = new Float64Array(binCount * nm * T);
    const { muCount, phiCount } = this.rule;
    const { mu: MU, lineOfSightSide2: SC, muWeights: WMU, cos12: C12, sin12: S12 } = this.geometry;
    const { aIR, cIR } = this.dampingCoefficients(s);
    const halfSv2 = 0.5 * s.velocityDispersion * s.velocityDispersion;
    const n1 = s.inverseDensity;
    const powers = this.sidePowers.fill(s);
    const inputs = { ...powers, aIR, cIR, halfSv2, inverseDensity: n1 };
    const kernel = this.compiledKernel();
    if (kernel && kernel.accepts(inputs)) return kernel.templates(inputs);
    const { noWiggle: NW, wiggle: WG } = powers;
    const ix = this.sidePowers.index;
    const perMu = new Float64Array(T);
    const acc = new Float64Array(nm * T);
    const pk = this.pairKernels;
    for (let bin = 0; bin < binCount; bin++) {
      acc.fill(0);
      for (let i = start[bin]; i < start[bin + 1]; i++) {
        const k1 = K1[i];
        const k2 = K2[i];
        const k3 = K3[i];
        const i1 = 1 / k1;
        const i2 = 1 / k2;
        const i3 = 1 / k3;
        const a2 = k2 * C12[i];
        const b2 = k2 * S12[i];
        const o9 = 9 * i;
        const wn = weight[i];
        for (let j = 0; j < muCount; j++) {
          const m1 = MU[j];
          const u1 = k1 * m1;
          const q1 = m1 * m1;
          const P1 = NW[ix[3 * i]] + WG[ix[3 * i]] * expNegative(u1 * u1 * (aIR + cIR * q1));
          perMu.fill(0);
          for (let p = 0; p < phiCount; p++) {
            // LOS components u_i = k_i mu_i of the three sides; u1 + u2 + u3 = 0.
            const u2 = a2 * m1 - b2 * SC[j * phiCount + p];
            const u3 = -u1 - u2;
            const m2 = u2 * i2;
            const m3 = u3 * i3;
            const q2 = m2 * m2;
            const q3 = m3 * m3;
            const P2 = NW[ix[3 * i + 1]] + WG[ix[3 * i + 1]] * expNegative(u2 * u2 * (aIR + cIR * q2));
            const P3 = NW[ix[3 * i + 2]] + WG[ix[3 * i + 2]] * expNegative(u3 * u3 * (aIR + cIR * q3));
            const damp = halfSv2 > 0 ? expNegative(halfSv2 * (u1 * u1 + u2 * u2 + u3 * u3)) : 1;
            addPairTemplates(perMu, 0, 2 * damp * P1 * P2, -u3, i1, i2, m1, m2, m3, pk[o9], pk[o9 + 1], pk[o9 + 2]);
            addPairTemplates(perMu, 0, 2 * damp * P2 * P3, -u1, i2, i3, m2, m3, m1, pk[o9 + 3], pk[o9 + 4], pk[o9 + 5]);
            addPairTemplates(perMu, 0, 2 * damp * P3 * P1, -u2, i3, i1, m3, m1, m2, pk[o9 + 6], pk[o9 + 7], pk[o9 + 8]);
            perMu[14] += n1 * (P1 + P2 + P3);
            perMu[15] += n1 * (q1 * P1 + q2 * P2 + q3 * P3);
            perMu[16] += n1 * n1;
          }
          for (let m = 0; m < nm; m++) {
            const w = wn * WMU[j * nm + m];
            const row = m * T;
            for (let t = 0; t < T; t++) acc[row + t] += w * perMu[t];
          }
        }
      }
      out.set(acc, bin * nm * T);
    }
    return out;
  }

  private undistorted(s: ResolvedTreeSettings, p: TreeBispectrumParameters): Float64Array {
    const { aIR, cIR } = this.dampingCoefficients(s);
    const constants = directLoopConstants(s, p, this.rule.phiCount);
    const powers = this.sidePowers.fill(s);
    const inputs = { ...constants, ...powers, aIR, cIR };
    const kernel = this.compiledKernel();
    if (kernel && kernel.accepts(inputs)) return kernel.multipoles(inputs);
    const { k1: K1, k2: K2, k3: K3, weight, start, binCount } = this.nodes;
    const nm = this.multipoles.length;
    const out = new Float64Array(binCount * nm);
    const { muCount, phiCount } = this.rule;
    const { mu: MU, lineOfSightSide2: SC, muWeights: WMU, cos12: C12, sin12: S12 } = this.geometry;
    const { fog, halfSv2, b1, bG2, f, hb2, hf, stochConst, stochP } = constants;
    const { noWiggle: NW, wiggle: WG } = powers;
    const ix = this.sidePowers.index;
    const pk = this.pairKernels;
    const acc = new Float64Array(nm);
    for (let bin = 0; bin < binCount; bin++) {
      acc.fill(0);
      for (let i = start[bin]; i < start[bin + 1]; i++) {
        const k1 = K1[i];
        const k2 = K2[i];
        const k3 = K3[i];
        const ik1 = 1 / (k1 * k1);
        const ik2 = 1 / (k2 * k2);
        const ik3 = 1 / (k3 * k3);
        const a2 = k2 * C12[i];
        const bs2 = k2 * S12[i];
        const o9 = 9 * i;
        // Orientation-independent parts of Z2 per pair: b1 F2 + b2/2 + bG2 sigma^2, and f G2.
        const c12 = b1 * pk[o9] + hb2 + bG2 * pk[o9 + 2];
        const c23 = b1 * pk[o9 + 3] + hb2 + bG2 * pk[o9 + 5];
        const c31 = b1 * pk[o9 + 6] + hb2 + bG2 * pk[o9 + 8];
        const g12 = f * pk[o9 + 1];
        const g23 = f * pk[o9 + 4];
        const g31 = f * pk[o9 + 7];
        const nw1 = NW[ix[3 * i]];
        const nw2 = NW[ix[3 * i + 1]];
        const nw3 = NW[ix[3 * i + 2]];
        const w1 = WG[ix[3 * i]];
        const w2 = WG[ix[3 * i + 1]];
        const w3 = WG[ix[3 * i + 2]];
        const wn = weight[i];
        for (let j = 0; j < muCount; j++) {
          const m1 = MU[j];
          const u1 = k1 * m1;
          const uu1 = u1 * u1;
          const q1 = m1 * m1;
          const z1 = b1 + f * q1;
          const zP1 = z1 * (nw1 + w1 * expNegative(uu1 * (aIR + cIR * q1)));
          // Per mu node: (f/2) mu1/k1, (f/2) Z1(k1), (f/2) u1 and the mu1-only part of Z2(k2, k3).
          const hv1 = hf * u1 * ik1;
          const hz1 = hf * z1;
          const hu1 = hf * u1;
          const cg23 = c23 + g23 * q1;
          const A2 = a2 * m1;
          let det = 0;
          let lin = 0;
          for (let o = j * phiCount, end = o + phiCount; o < end; o++) {
            // LOS components u_i = k_i mu_i of the three sides; u1 + u2 + u3 = 0.
            const u2 = A2 - bs2 * SC[o];
            const u3 = -u1 - u2;
            const v2 = u2 * ik2;
            const v3 = u3 * ik3;
            const uu2 = u2 * u2;
            const uu3 = u3 * u3;
            const q2 = u2 * v2;
            const q3 = u3 * v3;
            const z2 = b1 + f * q2;
            const z3 = b1 + f * q3;
            const zP2 = z2 * (nw2 + w2 * expNegative(uu2 * (aIR + cIR * q2)));
            const zP3 = z3 * (nw3 + w3 * expNegative(uu3 * (aIR + cIR * q3)));
            // Z2 of each pair (Scoccimarro, Couchman & Frieman 1999, eq. 13): the pair (a, b) sums to -k_c,
            // so mu k = u_a + u_b = -u_c and the velocity term is -(f/2) u_c (mu_a/k_a Z1_b + mu_b/k_b Z1_a).
            const zz12 = c12 + g12 * q3 - u3 * (hv1 * z2 + v2 * hz1);
            const zz23 = cg23 - hu1 * (v2 * z3 + v3 * z2);
            const zz31 = c31 + g31 * q2 - u2 * (v3 * hz1 + hv1 * z3);
            const d = zP2 * (zP1 * zz12 + zP3 * zz23) + zP3 * zP1 * zz31;
            det += fog ? d * expNegative(halfSv2 * (uu1 + uu2 + uu3)) : d;
            lin += zP2 + zP3;
          }
          const sum = 2 * det + stochP * (phiCount * zP1 + lin) + stochConst;
          for (let m = 0; m < nm; m++) acc[m] += wn * WMU[j * nm + m] * sum;
        }
      }
      for (let m = 0; m < nm; m++) out[m * binCount + bin] = acc[m];
    }
    return out;
  }

  /** The AP templates from the compiled loop, or null where it does not apply (spectrum not tabulated, exp range). */
  private compiledDistortedTemplates(s: ResolvedTreeSettings): Float64Array | null {
    const kernel = this.compiledKernel();
    if (!kernel || !(s.spectrum instanceof TabulatedSpectrum)) return null;
    const { aIR, cIR } = this.dampingCoefficients(s);
    const inputs = {
      splines: s.spectrum.packedSplines(),
      aIR,
      cIR,
      sigma2: s.irResummation ? s.spectrum.sigma2BAO : 0,
      halfSv2: 0.5 * s.velocityDispersion * s.velocityDispersion,
      inverseDensity: s.inverseDensity,
      alphaPar: s.alphaPar,
      dilation: dilation(s),
    };
    return kernel.acceptsDistorted(inputs) ? kernel.distortedTemplates(inputs) : null;
  }

  private compiledKernel(): CompiledMultipoleKernel | null {
    if (!this.useCompiled) return null;
    if (this.compiled === undefined) {
      this.compiled = CompiledMultipoleKernel.create(this.geometry, this.pairKernels, this.sidePowers.index, this.sidePowers.distinctLengths, this.kHi) ?? null;
    }
    return this.compiled;
  }

  /** Coefficients of the mu-dependent BAO damping exp(-u^2 [a + c mu^2]), u = k mu; zero without IR resummation. */
  private dampingCoefficients(s: ResolvedTreeSettings): { aIR: number; cIR: number } {
    if (!s.irResummation) return { aIR: 0, cIR: 0 };
    const fd = s.fForBaoDamping;
    const dsig2 = s.spectrum.deltaSigma2BAO;
    return { aIR: fd * (2 + fd) * s.spectrum.sigma2BAO - fd * fd * dsig2, cIR: fd * fd * dsig2 };
  }
}
