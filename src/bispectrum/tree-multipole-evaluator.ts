import { kernelF2, kernelG2, kernelGalileonTidal } from '../perturbation/kernels.js';
import { averageOverTriangleNodes } from './orientation-average.js';
import { multipoleWeights, type OrientationRule } from './orientation-rule.js';
import { TabulatedSpectrum } from './tabulated-spectrum.js';
import type { TriangleNodeSet } from './triangle-node-set.js';
import { TreeDirectIntegrand } from './tree-direct-integrand.js';
import type { TreeBispectrumParameters } from './tree-template-terms.js';
import { addPairTemplates, TreeTemplateIntegrand } from './tree-template-integrand.js';
import { TREE_TEMPLATE_SIZE } from './tree-template-terms.js';
import { checkWavenumbersInTable, resolveTreeSettings, type ResolvedTreeSettings, type TreeBispectrumSettings } from './tree-settings.js';

/**
 * Full evaluation of B_l — or of the averaged templates — on a fixed geometry
 * (bin nodes, orientation rule, multipoles) for a new linear spectrum: the
 * averages of TreeDirectIntegrand and TreeTemplateIntegrand made fast. Geometry that does not depend on cosmology (cosines between the sides,
 * F2, G2 and sigma^2 of each pair at each node, Legendre weights) is built once
 * in the constructor. Per evaluation the spectrum is re-tabulated
 * (TabulatedSpectrum) and, without AP distortion, P_nw and the damped-at-mu=0
 * wiggle of each side are looked up once per node; the orientation loop only
 * adds the mu-dependent part of the BAO damping,
 *   exp(-k^2 Sigma_tot^2(mu)) = exp(-k^2 Sigma^2) exp(-k^2 mu^2 [a + c mu^2]),
 *   a = f (2 + f) Sigma^2 - f^2 delta Sigma^2, c = f^2 delta Sigma^2
 * (ir-resummed-power.ts), the kernels' mu terms and the fingers-of-god factor.
 * With AP distortion the wavenumbers change with orientation and it falls back
 * to the generic average of TreeDirectIntegrand on the tabulated spectrum.
 * Output layouts: B_l [multipole][bin] as combineTreeTemplates; templates
 * [bin][multipole][value] as the averagers.
 */
export class TreeMultipoleEvaluator {
  readonly nodes: TriangleNodeSet;
  readonly multipoles: readonly number[];
  readonly rule: OrientationRule;
  private readonly weights: Float64Array;
  /** Per node: cos and sin of the angle between sides 1 and 2. */
  private readonly cos12: Float64Array;
  private readonly sin12: Float64Array;
  /** Per node, pairs (12, 23, 31): F2, G2, sigma^2 — 9 values. */
  private readonly pairKernels: Float64Array;
  private readonly kLo: number;
  private readonly kHi: number;

  constructor(nodes: TriangleNodeSet, multipoles: readonly number[], rule: OrientationRule) {
    this.nodes = nodes;
    this.multipoles = multipoles;
    this.rule = rule;
    this.weights = multipoleWeights(rule, multipoles);
    const n = nodes.k1.length;
    this.cos12 = new Float64Array(n);
    this.sin12 = new Float64Array(n);
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
          this.cos12[i] = cab;
          this.sin12[i] = Math.sqrt(1 - cab * cab);
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
  }

  /** B_l, layout [multipole][bin]; `tabulate` false uses the spectrum as given. */
  evaluate(settings: TreeBispectrumSettings | ResolvedTreeSettings, params: TreeBispectrumParameters, tabulate = true): Float64Array {
    const s = this.prepare(settings, tabulate);
    const nb = this.nodes.binCount;
    const nm = this.multipoles.length;
    if (s.alphaPar !== 1 || s.alphaPerp !== 1) {
      const avg = averageOverTriangleNodes(this.nodes, new TreeDirectIntegrand(s, params), this.multipoles, this.rule);
      const out = new Float64Array(nb * nm);
      for (let b = 0; b < nb; b++) for (let m = 0; m < nm; m++) out[m * nb + b] = avg[b * nm + m];
      return out;
    }
    return this.undistorted(s, params);
  }

  /** Averaged templates [bin][multipole][value] (tree-template-terms.ts), as averaging TreeTemplateIntegrand. */
  templates(settings: TreeBispectrumSettings | ResolvedTreeSettings, tabulate = true): Float64Array {
    const s = this.prepare(settings, tabulate);
    if (s.alphaPar !== 1 || s.alphaPerp !== 1) return averageOverTriangleNodes(this.nodes, new TreeTemplateIntegrand(s), this.multipoles, this.rule);
    return this.undistortedTemplates(s);
  }

  private prepare(settings: TreeBispectrumSettings | ResolvedTreeSettings, tabulate: boolean): ResolvedTreeSettings {
    const s0 = 'inverseDensity' in settings ? settings : resolveTreeSettings(settings);
    checkWavenumbersInTable(s0, this.kLo, this.kHi, 'bispectrum evaluation');
    if (!tabulate) return s0;
    const aMin = Math.min(s0.alphaPar, s0.alphaPerp);
    const aMax = Math.max(s0.alphaPar, s0.alphaPerp);
    return { ...s0, spectrum: new TabulatedSpectrum(s0.spectrum, this.kLo / aMax, this.kHi / aMin) };
  }

