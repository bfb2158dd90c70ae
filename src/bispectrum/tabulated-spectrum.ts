import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { CubicSpline, SharedGridSplines } from '../numerics/cubic-spline.js';

/**
 * A LinearSpectrum re-tabulated on a uniform k grid over [kLo, kHi] with
 * natural cubic splines of P_nw and P_w = P - P_nw, so that the many lookups
 * of a bin-averaged bispectrum cost a few flops each instead of the producer's
 * own interpolation. The grid reaches PAD steps beyond [kLo, kHi] (when the
 * source allows) so that the natural end conditions do not spoil the range in
 * use, and [kLo, kHi] is first widened to multiples of SNAP so that nearby
 * requests share one grid (results do not jitter with the exact node range).
 * Accuracy: tests/bispectrum/fast-evaluator.test.ts.
 */
const PAD = 12;
const SNAP = 1e-3;

export class TabulatedSpectrum implements LinearSpectrum {
  readonly redshift: number;
  readonly kMin: number;
  readonly kMax: number;
  readonly growthRateLargeScale: number;
  readonly sigma2BAO: number;
  readonly deltaSigma2BAO: number;
  readonly sigma8: number;
  private readonly noWiggle: CubicSpline;
  private readonly wiggle: CubicSpline;
  private readonly pair: SharedGridSplines;
  private readonly source: LinearSpectrum;

  constructor(source: LinearSpectrum, kLo: number, kHi: number, points = 2000) {
    const snapLo = Math.floor(kLo / SNAP) * SNAP;
    const a = snapLo > 0 ? snapLo : kLo;
    const b = Math.ceil(kHi / SNAP) * SNAP;
    const step = (b - a) / (points - 1 - 2 * PAD);
    const lo = Math.max(source.kMin, a - PAD * step);
    const hi = Math.min(source.kMax, b + PAD * step);
    const k = new Float64Array(points);
    const nw = new Float64Array(points);
    const w = new Float64Array(points);
    for (let i = 0; i < points; i++) {
      k[i] = i === points - 1 ? hi : lo + ((hi - lo) * i) / (points - 1);
      nw[i] = source.powerNoWiggle(k[i]);
      w[i] = source.power(k[i]) - nw[i];
    }
    this.noWiggle = new CubicSpline(k, nw);
    this.wiggle = new CubicSpline(k, w);
    this.pair = new SharedGridSplines(this.noWiggle, this.wiggle);
    this.source = source;
    this.redshift = source.redshift;
    this.kMin = Math.max(source.kMin, a);
    this.kMax = Math.min(source.kMax, b);
    this.growthRateLargeScale = source.growthRateLargeScale;
    this.sigma2BAO = source.sigma2BAO;
    this.deltaSigma2BAO = source.deltaSigma2BAO;
    this.sigma8 = source.sigma8;
  }

  power(k: number): number {
    return this.noWiggle.at(k) + this.wiggle.at(k);
  }

  powerNoWiggle(k: number): number {
    return this.noWiggle.at(k);
  }

  /** P_nw(k) + damping P_w(k), both splines at once (inside the table's range). */
  dampedPower(k: number, damping: number): number {
    return this.pair.sum(k, damping);
  }

  /** The P_nw and P_w splines behind `dampedPower`, packed (SharedGridSplines.packed). */
  packedSplines(): ReturnType<SharedGridSplines['packed']> {
    return this.pair.packed();
  }

  /** P_w = P - P_nw. */
  powerWiggle(k: number): number {
    return this.wiggle.at(k);
  }

  growthRate(k: number): number {
    return this.source.growthRate(k);
  }
}
