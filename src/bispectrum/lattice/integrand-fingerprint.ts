import { createHash } from 'node:crypto';
import { Random } from '../../numerics/random.js';
import type { TriangleIntegrand } from '../triangle-integrand.js';

/**
 * An identity for a TriangleIntegrand, for cache keys: a SHA-256 of its values
 * at a fixed, seeded set of closed triangles with sides in [kLo, kHi) and
 * random orientations. Two integrands that differ anywhere smoothly in that
 * range (other linear power, other settings) get different fingerprints; one
 * that differs only outside [kLo, kHi) is not told apart, and need not be.
 */
export const FINGERPRINT_PROBES = 48;

export function integrandFingerprint(integrand: TriangleIntegrand, kLo: number, kHi: number): string {
  const rng = new Random(20240611);
  const values = new Float64Array(FINGERPRINT_PROBES * integrand.size);
  const q1 = new Float64Array(3);
  const q2 = new Float64Array(3);
  const q3 = new Float64Array(3);
  let found = 0;
  while (found < FINGERPRINT_PROBES) {
    randomVector(rng, kLo, kHi, q1);
    randomVector(rng, kLo, kHi, q2);
    for (let c = 0; c < 3; c++) q3[c] = -q1[c] - q2[c];
    const k3 = Math.hypot(q3[0], q3[1], q3[2]);
    if (!(k3 >= kLo && k3 < kHi && k3 > 0)) continue;
    const k1 = Math.hypot(q1[0], q1[1], q1[2]);
    const k2 = Math.hypot(q2[0], q2[1], q2[2]);
    integrand.evaluate(k1, k2, k3, q1[2] / k1, q2[2] / k2, q3[2] / k3, values, found * integrand.size);
    found++;
  }
  return createHash('sha256').update(new Uint8Array(values.buffer)).digest('hex').slice(0, 32);
}

function randomVector(rng: Random, kLo: number, kHi: number, out: Float64Array): void {
  const k = kLo + (kHi - kLo) * rng.uniform();
  const mu = 2 * rng.uniform() - 1;
  const phi = 2 * Math.PI * rng.uniform();
  const s = Math.sqrt(1 - mu * mu);
  out[0] = k * s * Math.cos(phi);
  out[1] = k * s * Math.sin(phi);
  out[2] = k * mu;
}
