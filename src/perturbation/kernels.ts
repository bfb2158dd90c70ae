/**
 * Tree-level perturbation-theory kernels on scalar triangle geometry.
 *
 * Geometry of a pair (k_a, k_b): magnitudes ka, kb and the cosine mu_ab of the
 * angle between them. Redshift space adds the cosines mu_a, mu_b of each vector
 * with the line of sight (plane-parallel).
 *
 * Sources: F2 and G2 — Bernardeau et al. 2002, Phys. Rep. 367, 1, eqs. 45–46;
 * Z1, Z2 — Scoccimarro, Couchman & Frieman 1999, ApJ 517, 531, eqs. 12–13, with
 * the Galileon tidal operator of docs/conventions.md in place of their s^2 term.
 */

/** F2(k_a, k_b) = 5/7 + (mu_ab/2)(ka/kb + kb/ka) + (2/7) mu_ab^2. */
export function kernelF2(ka: number, kb: number, muAB: number): number {
  return kernelF2FromRatios(muAB, ka / kb + kb / ka);
}

/** G2(k_a, k_b) = 3/7 + (mu_ab/2)(ka/kb + kb/ka) + (4/7) mu_ab^2. */
export function kernelG2(ka: number, kb: number, muAB: number): number {
  return kernelG2FromRatios(muAB, ka / kb + kb / ka);
}

/** F2 from mu_ab and ratios = ka/kb + kb/ka = (ka^2 + kb^2) / (ka kb). */
export function kernelF2FromRatios(muAB: number, ratios: number): number {
  return 5 / 7 + 0.5 * muAB * ratios + (2 / 7) * muAB * muAB;
}

/** G2 from mu_ab and ratios = ka/kb + kb/ka. */
export function kernelG2FromRatios(muAB: number, ratios: number): number {
  return 3 / 7 + 0.5 * muAB * ratios + (4 / 7) * muAB * muAB;
}

/** Galileon tidal kernel sigma^2(k_a, k_b) = mu_ab^2 - 1. */
export function kernelGalileonTidal(muAB: number): number {
  return muAB * muAB - 1;
}

/** Z1(k) = b1 + f mu^2 (Kaiser 1987). */
export function kernelZ1(b1: number, f: number, mu: number): number {
  return b1 + f * mu * mu;
}

export interface BiasForKernels {
  readonly b1: number;
  readonly b2: number;
  readonly bG2: number;
  readonly f: number;
}

/**
 * Z2(k_a, k_b) in redshift space:
 *   b1 F2 + f mu^2 G2 + (f mu k / 2)[mu_a/ka (b1 + f mu_b^2) + mu_b/kb (b1 + f mu_a^2)]
 *   + b2/2 + bG2 sigma^2(k_a, k_b),
 * with k = |k_a + k_b| and mu k = mu_a ka + mu_b kb.
 */
export function kernelZ2(p: BiasForKernels, ka: number, kb: number, muAB: number, muA: number, muB: number): number {
  const k = Math.sqrt(Math.max(ka * ka + kb * kb + 2 * ka * kb * muAB, 0));
  const muK = muA * ka + muB * kb; // mu k of the sum vector
  const mu = k > 0 ? muK / k : 0;
  const { b1, b2, bG2, f } = p;
  return (
    b1 * kernelF2(ka, kb, muAB) +
    f * mu * mu * kernelG2(ka, kb, muAB) +
    0.5 * f * muK * ((muA / ka) * (b1 + f * muB * muB) + (muB / kb) * (b1 + f * muA * muA)) +
    0.5 * b2 +
    bG2 * kernelGalileonTidal(muAB)
  );
}

/**
 * Conversion between the Galileon tidal bias and the b_s2 convention in which
 * delta_g contains (b_s2/2) s^2 with the kernel S2 = mu_ab^2 - 1/3. Since
 * sigma^2 = S2 - 2/3, the same galaxy field needs
 *   b_s2 = 2 bG2   and   b2(b_s2 convention) = b2 - (4/3) bG2
 * (the -2/3 offset moves into the local quadratic term). Common practice; the
 * equivalence is tested by comparing bispectra.
 */
export function galileonToBs2(b2: number, bG2: number): { b2: number; bs2: number } {
  return { b2: b2 - (4 / 3) * bG2, bs2: 2 * bG2 };
}

export function bs2ToGalileon(b2: number, bs2: number): { b2: number; bG2: number } {
  return { b2: b2 + (2 / 3) * bs2, bG2: bs2 / 2 };
}
