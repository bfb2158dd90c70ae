import { kernelF2, kernelG2, kernelGalileonTidal } from '../perturbation/kernels.js';
import type { TriangleIntegrand } from './triangle-integrand.js';
import { fillTrianglePhysics, TRIANGLE_SCRATCH_SIZE } from './triangle-physics.js';
import { TREE_TEMPLATE_SIZE } from './tree-template-terms.js';
import { resolveTreeSettings, type ResolvedTreeSettings, type TreeBispectrumSettings } from './tree-settings.js';

/**
 * The template pieces T_t of the tree-level redshift-space galaxy bispectrum
 * (one value per monomial of tree-template-terms.ts, P products and damping
 * inside) for one observed triangle configuration, at fixed linear power and
 * fixed settings. Averaging this integrand with any method (centres, effective
 * wavenumbers, continuous bin volume, discrete box) and combining with
 * `combineTreeTemplates` gives B_l for any bias and stochastic parameters.
 */
export class TreeTemplateIntegrand implements TriangleIntegrand {
  readonly size = TREE_TEMPLATE_SIZE;
  readonly settings: ResolvedTreeSettings;
  private readonly scratch = new Float64Array(TRIANGLE_SCRATCH_SIZE);

  constructor(settings: TreeBispectrumSettings | ResolvedTreeSettings) {
    this.settings = 'inverseDensity' in settings ? settings : resolveTreeSettings(settings);
  }

  evaluate(k1: number, k2: number, k3: number, mu1: number, mu2: number, mu3: number, out: Float64Array, offset: number): void {
    const s = this.scratch;
    fillTrianglePhysics(this.settings, k1, k2, k3, mu1, mu2, mu3, s);
    for (let t = 0; t < TREE_TEMPLATE_SIZE; t++) out[offset + t] = 0;
    addPair(s, 0, 1, 2, out, offset);
    addPair(s, 1, 2, 0, out, offset);
    addPair(s, 2, 0, 1, out, offset);
    const damp = s[9];
    const amp = s[10];
    for (let t = 0; t < 14; t++) out[offset + t] *= damp * amp;
    // Stochastic terms, undamped: (1/nbar) sum_i b1 Z1(k_i) P(k_i) and 1/nbar^2.
    const n1 = this.settings.inverseDensity;
    out[offset + 14] = amp * n1 * (s[6] + s[7] + s[8]);
    out[offset + 15] = amp * n1 * (s[3] * s[3] * s[6] + s[4] * s[4] * s[7] + s[5] * s[5] * s[8]);
    out[offset + 16] = amp * n1 * n1;
  }
}

/** Add 2 Z1(q_a) Z1(q_b) Z2(q_a, q_b) P_a P_b, split by monomial, with q_c = |q_a + q_b|. */
function addPair(s: Float64Array, a: number, b: number, c: number, out: Float64Array, o: number): void {
  const qa = s[a];
  const qb = s[b];
  const qc = s[c];
  const cosAB = (qc * qc - qa * qa - qb * qb) / (2 * qa * qb);
  const F = kernelF2(qa, qb, cosAB);
  const G = kernelG2(qa, qb, cosAB);
  const S = kernelGalileonTidal(cosAB);
  const na = s[3 + a];
  const nb = s[3 + b];
  addPairTemplates(out, o, 2 * s[6 + a] * s[6 + b], na * qa + nb * qb, 1 / qa, 1 / qb, na, nb, s[3 + c], F, G, S);
}

/**
 * The monomial split of w Z1(q_a) Z1(q_b) Z2(q_a, q_b) added to out[o + 0..13],
 * given the pair's F2, G2 and sigma^2, the inverse lengths 1/q_a, 1/q_b and the
 * cosines nu_a, nu_b, nu_c with the line of sight; the sum vector q_a + q_b = -q_c
 * has cosine squared nu_c^2 and mu k = nu_a q_a + nu_b q_b (`muK`).
 * Z2 = b1 (F2 + f A1) + f nu_c^2 G2 + f^2 A2 + b2/2 + bG2 sigma^2.
 */
export function addPairTemplates(
  out: Float64Array,
  o: number,
  w: number,
  muK: number,
  invQa: number,
  invQb: number,
  na: number,
  nb: number,
  nc: number,
  F: number,
  G: number,
  S: number,
): void {
  const na2 = na * na;
  const nb2 = nb * nb;
  const zB1f = 0.5 * muK * (na * invQa + nb * invQb);
  const zF = nc * nc * G;
  const zF2 = 0.5 * muK * na * nb * (nb * invQa + na * invQb);
  const u0 = w;
  const u1 = w * (na2 + nb2);
  const u2 = w * na2 * nb2;
  out[o] += u0 * F;
  out[o + 1] += u0 * zB1f;
  out[o + 2] += u0 * zF + u1 * F;
  out[o + 3] += u0 * zF2 + u1 * zB1f;
  out[o + 4] += u1 * zF + u2 * F;
  out[o + 5] += u1 * zF2 + u2 * zB1f;
  out[o + 6] += u2 * zF;
  out[o + 7] += u2 * zF2;
  out[o + 8] += 0.5 * u0;
  out[o + 9] += 0.5 * u1;
  out[o + 10] += 0.5 * u2;
  out[o + 11] += u0 * S;
  out[o + 12] += u1 * S;
  out[o + 13] += u2 * S;
}
