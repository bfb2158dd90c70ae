/**
 * Spherical Bessel functions j0 and j2 (Abramowitz & Stegun 10.1.11–10.1.12),
 * with their Taylor series (A&S 10.1.2) below x = 0.05, where the closed form
 * of j2 loses digits to cancellation.
 */
export function sphericalBesselJ0(x: number): number {
  if (Math.abs(x) < 0.05) {
    const x2 = x * x;
    return 1 - (x2 / 6) * (1 - x2 / 20);
  }
  return Math.sin(x) / x;
}

export function sphericalBesselJ2(x: number): number {
  if (Math.abs(x) < 0.05) {
    const x2 = x * x;
    return (x2 / 15) * (1 - (x2 / 14) * (1 - x2 / 36));
  }
  const s = Math.sin(x);
  const c = Math.cos(x);
  return ((3 / (x * x) - 1) * s) / x - (3 * c) / (x * x);
}
