import { expNegative } from '../numerics/fast-exp.js';
import { kernelF2FromRatios, kernelG2FromRatios, kernelGalileonTidal } from '../perturbation/kernels.js';
import { TabulatedSpectrum } from './tabulated-spectrum.js';
import type { TreeBispectrumParameters } from './tree-template-terms.js';
import { addPairTemplates } from './tree-template-integrand.js';
import { TREE_TEMPLATE_SIZE } from './tree-template-terms.js';
import type { ResolvedTreeSettings } from './tree-settings.js';
import type { TriangleNodeSet } from './triangle-node-set.js';
import { directLoopConstants } from './tree-loop-constants.js';

/**
 * The orientation loops of TreeMultipoleEvaluator with Alcock–Paczynski
 * distortion: the same integrands as TreeDirectIntegrand and
 * TreeTemplateIntegrand (triangle-physics.ts), written for the product rule.
 * An observed side (k, mu) has the true length q = k sqrt(mu^2/apar^2 +
 * (1 - mu^2)/aperp^2) and true line-of-sight component t = q nu = k mu / apar,
 * so with u = k mu the three true t_i still sum to zero and
 *   q^2 Sigma_tot^2(nu) = q^2 Sigma^2 + t^2 (a + c nu^2),  nu^2 = t^2 / q^2,
 * the cosines between true sides follow from the true lengths, and side 1's
 * true quantities change only with the mu node. `distortedTemplates` has a
 * compiled twin (wasm/tree-template-loop.ts) that runs by default; change both
 * together (DEVELOPERS.md).
 */
export interface OrientationGeometry {
  readonly nodes: TriangleNodeSet;
  readonly multipoleCount: number;
  readonly muCount: number;
  readonly phiCount: number;
  /** Per mu node: mu1; weight (2l+1) L_l(mu1) of one phi point [mu node][multipole]. */
  readonly mu: Float64Array;
  readonly muWeights: Float64Array;
  /** Per orientation point: sqrt(1 - mu1^2) cos(phi). */
  readonly lineOfSightSide2: Float64Array;
  /** Per node: cos and sin of the observed angle between sides 1 and 2. */
  readonly cos12: Float64Array;
  readonly sin12: Float64Array;
}

/** Power on one true side, P_nw(q) + P_w(q) exp(-q^2 Sigma_tot^2(nu)), from q^2, t^2 = (q nu)^2 and nu^2. */
interface SidePower {
  (q2: number, t2: number, nu2: number): number;
}

function sidePowerOf(s: ResolvedTreeSettings): SidePower {
  const sp = s.spectrum;
  const tab = sp instanceof TabulatedSpectrum ? sp : undefined;
  if (!s.irResummation) return tab ? (q2) => tab.dampedPower(Math.sqrt(q2), 1) : (q2) => sp.power(Math.sqrt(q2));
  const fd = s.fForBaoDamping;
  const sig2 = sp.sigma2BAO;
  const a = fd * (2 + fd) * sig2 - fd * fd * sp.deltaSigma2BAO;
  const c = fd * fd * sp.deltaSigma2BAO;
  if (tab) return (q2, t2, nu2) => tab.dampedPower(Math.sqrt(q2), expNegative(q2 * sig2 + t2 * (a + c * nu2)));
  return (q2, t2, nu2) => {
    const q = Math.sqrt(q2);
    const nw = sp.powerNoWiggle(q);
    return nw + (sp.power(q) - nw) * expNegative(q2 * sig2 + t2 * (a + c * nu2));
  };
}

/** 1/apar^2, 1/aperp^2 and the amplitude 1/(apar aperp^2)^2. */
export function dilation(s: ResolvedTreeSettings): { ip2: number; iq2: number; amp: number } {
  const vol = s.alphaPar * s.alphaPerp * s.alphaPerp;
  return { ip2: 1 / (s.alphaPar * s.alphaPar), iq2: 1 / (s.alphaPerp * s.alphaPerp), amp: 1 / (vol * vol) };
}

/** q^2 = k^2 [mu^2/apar^2 + (1 - mu^2)/aperp^2] from k and u = k mu. */
function trueLengthSquared(k: number, u: number, ip2: number, iq2: number): number {
  return u * u * ip2 + (k * k - u * u) * iq2;
}

