import { withPowerOf, type LinearSpectrum } from '../contracts/linear-spectrum.js';
import { angleAveragedBaoDamping } from './ir-resummed-power.js';

/**
 * A linear spectrum whose wiggles carry the line-of-sight average of the
 * leading-order IR damping, P_nw(k) + D(k) P_w(k) with
 * D(k) = int_0^1 exp(-k^2 Sigma_tot^2(mu)) dmu (ir-resummed-power.ts; `f` is
 * the growth rate inside Sigma_tot^2). Used without further resummation it
 * gives the bispectrum with angle-averaged BAO damping: every P is then
 * independent of its angle to the line of sight, so the model is a polynomial
 * in the cosines. This is an approximation to the per-leg damping
 * exp(-k^2 Sigma_tot^2(mu_i)) (docs/bispectrum-convergence.md gives its size);
 * the wiggle-free part is untouched.
 */
export function angleAveragedIrSpectrum(source: LinearSpectrum, f: number): LinearSpectrum {
  return withPowerOf(
    source,
    (k) => {
      const nw = source.powerNoWiggle(k);
      return nw + angleAveragedBaoDamping(source, f, k) * (source.power(k) - nw);
    },
    (k) => source.powerNoWiggle(k),
  );
}
