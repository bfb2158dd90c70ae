import { irResummedPower } from '../perturbation/ir-resummed-power.js';
import type { ResolvedTreeSettings } from './tree-settings.js';

/**
 * The settings-dependent pieces of one observed triangle configuration, shared
 * by the direct and the template integrands. Slots of the scratch array:
 *   0–2  true wavenumbers q_i   (AP: q = k sqrt(mu^2/apar^2 + (1 - mu^2)/aperp^2))
 *   3–5  true cosines nu_i      (nu = mu / (apar sqrt(...)))
 *   6–8  power P(q_i, nu_i), IR-resummed when asked
 *   9    fingers-of-god damping exp(-(sigma_v^2/2) sum_i q_i^2 nu_i^2)
 *   10   AP amplitude 1/(apar aperp^2)^2
 */
export const TRIANGLE_SCRATCH_SIZE = 11;

/** Fill slot i (0, 1, 2) for one observed side; returns q^2 nu^2 for the damping. */
function fillSide(s: ResolvedTreeSettings, i: number, k: number, mu: number, out: Float64Array): number {
  const stretch = Math.sqrt((mu * mu) / (s.alphaPar * s.alphaPar) + (1 - mu * mu) / (s.alphaPerp * s.alphaPerp));
  const q = k * stretch;
  const nu = mu / (s.alphaPar * stretch);
  out[i] = q;
  out[3 + i] = nu;
  out[6 + i] = s.irResummation ? irResummedPower(s.spectrum, q, nu, s.fForBaoDamping) : s.spectrum.power(q);
  return q * q * nu * nu;
}

export function fillTrianglePhysics(
  s: ResolvedTreeSettings,
  k1: number,
  k2: number,
  k3: number,
  mu1: number,
  mu2: number,
  mu3: number,
  out: Float64Array,
): void {
  const damp = fillSide(s, 0, k1, mu1, out) + fillSide(s, 1, k2, mu2, out) + fillSide(s, 2, k3, mu3, out);
  const sv = s.velocityDispersion;
  out[9] = sv > 0 ? Math.exp(-0.5 * sv * sv * damp) : 1;
  const v = s.alphaPar * s.alphaPerp * s.alphaPerp;
  out[10] = 1 / (v * v);
}