/** B_l [multipole][bin] with AP distortion. */
export function distortedMultipoles(g: OrientationGeometry, s: ResolvedTreeSettings, p: TreeBispectrumParameters): Float64Array {
  const { k1: K1, k2: K2, k3: K3, weight, start, binCount } = g.nodes;
  const { multipoleCount: nm, muCount, phiCount, mu: MU, muWeights: WMU, lineOfSightSide2: SC } = g;
  const out = new Float64Array(binCount * nm);
  const power = sidePowerOf(s);
  const { ip2, iq2, amp } = dilation(s);
  const { fog, halfSv2, b1, bG2, f, hb2, hf, stochConst, stochP } = directLoopConstants(s, p, phiCount);
  const acc = new Float64Array(nm);
  for (let bin = 0; bin < binCount; bin++) {
    acc.fill(0);
    for (let i = start[bin]; i < start[bin + 1]; i++) {
      const k1 = K1[i];
      const k2 = K2[i];
      const k3 = K3[i];
      const a2 = k2 * g.cos12[i];
      const bs2 = k2 * g.sin12[i];
      const wn = weight[i];
      for (let j = 0; j < muCount; j++) {
        const u1 = k1 * MU[j];
        const t1 = u1 / s.alphaPar;
        const tt1 = t1 * t1;
        const Q1 = trueLengthSquared(k1, u1, ip2, iq2);
        const q1 = Math.sqrt(Q1);
        const r1 = 1 / q1;
        const v1 = t1 * r1 * r1;
        const nn1 = t1 * v1;
        const z1 = b1 + f * nn1;
        const zP1 = z1 * power(Q1, tt1, nn1);
        const A2 = a2 * MU[j];
        let sum = stochConst;
        for (let o = j * phiCount, end = o + phiCount; o < end; o++) {
          const u2 = A2 - bs2 * SC[o];
          const u3 = -u1 - u2;
          const t2 = u2 / s.alphaPar;
          const t3 = -t1 - t2;
          const tt2 = t2 * t2;
          const tt3 = t3 * t3;
          const Q2 = trueLengthSquared(k2, u2, ip2, iq2);
          const Q3 = trueLengthSquared(k3, u3, ip2, iq2);
          const q2 = Math.sqrt(Q2);
          const q3 = Math.sqrt(Q3);
          const r2 = 1 / q2;
          const r3 = 1 / q3;
          const v2 = t2 * r2 * r2;
          const v3 = t3 * r3 * r3;
          const nn2 = t2 * v2;
          const nn3 = t3 * v3;
          const z2 = b1 + f * nn2;
          const z3 = b1 + f * nn3;
          const zP2 = z2 * power(Q2, tt2, nn2);
          const zP3 = z3 * power(Q3, tt3, nn3);
          // True cosines between the sides of each pair (closed triangle) and ka/kb + kb/ka;
          // Z2 as kernels.ts with mu k = -t_c.
          const i12 = r1 * r2;
          const i23 = r2 * r3;
          const i31 = r3 * r1;
          const c12 = 0.5 * (Q3 - Q1 - Q2) * i12;
          const c23 = 0.5 * (Q1 - Q2 - Q3) * i23;
          const c31 = 0.5 * (Q2 - Q3 - Q1) * i31;
          const r12 = (Q1 + Q2) * i12;
          const r23 = (Q2 + Q3) * i23;
          const r31 = (Q3 + Q1) * i31;
          const zz12 = b1 * kernelF2FromRatios(c12, r12) + f * nn3 * kernelG2FromRatios(c12, r12) - hf * t3 * (v1 * z2 + v2 * z1) + hb2 + bG2 * kernelGalileonTidal(c12);
          const zz23 = b1 * kernelF2FromRatios(c23, r23) + f * nn1 * kernelG2FromRatios(c23, r23) - hf * t1 * (v2 * z3 + v3 * z2) + hb2 + bG2 * kernelGalileonTidal(c23);
          const zz31 = b1 * kernelF2FromRatios(c31, r31) + f * nn2 * kernelG2FromRatios(c31, r31) - hf * t2 * (v3 * z1 + v1 * z3) + hb2 + bG2 * kernelGalileonTidal(c31);
          let b = 2 * (zP1 * zP2 * zz12 + zP2 * zP3 * zz23 + zP3 * zP1 * zz31);
          if (fog) b *= expNegative(halfSv2 * (tt1 + tt2 + tt3));
          sum += b + stochP * (zP1 + zP2 + zP3);
        }
        for (let m = 0; m < nm; m++) acc[m] += wn * WMU[j * nm + m] * sum;
      }
    }
    for (let m = 0; m < nm; m++) out[m * binCount + bin] = amp * acc[m];
  }
  return out;
}

