/**
 * Upper tail of the chi-square distribution, P(X >= chi2) for `dof` degrees of
 * freedom: the regularised upper incomplete gamma function Q(dof/2, chi2/2),
 * by its series for x < a + 1 and its continued fraction otherwise
 * (Abramowitz & Stegun 6.5.29 and 6.5.31; Press et al., Numerical Recipes 3rd
 * ed., sec. 6.2, modified Lentz evaluation), with ln Gamma from mathjs.
 */
import { lgamma } from 'mathjs';

function lowerSeries(a: number, x: number): number {
  let term = 1 / a;
  let sum = term;
  for (let n = 1; n < 1000; n++) {
    term *= x / (a + n);
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * 1e-16) break;
  }
  return sum * Math.exp(-x + a * Math.log(x) - lgamma(a));
}

function upperFraction(a: number, x: number): number {
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 1000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x + a * Math.log(x) - lgamma(a)) * h;
}

/** Q(a, x) = Gamma(a, x) / Gamma(a). */
export function regularisedUpperGamma(a: number, x: number): number {
  if (!(a > 0) || !(x >= 0)) return Number.NaN;
  if (x === 0) return 1;
  return x < a + 1 ? 1 - lowerSeries(a, x) : upperFraction(a, x);
}

export function chiSquarePValue(chi2: number, dof: number): number {
  return dof > 0 ? regularisedUpperGamma(dof / 2, chi2 / 2) : Number.NaN;
}
