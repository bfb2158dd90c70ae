import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { gaussLegendre } from '../numerics/gauss-legendre.js';

/**
 * Leading-order IR resummation of the BAO wiggles in redshift space:
 *   P_IR(k, mu) = P_nw(k) + exp(-k^2 Sigma_tot^2(mu)) P_w(k),
 *   Sigma_tot^2(mu) = [1 + f mu^2 (2 + f)] Sigma^2 + f^2 mu^2 (mu^2 - 1) delta Sigma^2
 * (JCAP 07 (2018) 053, eqs. for the LO resummed spectrum; PRD 92 (2015) 043514;
 * JCAP 07 (2016) 028). Sigma^2 and delta Sigma^2 come with the spectrum.
 */
export function baoDampingSigma2(spectrum: LinearSpectrum, f: number, mu: number): number {
  const mu2 = mu * mu;
  return (1 + f * mu2 * (2 + f)) * spectrum.sigma2BAO + f * f * mu2 * (mu2 - 1) * spectrum.deltaSigma2BAO;
}

export function irResummedPower(spectrum: LinearSpectrum, k: number, mu: number, f: number): number {
  const pnw = spectrum.powerNoWiggle(k);
  const pw = spectrum.power(k) - pnw;
  return pnw + Math.exp(-k * k * baoDampingSigma2(spectrum, f, mu)) * pw;
}

/**
 * The orientation average of the BAO damping factor,
 *   D(k) = int_0^1 exp(-k^2 Sigma_tot^2(mu)) dmu,
 * by a 24-point Gauss–Legendre rule on [0, 1] (the integrand is an entire
 * function of mu; for k^2 Sigma_tot^2 <= 20 it agrees with composite Simpson to 1e-13,
 * tests/perturbation/ir-resummed-power.test.ts). P_nw + D(k) P_w is the
 * IR-resummed spectrum with the damping averaged over the line of sight.
 */
const AVERAGE_NODES = 24;

export function angleAveragedBaoDamping(spectrum: LinearSpectrum, f: number, k: number): number {
  const rule = gaussLegendre(AVERAGE_NODES);
  let sum = 0;
  for (let i = 0; i < AVERAGE_NODES; i++) {
    const mu = 0.5 * (1 + rule.nodes[i]);
    sum += 0.5 * rule.weights[i] * Math.exp(-k * k * baoDampingSigma2(spectrum, f, mu));
  }
  return sum;
}
