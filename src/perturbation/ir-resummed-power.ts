import type { LinearSpectrum } from '../contracts/linear-spectrum.js';

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
