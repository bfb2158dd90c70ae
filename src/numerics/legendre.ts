/** Legendre polynomial L_l(x) by the Bonnet recurrence (Abramowitz & Stegun 8.5.3). */
export function legendre(l: number, x: number): number {
  if (l === 0) return 1;
  if (l === 1) return x;
  let p0 = 1;
  let p1 = x;
  for (let j = 2; j <= l; j++) {
    const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j;
    p0 = p1;
    p1 = p2;
  }
  return p1;
}
