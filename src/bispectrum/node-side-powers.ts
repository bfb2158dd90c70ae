import { expNegative } from '../numerics/fast-exp.js';
import { TabulatedSpectrum } from './tabulated-spectrum.js';
import type { ResolvedTreeSettings } from './tree-settings.js';
import type { TriangleNodeSet } from './triangle-node-set.js';

/**
 * The linear power on the three sides of every node of a TriangleNodeSet, as
 * the orientation loops of TreeMultipoleEvaluator need it: P_nw(k) and the
 * wiggle P_w(k) = P - P_nw, the latter damped by exp(-k^2 Sigma^2) when
 * IR-resummed (the mu-independent factor of ir-resummed-power.ts).
 * Side lengths repeat across nodes (bins sharing a shell share its
 * Gauss–Legendre nodes: 89 217 sides take 5 457 distinct values for the
 * 477-bin binning, 707 970 take 10 530 for the 6 613-bin one), so the power is
 * computed once per distinct length: `index[3 node + side]` points into the
 * returned arrays, which the next call overwrites.
 */
export class NodeSidePowers {
  readonly index: Int32Array;
  private readonly k: Float64Array;
  private readonly noWiggle: Float64Array;
  private readonly wiggle: Float64Array;

  constructor(nodes: TriangleNodeSet) {
    const n = nodes.k1.length;
    const slot = new Map<number, number>();
    const lengths: number[] = [];
    this.index = new Int32Array(3 * n);
    const sides = [nodes.k1, nodes.k2, nodes.k3];
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < 3; j++) {
        const k = sides[j][i];
        let s = slot.get(k);
        if (s === undefined) {
          s = lengths.length;
          slot.set(k, s);
          lengths.push(k);
        }
        this.index[3 * i + j] = s;
      }
    }
    this.k = Float64Array.from(lengths);
    this.noWiggle = new Float64Array(lengths.length);
    this.wiggle = new Float64Array(lengths.length);
  }

  /** Number of distinct side lengths. */
  get distinctLengths(): number {
    return this.k.length;
  }

  fill(s: ResolvedTreeSettings): { noWiggle: Float64Array; wiggle: Float64Array } {
    const { k, noWiggle: nw, wiggle: w } = this;
    const sp = s.spectrum;
    const tab = sp instanceof TabulatedSpectrum ? sp : undefined;
    for (let p = 0; p < k.length; p++) {
      nw[p] = sp.powerNoWiggle(k[p]);
      w[p] = tab ? tab.powerWiggle(k[p]) : sp.power(k[p]) - nw[p];
    }
    if (s.irResummation) {
      const sigma2 = sp.sigma2BAO;
      for (let p = 0; p < k.length; p++) w[p] *= expNegative(k[p] * k[p] * sigma2);
    }
    return { noWiggle: nw, wiggle: w };
  }
}
