import { expNegative } from '../numerics/fast-exp.js';
import { SplineStencil } from '../numerics/spline-stencil.js';
import { TabulatedSpectrum } from './tabulated-spectrum.js';
import type { ResolvedTreeSettings } from './tree-settings.js';
import type { TriangleNodeSet } from './triangle-node-set.js';

/**
 * The linear power on the three sides of every node of a TriangleNodeSet, as
 * the orientation loops of TreeMultipoleEvaluator need it: P_nw(k) and the
 * wiggle P_w(k) = P - P_nw, the latter damped by exp(-k^2 Sigma^2) when
 * IR-resummed (the mu-independent factor of ir-resummed-power.ts). Layout
 * [3 node + side] in two buffers that are overwritten by the next call. On a
 * TabulatedSpectrum the lookups go through a SplineStencil kept for as long as
 * the table's grid stays the same (the grid depends only on the k range).
 */
export class NodeSidePowers {
  private readonly k: Float64Array;
  private readonly noWiggle: Float64Array;
  private readonly wiggle: Float64Array;
  private stencil: SplineStencil | undefined;

  constructor(nodes: TriangleNodeSet) {
    const n = nodes.k1.length;
    this.k = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) {
      this.k[3 * i] = nodes.k1[i];
      this.k[3 * i + 1] = nodes.k2[i];
      this.k[3 * i + 2] = nodes.k3[i];
    }
    this.noWiggle = new Float64Array(3 * n);
    this.wiggle = new Float64Array(3 * n);
  }

  fill(s: ResolvedTreeSettings): { noWiggle: Float64Array; wiggle: Float64Array } {
    const { k, noWiggle: nw, wiggle: w } = this;
    const sp = s.spectrum;
    if (sp instanceof TabulatedSpectrum) {
      if (!this.stencil?.fits(sp.noWiggle)) this.stencil = new SplineStencil(sp.noWiggle, k);
      this.stencil.apply(sp.noWiggle, nw);
      this.stencil.apply(sp.wiggle, w);
    } else {
      for (let p = 0; p < k.length; p++) {
        nw[p] = sp.powerNoWiggle(k[p]);
        w[p] = sp.power(k[p]) - nw[p];
      }
    }
    if (s.irResummation) {
      const sigma2 = sp.sigma2BAO;
      for (let p = 0; p < k.length; p++) w[p] *= expNegative(k[p] * k[p] * sigma2);
    }
    return { noWiggle: nw, wiggle: w };
  }
}
