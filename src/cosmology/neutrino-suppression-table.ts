import { CubicSpline } from '../numerics/cubic-spline.js';
import {
  freeStreamingFactor,
  masterTransferEH99,
  neutrinoGrowthEH99,
  type EisensteinHu99,
  type NeutrinoGrowth,
} from './eisenstein-hu-1999.js';

/**
 * The smooth massive-neutrino factors of Eisenstein & Hu 1999 on a coarse
 * uniform grid in ln k, interpolated by cubic splines: the transfer ratio
 * T_master(k; f_nu) / T_master(k; 0) at fixed total omega_m, and the
 * free-streaming growth ratios D_cb / D1 and D_cbnu / D1 at one or two values
 * of D1. These vary on scales of order one in ln k, so a grid step of ~0.06
 * interpolates them to ~1e-6 at a quarter of the cost of exact evaluation.
 */
export class NeutrinoSuppressionTable {
  readonly transferRatio: CubicSpline;
  readonly coldGrowth: CubicSpline;
  readonly totalGrowth: CubicSpline;
  /** D_cbnu / D1 at the second D1 (for instance z = 0, for the sigma8 normalisation). */
  readonly totalGrowthOther: CubicSpline;

  constructor(
    withNu: EisensteinHu99,
    withoutNu: EisensteinHu99,
    lnKMin: number,
    lnKMax: number,
    points: number,
    d1: number,
    d1Other: number,
  ) {
    const lnK = new Float64Array(points);
    const ratio = new Float64Array(points);
    const cold = new Float64Array(points);
    const total = new Float64Array(points);
    const totalOther = new Float64Array(points);
    const g: NeutrinoGrowth = { cold: 1, total: 1, coldRate: 1, totalRate: 1 };
    const step = (lnKMax - lnKMin) / (points - 1);
    for (let i = 0; i < points; i++) {
      const x = lnKMin + i * step;
      const k = Math.exp(x);
      lnK[i] = x;
      ratio[i] = masterTransferEH99(withNu, k) / masterTransferEH99(withoutNu, k);
      const yFs = freeStreamingFactor(withNu, k);
      neutrinoGrowthEH99(withNu, yFs, d1, g);
      cold[i] = g.cold;
      total[i] = g.total;
      totalOther[i] = d1Other === d1 ? g.total : neutrinoGrowthEH99(withNu, yFs, d1Other, g).total;
    }
    this.transferRatio = new CubicSpline(lnK, ratio);
    this.coldGrowth = new CubicSpline(lnK, cold);
    this.totalGrowth = new CubicSpline(lnK, total);
    this.totalGrowthOther = new CubicSpline(lnK, totalOther);
  }
}