/** Averaged templates [bin][multipole][value] with AP distortion. */
export function distortedTemplates(g: OrientationGeometry, s: ResolvedTreeSettings): Float64Array {
  const { k1: K1, k2: K2, k3: K3, weight, start, binCount } = g.nodes;
  const { multipoleCount: nm, muCount, phiCount, mu: MU, muWeights: WMU, lineOfSightSide2: SC } = g;
  const T = TREE_TEMPLATE_SIZE;
  const out = new Float64Array(binCount * nm * T);
  const power = sidePowerOf(s);
  const { ip2, iq2, amp } = dilation(s);
  const halfSv2 = 0.5 * s.velocityDispersion * s.velocityDispersion;
  const n1 = s.inverseDensity;
  const perMu = new Float64Array(T);
  const acc = new Float64Array(nm * T);
  for (let bin = 0; bin < binCount; bin++) {
    acc.fill(0);
    for (let i = start[bin]; i < start[bin + 1]; i++) {
      const k1 = K1[i];
      const k2 = K2[i];
      const k3 = K3[i];
      const a2 = k2 * g.cos12[i];
      const bs2 = k2 * g.sin12[i];
      const wn = weight[i];
      for (let j = 0; j < muCount; j++) {
        const u1 = k1 * MU[j];
        const t1 = u1 / s.alphaPar;
        const Q1 = trueLengthSquared(k1, u1, ip2, iq2);
        const q1 = Math.sqrt(Q1);
        const r1 = 1 / q1;
        const nu1 = t1 * r1;
        const P1 = power(Q1, t1 * t1, nu1 * nu1);
        const A2 = a2 * MU[j];
        perMu.fill(0);
        for (let o = j * phiCount, end = o + phiCount; o < end; o++) {
          const u2 = A2 - bs2 * SC[o];
          const u3 = -u1 - u2;
          const t2 = u2 / s.alphaPar;
          const t3 = -t1 - t2;
          const Q2 = trueLengthSquared(k2, u2, ip2, iq2);
          const Q3 = trueLengthSquared(k3, u3, ip2, iq2);
          const q2 = Math.sqrt(Q2);
          const q3 = Math.sqrt(Q3);
          const r2 = 1 / q2;
          const r3 = 1 / q3;
          const nu2 = t2 * r2;
          const nu3 = t3 * r3;
          const P2 = power(Q2, t2 * t2, nu2 * nu2);
          const P3 = power(Q3, t3 * t3, nu3 * nu3);
          const damp = halfSv2 > 0 ? expNegative(halfSv2 * (t1 * t1 + t2 * t2 + t3 * t3)) : 1;
          const i12 = r1 * r2;
          const i23 = r2 * r3;
          const i31 = r3 * r1;
          const c12 = 0.5 * (Q3 - Q1 - Q2) * i12;
          const c23 = 0.5 * (Q1 - Q2 - Q3) * i23;
          const c31 = 0.5 * (Q2 - Q3 - Q1) * i31;
          const r12 = (Q1 + Q2) * i12;
          const r23 = (Q2 + Q3) * i23;
          const r31 = (Q3 + Q1) * i31;
          addPairTemplates(perMu, 0, 2 * damp * P1 * P2, -t3, r1, r2, nu1, nu2, nu3, kernelF2FromRatios(c12, r12), kernelG2FromRatios(c12, r12), kernelGalileonTidal(c12));
          addPairTemplates(perMu, 0, 2 * damp * P2 * P3, -t1, r2, r3, nu2, nu3, nu1, kernelF2FromRatios(c23, r23), kernelG2FromRatios(c23, r23), kernelGalileonTidal(c23));
          addPairTemplates(perMu, 0, 2 * damp * P3 * P1, -t2, r3, r1, nu3, nu1, nu2, kernelF2FromRatios(c31, r31), kernelG2FromRatios(c31, r31), kernelGalileonTidal(c31));
          perMu[14] += n1 * (P1 + P2 + P3);
          perMu[15] += n1 * (nu1 * nu1 * P1 + nu2 * nu2 * P2 + nu3 * nu3 * P3);
          perMu[16] += n1 * n1;
        }
        for (let m = 0; m < nm; m++) {
          const w = amp * wn * WMU[j * nm + m];
          const row = m * T;
          for (let t = 0; t < T; t++) acc[row + t] += w * perMu[t];
        }
      }
    }
    out.set(acc, bin * nm * T);
  }
  return out;
}
