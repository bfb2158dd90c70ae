/**
 * Legendre polynomials L_n(x) and L_{n-1}(x) together by the Bonnet recurrence
 * (Abramowitz & Stegun 8.5.3); writes [L_n, L_{n-1}] into `out`.
 */
export function legendrePair(n: number, x: number, out: Float64Array): Float64Array {
  let p0 = 1;
  let p1 = x;
  if (n === 0) {
    out[0] = 1;
    out[1] = 0;
    return out;
  }
  for (let j = 2; j <= n; j++) {
    const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j;
    p0 = p1;
    p1 = p2;
  }
  out[0] = p1;
  out[1] = p0;
  return out;
}

const scratch = new Float64Array(2);

/** Legendre polynomial L_l(x). */
export function legendre(l: number, x: number): number {
  return legendrePair(l, x, scratch)[0];
}
