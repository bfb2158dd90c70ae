import { gaussLegendreOn } from '../numerics/gauss-legendre.js';
import { sphericalBesselJ0, sphericalBesselJ2 } from '../numerics/spherical-bessel-low-order.js';

/** Default BAO scale (Mpc/h) and separation scale k_s (h/Mpc) of the IR resummation. */
export const DEFAULT_BAO_SCALE = 105;
export const DEFAULT_SEPARATION_SCALE = 0.2;

export interface BaoDampingScales {
  /** Sigma^2 in (Mpc/h)^2. */
  readonly sigma2: number;
  /** delta Sigma^2 in (Mpc/h)^2. */
  readonly deltaSigma2: number;
}

const rule = gaussLegendreOn(64, 0, 1);

/**
 * IR-resummation damping scales from the no-wiggle spectrum (JCAP 07 (2018) 053;
 * PRD 92 (2015) 043514; JCAP 07 (2016) 028):
 *   Sigma^2       = 1/(6 pi^2) int_0^{k_s} dq P_nw(q) [1 - j0(q r) + 2 j2(q r)],
 *   delta Sigma^2 = 1/(2 pi^2) int_0^{k_s} dq P_nw(q) j2(q r),
 * with r the BAO scale. 64-point Gauss–Legendre on [0, k_s].
 */
export function baoDampingScales(
  powerNoWiggle: (k: number) => number,
  baoScale = DEFAULT_BAO_SCALE,
  separationScale = DEFAULT_SEPARATION_SCALE,
): BaoDampingScales {
  let s = 0;
  let ds = 0;
  for (let i = 0; i < rule.nodes.length; i++) {
    const q = separationScale * rule.nodes[i];
    const w = separationScale * rule.weights[i] * powerNoWiggle(q);
    const j2 = sphericalBesselJ2(q * baoScale);
    s += w * (1 - sphericalBesselJ0(q * baoScale) + 2 * j2);
    ds += w * j2;
  }
  return { sigma2: s / (6 * Math.PI * Math.PI), deltaSigma2: ds / (2 * Math.PI * Math.PI) };
}
