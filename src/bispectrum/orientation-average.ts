import type { OrientationRule } from './orientation-rule.js';
import { multipoleWeights } from './orientation-rule.js';
import type { TriangleIntegrand } from './triangle-integrand.js';
import type { TriangleNodeSet } from './triangle-node-set.js';

/**
 * Average an integrand over bins given as weighted closing triangles and over
 * orientations: out[(bin * nMultipoles + m) * size + t] =
 *   sum_nodes w_node (2 l_m + 1) < X_t L_{l_m}(mu1) >_orientations.
 * For each node the angle between sides 1 and 2 follows from the three lengths;
 * mu3 from closure, mu1 k1 + mu2 k2 + mu3 k3 = 0.
 */
export function averageOverTriangleNodes(
  nodes: TriangleNodeSet,
  integrand: TriangleIntegrand,
  multipoles: readonly number[],
  rule: OrientationRule,
): Float64Array {
  const nm = multipoles.length;
  const size = integrand.size;
  const wl = multipoleWeights(rule, multipoles);
  const out = new Float64Array(nodes.binCount * nm * size);
  const value = new Float64Array(size);
  const nOrient = rule.weight.length;
  for (let b = 0; b < nodes.binCount; b++) {
    const base = b * nm * size;
    for (let n = nodes.start[b]; n < nodes.start[b + 1]; n++) {
      const k1 = nodes.k1[n];
      const k2 = nodes.k2[n];
      const k3 = nodes.k3[n];
      const wn = nodes.weight[n];
      let c12 = (k3 * k3 - k1 * k1 - k2 * k2) / (2 * k1 * k2);
      if (c12 > 1) c12 = 1;
      else if (c12 < -1) c12 = -1;
      const s12 = Math.sqrt(1 - c12 * c12);
      for (let o = 0; o < nOrient; o++) {
        const mu1 = rule.mu1[o];
        const mu2 = mu1 * c12 - rule.sinMu1[o] * s12 * rule.cosPhi[o];
        const mu3 = -(k1 * mu1 + k2 * mu2) / k3;
        integrand.evaluate(k1, k2, k3, mu1, mu2, mu3, value, 0);
        for (let m = 0; m < nm; m++) {
          const w = wn * wl[o * nm + m];
          const row = base + m * size;
          for (let t = 0; t < size; t++) out[row + t] += w * value[t];
        }
      }
    }
  }
  return out;
}
