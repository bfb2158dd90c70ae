/**
 * The tree-level galaxy bispectrum at fixed linear power and fixed settings is a
 * polynomial in the bias, growth-rate and stochastic parameters:
 *   B = sum_t c_t(b1, b2, bG2, f, A_P, A_0) T_t.
 * This file fixes the list of monomials c_t (the "value" index of the template
 * layout [bin][multipole][value]) and computes them from parameters.
 *
 * Deterministic part, 2 Z1 Z1 Z2 P P + 2 cyclic (Scoccimarro, Couchman & Frieman
 * 1999, ApJ 517, 531, eqs. 12–14), with Z1 Z1 = b1^2 + b1 f (nu_a^2 + nu_b^2)
 * + f^2 nu_a^2 nu_b^2 and Z2 = b1 (F2 + f A1) + f nu^2 G2 + f^2 A2 + b2/2 + bG2 sigma^2,
 * gives the 14 monomials 0–13. Stochastic part (docs/conventions.md):
 *   A_P (1/nbar) sum_i b1 Z1(k_i) P(k_i) -> A_P b1^2 and A_P b1 f   (14, 15)
 *   A_0 / nbar^2                                                   (16)
 */
export interface TreeBispectrumParameters {
  readonly b1: number;
  readonly b2: number;
  readonly bG2: number;
  readonly f: number;
  /** A_P: amplitude of (1/nbar) sum_i b1 Z1(k_i) P(k_i); Poisson value 1. */
  readonly bispShotPower: number;
  /** A_0: amplitude of 1/nbar^2; Poisson value 1. */
  readonly bispShotConst: number;
}

export const TREE_TEMPLATE_TERMS: readonly string[] = [
  'b1^3',
  'b1^3 f',
  'b1^2 f',
  'b1^2 f^2',
  'b1 f^2',
  'b1 f^3',
  'f^3',
  'f^4',
  'b1^2 b2',
  'b1 f b2',
  'f^2 b2',
  'b1^2 bG2',
  'b1 f bG2',
  'f^2 bG2',
  'A_P b1^2',
  'A_P b1 f',
  'A_0',
];

export const TREE_TEMPLATE_SIZE = TREE_TEMPLATE_TERMS.length;

/** out[t] = c_t(params) for every template term t. */
export function treeTemplateCoefficients(p: TreeBispectrumParameters, out = new Float64Array(TREE_TEMPLATE_SIZE)): Float64Array {
  const { b1, b2, bG2, f } = p;
  const b1s = b1 * b1;
  const fs = f * f;
  out[0] = b1s * b1;
  out[1] = b1s * b1 * f;
  out[2] = b1s * f;
  out[3] = b1s * fs;
  out[4] = b1 * fs;
  out[5] = b1 * fs * f;
  out[6] = fs * f;
  out[7] = fs * fs;
  out[8] = b1s * b2;
  out[9] = b1 * f * b2;
  out[10] = fs * b2;
  out[11] = b1s * bG2;
  out[12] = b1 * f * bG2;
  out[13] = fs * bG2;
  out[14] = p.bispShotPower * b1s;
  out[15] = p.bispShotPower * b1 * f;
  out[16] = p.bispShotConst;
  return out;
}
