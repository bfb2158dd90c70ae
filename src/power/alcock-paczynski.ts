/**
 * Alcock–Paczynski distortion (Ballinger, Peacock & Heavens 1996, MNRAS 282,
 * 877, sec. 2): observed wavevectors map to true ones by
 *   q_par = k_par / alphaPar,  q_perp = k_perp / alphaPerp,
 * so q = k F(mu), nu = mu / (alphaPar F(mu)) with
 *   F^2 = 1/alphaPerp^2 + mu^2 (1/alphaPar^2 - 1/alphaPerp^2),
 * and the observed power is P_true(q, nu) / (alphaPar alphaPerp^2). Written this
 * way alpha = 1 gives F = 1 and nu = mu exactly, without rounding.
 */
export function mapObservedToTrue(
  k: Float64Array,
  mu: Float64Array,
  alphaPar: number,
  alphaPerp: number,
  qOut: Float64Array,
  nuOut: Float64Array,
): void {
  const invPerp2 = 1 / (alphaPerp * alphaPerp);
  const diff = 1 / (alphaPar * alphaPar) - invPerp2;
  for (let j = 0; j < k.length; j++) {
    const m = mu[j];
    const F = Math.sqrt(invPerp2 + m * m * diff);
    qOut[j] = k[j] * F;
    nuOut[j] = m / (alphaPar * F);
  }
}

/** Volume factor 1 / (alphaPar alphaPerp^2) multiplying the true power. */
export function apVolumeFactor(alphaPar: number, alphaPerp: number): number {
  return 1 / (alphaPar * alphaPerp * alphaPerp);
}