  /** Per node: P_nw and the wiggle damped by exp(-k^2 Sigma^2) of the three sides, into sides[0..5]. */
  private sidePowers(s: ResolvedTreeSettings, i: number, sides: Float64Array): void {
    sidePower(s, this.nodes.k1[i], 0, sides);
    sidePower(s, this.nodes.k2[i], 1, sides);
    sidePower(s, this.nodes.k3[i], 2, sides);
  }

  private undistortedTemplates(s: ResolvedTreeSettings): Float64Array {
    const { k1: K1, k2: K2, k3: K3, weight, start, binCount } = this.nodes;
    const nm = this.multipoles.length;
    const T = TREE_TEMPLATE_SIZE;
    const out = new Float64Array(binCount * nm * T);
    const { mu1: M1, sinMu1, cosPhi } = this.rule;
    const nOrient = M1.length;
    const wl = this.weights;
    const fd = s.fForBaoDamping;
    const ir = s.irResummation;
    const aIR = fd * (2 + fd) * s.spectrum.sigma2BAO - fd * fd * s.spectrum.deltaSigma2BAO;
    const cIR = fd * fd * s.spectrum.deltaSigma2BAO;
    const halfSv2 = 0.5 * s.velocityDispersion * s.velocityDispersion;
    const n1 = s.inverseDensity;
    const sides = new Float64Array(6);
    const v = new Float64Array(T);
    const acc = new Float64Array(nm * T);
    const pk = this.pairKernels;
    for (let bin = 0; bin < binCount; bin++) {
      const base = bin * nm * T;
      acc.fill(0);
      for (let i = start[bin]; i < start[bin + 1]; i++) {
        const k1 = K1[i];
        const k2 = K2[i];
        const k3 = K3[i];
        const c12 = this.cos12[i];
        const s12 = this.sin12[i];
        const o9 = 9 * i;
        this.sidePowers(s, i, sides);
        const wn = weight[i];
        const i1 = 1 / k1;
        const i2 = 1 / k2;
        const i3 = 1 / k3;
        for (let o = 0; o < nOrient; o++) {
          const m1 = M1[o];
          const m2 = m1 * c12 - sinMu1[o] * s12 * cosPhi[o];
          const m3 = -(k1 * m1 + k2 * m2) * i3;
          const q1 = m1 * m1;
          const q2 = m2 * m2;
          const q3 = m3 * m3;
          const P1 = ir ? sides[0] + sides[3] * Math.exp(-k1 * k1 * q1 * (aIR + cIR * q1)) : sides[0] + sides[3];
          const P2 = ir ? sides[1] + sides[4] * Math.exp(-k2 * k2 * q2 * (aIR + cIR * q2)) : sides[1] + sides[4];
          const P3 = ir ? sides[2] + sides[5] * Math.exp(-k3 * k3 * q3 * (aIR + cIR * q3)) : sides[2] + sides[5];
          const damp = halfSv2 > 0 ? Math.exp(-halfSv2 * (k1 * k1 * q1 + k2 * k2 * q2 + k3 * k3 * q3)) : 1;
          for (let t = 0; t < 14; t++) v[t] = 0;
          addPairTemplates(v, 0, 2 * damp * P1 * P2, -m3 * k3, i1, i2, m1, m2, m3, pk[o9], pk[o9 + 1], pk[o9 + 2]);
          addPairTemplates(v, 0, 2 * damp * P2 * P3, -m1 * k1, i2, i3, m2, m3, m1, pk[o9 + 3], pk[o9 + 4], pk[o9 + 5]);
          addPairTemplates(v, 0, 2 * damp * P3 * P1, -m2 * k2, i3, i1, m3, m1, m2, pk[o9 + 6], pk[o9 + 7], pk[o9 + 8]);
          v[14] = n1 * (P1 + P2 + P3);
          v[15] = n1 * (q1 * P1 + q2 * P2 + q3 * P3);
          v[16] = n1 * n1;
          for (let m = 0; m < nm; m++) {
            const w = wn * wl[o * nm + m];
            const row = m * T;
            for (let t = 0; t < T; t++) acc[row + t] += w * v[t];
          }
        }
      }
      for (let r = 0; r < nm * T; r++) out[base + r] = acc[r];
    }
    return out;
  }

