import { InputError } from '../contracts/input-error.js';
import { gaussLegendre } from '../numerics/gauss-legendre.js';
import type { TriangleBins } from './triangle-bins.js';
import type { TriangleNodeSet } from './triangle-node-set.js';

/**
 * Quadrature for the continuous average over a triangle bin's volume,
 *   <X> = int_V k1 k2 k3 X dk1 dk2 dk3 / int_V k1 k2 k3 dk1 dk2 dk3,
 * V = shell1 x shell2 x shell3 cut to the triangles that close
 * (|k1 - k2| <= k3 <= k1 + k2). V is a convex polytope; the integral is done
 * iterated (k1 outer, k3 inner) with the outer ranges split wherever the
 * polytope's faces change, so every piece carries a smooth integrand and
 * Gauss–Legendre converges exponentially in the number of nodes:
 *   k1 at a + b and |a - b|, a in shell-2 edges, b in shell-3 edges;
 *   k2 at k1 + b, |k1 - b| (and k1 when shell 3 starts at 0);
 *   k3 between max(lo3, |k1 - k2|) and min(hi3, k1 + k2).
 * A piece of relative width r = width / c3 (the triangle's shape varies on the
 * scale of its smallest side) gets order + 1 nodes when r >= 0.75, `order`
 * when 0.25 <= r < 0.75 and order - 1 below (at least 3, or `order` when
 * smaller): pieces narrow compared with the smallest side need fewer nodes for
 * the same accuracy, the widest (lowest shells) more.
 */
function piecePoints(order: number, width: number, scale: number): number {
  const r = width / scale;
  if (r >= 0.75) return order + 1;
  return r >= 0.25 ? order : Math.max(Math.min(3, order), order - 1);
}

export function continuousBinNodes(bins: TriangleBins, order: number): TriangleNodeSet {
  if (!Number.isInteger(order) || order < 1) throw new InputError(`continuous bin average: order must be a positive integer, got ${order}`);
  const half = bins.shells.dk / 2;
  const k1s: number[] = [];
  const k2s: number[] = [];
  const k3s: number[] = [];
  const ws: number[] = [];
  const start = new Int32Array(bins.size + 1);
  const cuts1: number[] = [];
  const cuts2: number[] = [];
  for (let b = 0; b < bins.size; b++) {
    start[b] = ws.length;
    const lo1 = bins.centres[3 * b] - half;
    const hi1 = lo1 + 2 * half;
    const lo2 = bins.centres[3 * b + 1] - half;
    const hi2 = lo2 + 2 * half;
    const lo3 = bins.centres[3 * b + 2] - half;
    const hi3 = lo3 + 2 * half;
    const c3 = lo3 + half;
    cuts1.length = 0;
    for (const a of [lo2, hi2]) for (const c of [lo3, hi3]) cuts1.push(a + c, Math.abs(a - c));
    const pieces1 = breakpoints(lo1, hi1, cuts1);
    let norm = 0;
    for (let p1 = 0; p1 + 1 < pieces1.length; p1++) {
      const [x1, y1] = [pieces1[p1], pieces1[p1 + 1]];
      const g1 = gaussLegendre(piecePoints(order, y1 - x1, c3));
      for (let i1 = 0; i1 < g1.nodes.length; i1++) {
        const k1 = 0.5 * (x1 + y1) + 0.5 * (y1 - x1) * g1.nodes[i1];
        const w1 = 0.5 * (y1 - x1) * g1.weights[i1];
        cuts2.length = 0;
        for (const c of [lo3, hi3]) cuts2.push(k1 + c, Math.abs(k1 - c));
        if (lo3 <= 0) cuts2.push(k1);
        const pieces2 = breakpoints(lo2, hi2, cuts2);
        for (let p2 = 0; p2 + 1 < pieces2.length; p2++) {
          const [x2, y2] = [pieces2[p2], pieces2[p2 + 1]];
          const g2 = gaussLegendre(piecePoints(order, y2 - x2, c3));
          for (let i2 = 0; i2 < g2.nodes.length; i2++) {
            const k2 = 0.5 * (x2 + y2) + 0.5 * (y2 - x2) * g2.nodes[i2];
            const w2 = 0.5 * (y2 - x2) * g2.weights[i2];
            const x3 = Math.max(lo3, Math.abs(k1 - k2));
            const y3 = Math.min(hi3, k1 + k2);
            if (!(y3 > x3)) continue;
            const g3 = gaussLegendre(piecePoints(order, y3 - x3, c3));
            for (let i3 = 0; i3 < g3.nodes.length; i3++) {
              const k3 = 0.5 * (x3 + y3) + 0.5 * (y3 - x3) * g3.nodes[i3];
              const w = w1 * w2 * 0.5 * (y3 - x3) * g3.weights[i3] * k1 * k2 * k3;
              k1s.push(k1);
              k2s.push(k2);
              k3s.push(k3);
              ws.push(w);
              norm += w;
            }
          }
        }
      }
    }
    if (!(norm > 0)) throw new InputError(`continuous bin average: bin ${b} has no closing triangles`);
    for (let n = start[b]; n < ws.length; n++) ws[n] /= norm;
  }
  start[bins.size] = ws.length;
  return {
    binCount: bins.size,
    start,
    k1: Float64Array.from(k1s),
    k2: Float64Array.from(k2s),
    k3: Float64Array.from(k3s),
    weight: Float64Array.from(ws),
  };
}

/** lo, the cuts strictly inside (lo, hi) in increasing order without near-repeats, hi. */
function breakpoints(lo: number, hi: number, cuts: readonly number[]): number[] {
  const eps = 1e-12 * (hi - lo);
  const inside = cuts.filter((c) => c > lo + eps && c < hi - eps).sort((a, b) => a - b);
  const out = [lo];
  for (const c of inside) if (c - out[out.length - 1] > eps) out.push(c);
  if (hi - out[out.length - 1] > eps) out.push(hi);
  else out[out.length - 1] = hi;
  return out;
}
