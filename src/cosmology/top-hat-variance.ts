/**
 * Variance of the linear field in a real-space top-hat sphere of radius R,
 *   sigma^2(R) = int dln k  k^3 P(k) / (2 pi^2)  W^2(kR),  W(x) = 3 (sin x - x cos x) / x^3
 * (Peebles 1980, The Large-Scale Structure of the Universe, sec. 26),
 * from P sampled on a uniform grid in ln k by the composite Simpson rule
 * (a 3/8 panel closes an odd number of intervals).
 */
export function topHatWindow(x: number): number {
  if (x < 1e-2) {
    const x2 = x * x;
    return 1 - (x2 / 10) * (1 - x2 / 28);
  }
  return (3 * (Math.sin(x) - x * Math.cos(x))) / (x * x * x);
}

/** sigma(R) for P given on k_i = exp(lnK0 + i dlnK); R in Mpc/h with k in h/Mpc. */
export function topHatSigma(lnK0: number, dlnK: number, power: ArrayLike<number>, radius: number): number {
  const n = power.length;
  if (n < 4) throw new RangeError(`top-hat variance needs at least 4 samples, got ${n}`);
  const term = (i: number) => {
    const k = Math.exp(lnK0 + i * dlnK);
    const w = topHatWindow(k * radius);
    return k * k * k * power[i] * w * w;
  };
  const intervals = n - 1;
  const simpsonEnd = intervals % 2 === 0 ? intervals : intervals - 3;
  let sum = 0;
  for (let i = 0; i <= simpsonEnd; i++) {
    const weight = i === 0 || i === simpsonEnd ? 1 : i % 2 === 1 ? 4 : 2;
    sum += weight * term(i);
  }
  sum *= dlnK / 3;
  if (simpsonEnd < intervals) {
    const j = simpsonEnd;
    sum += ((3 * dlnK) / 8) * (term(j) + 3 * term(j + 1) + 3 * term(j + 2) + term(j + 3));
  }
  return Math.sqrt(sum / (2 * Math.PI * Math.PI));
}