  private undistorted(s: ResolvedTreeSettings, p: TreeBispectrumParameters): Float64Array {
    const ir = s.irResummation;
    const fd = s.fForBaoDamping;
    const sigmaV = s.velocityDispersion;
    const n1 = s.inverseDensity;
    const sides = new Float64Array(6);
    const { k1: K1, k2: K2, k3: K3, weight, start, binCount } = this.nodes;
    const nm = this.multipoles.length;
    const out = new Float64Array(binCount * nm);
    const { mu1: M1, sinMu1, cosPhi } = this.rule;
    const nOrient = M1.length;
    const nPhi = this.rule.phiCount;
    const wl = this.weights;
    const { b1, b2, bG2, f } = p;
    const sig2 = s.spectrum.sigma2BAO;
    const dsig2 = s.spectrum.deltaSigma2BAO;
    const aIR = fd * (2 + fd) * sig2 - fd * fd * dsig2;
    const cIR = fd * fd * dsig2;
    const halfSv2 = 0.5 * sigmaV * sigmaV;
    const stochConst = p.bispShotConst * n1 * n1;
    const stochP = p.bispShotPower * n1 * b1;
    const acc = new Float64Array(nm);
    for (let bin = 0; bin < binCount; bin++) {
      acc.fill(0);
      for (let i = start[bin]; i < start[bin + 1]; i++) {
        const k1 = K1[i];
        const k2 = K2[i];
        const k3 = K3[i];
        const c12 = this.cos12[i];
        const s12 = this.sin12[i];
        const pk = this.pairKernels;
        const o9 = 9 * i;
        this.sidePowers(s, i, sides);
        const n1k = sides[0];
        const n2k = sides[1];
        const n3k = sides[2];
        const w1k = sides[3];
        const w2k = sides[4];
        const w3k = sides[5];
        const wn = weight[i];
        const i1 = 1 / k1;
        const i2 = 1 / k2;
        const i3 = 1 / k3;
        // Orientation points are mu-major: side 1's damping factors change only with the mu node.
        let P1 = 0;
        let d1 = 0;
        let nextMu = 0;
        for (let o = 0; o < nOrient; o++) {
          const m1 = M1[o];
          const q1 = m1 * m1;
          if (o === nextMu) {
            P1 = ir ? n1k + w1k * Math.exp(-k1 * k1 * q1 * (aIR + cIR * q1)) : n1k + w1k;
            d1 = -halfSv2 * k1 * k1 * q1;
            nextMu += nPhi;
          }
          const m2 = m1 * c12 - sinMu1[o] * s12 * cosPhi[o];
          const m3 = -(k1 * m1 + k2 * m2) * i3;
          const q2 = m2 * m2;
          const q3 = m3 * m3;
          const P2 = ir ? n2k + w2k * Math.exp(-k2 * k2 * q2 * (aIR + cIR * q2)) : n2k + w2k;
          const P3 = ir ? n3k + w3k * Math.exp(-k3 * k3 * q3 * (aIR + cIR * q3)) : n3k + w3k;
          const z1 = b1 + f * q1;
          const z2 = b1 + f * q2;
          const z3 = b1 + f * q3;
          // Z2 of each pair (Scoccimarro, Couchman & Frieman 1999, eq. 13); the sum vector of pair (a, b) is -k_c.
          const zz12 = pairZ2(b1, b2, bG2, f, pk[o9], pk[o9 + 1], pk[o9 + 2], k1, k2, i1, i2, m1, m2, q1, q2, q3);
          const zz23 = pairZ2(b1, b2, bG2, f, pk[o9 + 3], pk[o9 + 4], pk[o9 + 5], k2, k3, i2, i3, m2, m3, q2, q3, q1);
          const zz31 = pairZ2(b1, b2, bG2, f, pk[o9 + 6], pk[o9 + 7], pk[o9 + 8], k3, k1, i3, i1, m3, m1, q3, q1, q2);
          let b = 2 * (z1 * z2 * zz12 * P1 * P2 + z2 * z3 * zz23 * P2 * P3 + z3 * z1 * zz31 * P3 * P1);
          if (sigmaV > 0) b *= Math.exp(d1 - halfSv2 * (k2 * k2 * q2 + k3 * k3 * q3));
          b += stochP * (z1 * P1 + z2 * P2 + z3 * P3) + stochConst;
          for (let m = 0; m < nm; m++) acc[m] += wn * wl[o * nm + m] * b;
        }
      }
      for (let m = 0; m < nm; m++) out[m * binCount + bin] = acc[m];
    }
    return out;
  }
}

/** Z2(k_a, k_b) from precomputed F2, G2, sigma^2, 1/k_a, 1/k_b and the cosines (mu^2 of the sum vector = mu_c^2). */
function pairZ2(
  b1: number,
  b2: number,
  bG2: number,
  f: number,
  F: number,
  G: number,
  S: number,
  ka: number,
  kb: number,
  invKa: number,
  invKb: number,
  ma: number,
  mb: number,
  qa: number,
  qb: number,
  qc: number,
): number {
  const muK = ma * ka + mb * kb;
  return b1 * F + f * qc * G + 0.5 * f * muK * (ma * invKa * (b1 + f * qb) + mb * invKb * (b1 + f * qa)) + 0.5 * b2 + bG2 * S;
}

/** P_nw(k) into sides[j] and P_w(k), damped by exp(-k^2 Sigma^2) when IR-resummed, into sides[3 + j]. */
function sidePower(s: ResolvedTreeSettings, k: number, j: number, sides: Float64Array): void {
  const nw = s.spectrum.powerNoWiggle(k);
  const w = s.spectrum.power(k) - nw;
  sides[j] = nw;
  sides[3 + j] = s.irResummation ? w * Math.exp(-k * k * s.spectrum.sigma2BAO) : w;
}
