import { InputError } from '../contracts/input-error.js';
import { gaussLegendre } from '../numerics/gauss-legendre.js';
import { legendre } from '../numerics/legendre.js';

/**
 * Quadrature over triangle orientations (docs/conventions.md, "Bispectrum"):
 * mu1 = cos of side 1 with the line of sight, phi = azimuth of side 2 about
 * side 1, so mu2 = mu1 cos(theta12) - sqrt(1 - mu1^2) sin(theta12) cos(phi).
 *
 * The plane-parallel model is unchanged when the line of sight is reversed and
 * depends on phi through cos(phi) only, so the rule keeps mu1 in (0, 1) — the
 * positive nodes of a 2 m point Gauss–Legendre rule on [-1, 1], exact for even
 * polynomials of degree <= 4 m - 1 — and phi in (0, pi) by the midpoint rule
 * (Gauss–Chebyshev: exact for cos^j(phi), j <= 2 n - 1). The weights sum to 1,
 * i.e. they give the mean over orientations, and B_l = (2l+1) <B L_l(mu1)>.
 */
export interface OrientationRule {
  /** Gauss–Legendre nodes on (0, 1) for mu1 (m of them) and phi midpoints on (0, pi) (n). */
  readonly muCount: number;
  readonly phiCount: number;
  /** Per orientation point (m * n of them, mu-major): mu1, sqrt(1 - mu1^2), cos(phi), weight. */
  readonly mu1: Float64Array;
  readonly sinMu1: Float64Array;
  readonly cosPhi: Float64Array;
  readonly weight: Float64Array;
}

export function orientationRule(muCount: number, phiCount: number): OrientationRule {
  if (!Number.isInteger(muCount) || muCount < 1) throw new InputError(`orientation quadrature: muNodes must be a positive integer, got ${muCount}`);
  if (!Number.isInteger(phiCount) || phiCount < 1) throw new InputError(`orientation quadrature: phiNodes must be a positive integer, got ${phiCount}`);
  const gl = gaussLegendre(2 * muCount);
  const size = muCount * phiCount;
  const mu1 = new Float64Array(size);
  const sinMu1 = new Float64Array(size);
  const cosPhi = new Float64Array(size);
  const weight = new Float64Array(size);
  for (let i = 0; i < muCount; i++) {
    const x = gl.nodes[muCount + i];
    const w = gl.weights[muCount + i]; // half-range mean: (1/2) * 2 * w
    for (let j = 0; j < phiCount; j++) {
      const o = i * phiCount + j;
      mu1[o] = x;
      sinMu1[o] = Math.sqrt(1 - x * x);
      cosPhi[o] = Math.cos((Math.PI * (j + 0.5)) / phiCount);
      weight[o] = w / phiCount;
    }
  }
  return { muCount, phiCount, mu1, sinMu1, cosPhi, weight };
}

/**
 * Smallest rule that is exact for the polynomial part of the tree-level model
 * (degree 8 in the cosines, times L_l(mu1) up to l = lMax): m mu nodes with
 * 4 m - 1 >= 8 + lMax and 5 phi nodes (2 n - 1 >= 8).
 */
export function exactPolynomialOrientationRule(lMax: number): OrientationRule {
  return orientationRule(Math.ceil((9 + lMax) / 4), 5);
}

/** Check a multipole list: even, non-negative integers (odd ones vanish by symmetry). */
export function checkMultipoles(multipoles: readonly number[]): void {
  if (multipoles.length === 0) throw new InputError('bispectrum multipoles: the list is empty');
  for (const l of multipoles) {
    if (!Number.isInteger(l) || l < 0 || l % 2 !== 0) {
      throw new InputError(`bispectrum multipoles: ${l} is not an even non-negative integer (odd multipoles vanish)`);
    }
  }
}

/** Table [orientation][multipole] of weight * (2l + 1) L_l(mu1). */
export function multipoleWeights(rule: OrientationRule, multipoles: readonly number[]): Float64Array {
  checkMultipoles(multipoles);
  const nm = multipoles.length;
  const out = new Float64Array(rule.weight.length * nm);
  for (let o = 0; o < rule.weight.length; o++) {
    for (let m = 0; m < nm; m++) {
      const l = multipoles[m];
      out[o * nm + m] = rule.weight[o] * (2 * l + 1) * legendre(l, rule.mu1[o]);
    }
  }
  return out;
}
