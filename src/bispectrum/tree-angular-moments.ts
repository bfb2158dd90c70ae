import type { ResolvedTreeSettings } from './tree-settings.js';
import type { OrientationGeometry } from './tree-multipole-distorted.js';
import { addPairTemplates } from './tree-template-integrand.js';
import { TREE_TEMPLATE_SIZE } from './tree-template-terms.js';
import type { NodeSidePowers } from './node-side-powers.js';

const PAIR_TERMS = 14;

/**
 * When no P depends on its angle to the line of sight (no IR damping in the
 * orientation loop, or its angle average, no fingers-of-god damping, alpha = 1)
 * the tree-level integrand at a node is sum_pairs P_a P_b K_p(mu) plus
 * stochastic terms with P-independent angular factors. Their orientation
 * averages with the weight (2l+1) L_l(mu1) are then cosmology-independent
 * geometry, computed once per node with the evaluator's own rule (so the
 * result is the same sum as the orientation loop, reordered):
 *   pairs[((node * 3 + pair) * nl + l) * 14 + t]  template pieces 0–13 with P_a = P_b = 1,
 *   sides[(node * 3 + side) * nl + l]            <(2l+1) L_l mu_side^2>,
 *   constant[l]                                   <(2l+1) L_l>.
 * A new spectrum then costs three products and 3 x 14 multiply-adds per node
 * and multipole. Memory: 8 (42 + 3) bytes per node and multipole.
 */
export class TreeAngularMoments {
  readonly bytes: number;
  private readonly pairs: Float64Array;
  private readonly sides: Float64Array;
  private readonly constant: Float64Array;
  private readonly geometry: OrientationGeometry;

  constructor(geometry: OrientationGeometry, pairKernels: Float64Array) {
    this.geometry = geometry;
    const { nodes, multipoleCount: nl, muCount, phiCount, mu: MU, muWeights: WMU, lineOfSightSide2: SC, cos12: C12, sin12: S12 } = geometry;
    const n = nodes.k1.length;
    this.pairs = new Float64Array(n * 3 * nl * PAIR_TERMS);
    this.sides = new Float64Array(n * 3 * nl);
    this.constant = new Float64Array(nl);
    for (let j = 0; j < muCount; j++) for (let l = 0; l < nl; l++) this.constant[l] += phiCount * WMU[j * nl + l];
    const perMu = new Float64Array(3 * PAIR_TERMS);
    const q = new Float64Array(3);
    const pk = pairKernels;
    for (let i = 0; i < n; i++) {
      const k1 = nodes.k1[i];
      const k2 = nodes.k2[i];
      const k3 = nodes.k3[i];
      const i1 = 1 / k1;
      const i2 = 1 / k2;
      const i3 = 1 / k3;
      const o9 = 9 * i;
      for (let j = 0; j < muCount; j++) {
        const m1 = MU[j];
        const u1 = k1 * m1;
        perMu.fill(0);
        q.fill(0);
        for (let o = j * phiCount, end = o + phiCount; o < end; o++) {
          const u2 = k2 * (m1 * C12[i] - S12[i] * SC[o]);
          const u3 = -u1 - u2;
          const m2 = u2 * i2;
          const m3 = u3 * i3;
          addPairTemplates(perMu, 0, 2, -u3, i1, i2, m1, m2, m3, pk[o9], pk[o9 + 1], pk[o9 + 2]);
          addPairTemplates(perMu, PAIR_TERMS, 2, -u1, i2, i3, m2, m3, m1, pk[o9 + 3], pk[o9 + 4], pk[o9 + 5]);
          addPairTemplates(perMu, 2 * PAIR_TERMS, 2, -u2, i3, i1, m3, m1, m2, pk[o9 + 6], pk[o9 + 7], pk[o9 + 8]);
          q[0] += m1 * m1;
          q[1] += m2 * m2;
          q[2] += m3 * m3;
        }
        for (let l = 0; l < nl; l++) {
          const w = WMU[j * nl + l];
          for (let p = 0; p < 3; p++) {
            const row = ((i * 3 + p) * nl + l) * PAIR_TERMS;
            for (let t = 0; t < PAIR_TERMS; t++) this.pairs[row + t] += w * perMu[p * PAIR_TERMS + t];
            this.sides[(i * 3 + p) * nl + l] += w * q[p];
          }
        }
      }
    }
    this.bytes = 8 * (this.pairs.length + this.sides.length);
  }

  /** Averaged templates [bin][multipole][value] for the side powers of `powers` (filled for `s`). */
  templates(s: ResolvedTreeSettings, powers: NodeSidePowers): Float64Array {
    const { nodes, multipoleCount: nl } = this.geometry;
    const { weight, start, binCount } = nodes;
    const T = TREE_TEMPLATE_SIZE;
    const out = new Float64Array(binCount * nl * T);
    const { noWiggle: NW, wiggle: WG } = powers.fill(s);
    const ix = powers.index;
    const n1 = s.inverseDensity;
    const A = this.pairs;
    const S = this.sides;
    for (let bin = 0; bin < binCount; bin++) {
      const base = bin * nl * T;
      for (let i = start[bin]; i < start[bin + 1]; i++) {
        const P1 = NW[ix[3 * i]] + WG[ix[3 * i]];
        const P2 = NW[ix[3 * i + 1]] + WG[ix[3 * i + 1]];
        const P3 = NW[ix[3 * i + 2]] + WG[ix[3 * i + 2]];
        const wn = weight[i];
        const p12 = wn * P1 * P2;
        const p23 = wn * P2 * P3;
        const p31 = wn * P3 * P1;
        for (let l = 0; l < nl; l++) {
          const r = base + l * T;
          const a = ((i * 3) * nl + l) * PAIR_TERMS;
          const b = a + nl * PAIR_TERMS;
          const c = b + nl * PAIR_TERMS;
          for (let t = 0; t < PAIR_TERMS; t++) out[r + t] += p12 * A[a + t] + p23 * A[b + t] + p31 * A[c + t];
          const sd = i * 3 * nl + l;
          out[r + 14] += wn * n1 * (P1 + P2 + P3) * this.constant[l];
          out[r + 15] += wn * n1 * (S[sd] * P1 + S[sd + nl] * P2 + S[sd + 2 * nl] * P3);
          out[r + 16] += wn * n1 * n1 * this.constant[l];
        }
      }
    }
    return out;
  }
}
