/**
 * Eisenstein & Hu 1999 (ApJ 511, 5): smooth transfer function and
 * scale-dependent growth with massive neutrinos. Equation numbers are those of
 * the paper (written down from memory of its sec. 2–3; the small-scale
 * suppression is checked against -8 f_nu in tests/cosmology).
 * Wavenumbers are taken in h/Mpc.
 */
export interface EisensteinHu99 {
  readonly h: number;
  readonly omegaM: number;
  readonly fNu: number;
  readonly fCb: number;
  readonly nNu: number;
  readonly zEq: number;
  readonly pCb: number;
  readonly sqrtAlphaNu: number;
  readonly betaC: number;
  readonly soundHorizonFit: number;
  readonly theta2: number;
  /** k-independent factors of eqs. 14, 22, 23 and 13. */
  readonly yFsPerK2: number;
  readonly qNuPerK: number;
  readonly bAmplitude: number;
  readonly fCbPow: number;
}

/** omega_m includes the neutrinos; nNu degenerate massive species share omega_nu. */
export function eisensteinHu99(
  h: number,
  omegaM: number,
  omegaB: number,
  omegaNu: number,
  nNu: number,
  tCmb: number,
): EisensteinHu99 {
  const theta = tCmb / 2.7;
  const theta2 = theta * theta;
  const fNu = omegaNu / omegaM;
  const fb = omegaB / omegaM;
  const fc = 1 - fNu - fb;
  const fCb = fc + fb;
  const fNuB = fNu + fb;
  const zEq = (2.5e4 * omegaM) / (theta2 * theta2); // eq. 1
  const b1 = 0.313 * omegaM ** -0.419 * (1 + 0.607 * omegaM ** 0.674); // eq. 2
  const b2 = 0.238 * omegaM ** 0.223;
  const zDrag = ((1291 * omegaM ** 0.251) / (1 + 0.659 * omegaM ** 0.828)) * (1 + b1 * omegaB ** b2);
  const yDrag = (1 + zEq) / (1 + zDrag); // eq. 3
  const pC = (5 - Math.sqrt(1 + 24 * fc)) / 4; // eq. 11
  const pCb = (5 - Math.sqrt(1 + 24 * fCb)) / 4;
  const alphaNu =
    (fc / fCb) *
    ((5 - 2 * (pC + pCb)) / (5 - 4 * pCb)) *
    ((1 - 0.553 * fNuB + 0.126 * fNuB ** 3) / (1 - 0.193 * Math.sqrt(fNu * nNu) + 0.169 * fNu * nNu ** 0.2)) *
    (1 + yDrag) ** (pCb - pC) *
    (1 + ((pC - pCb) / 2) * (1 + 1 / ((3 - 4 * pC) * (7 - 4 * pCb))) / (1 + yDrag)); // eq. 15
  return {
    h, omegaM, fNu, fCb, nNu, zEq, pCb,
    sqrtAlphaNu: Math.sqrt(alphaNu),
    betaC: 1 / (1 - 0.949 * fNuB), // eq. 21
    soundHorizonFit: (44.5 * Math.log(9.83 / omegaM)) / Math.sqrt(1 + 10 * omegaB ** 0.75), // eq. 4
    theta2,
    yFsPerK2: fNu > 0 ? 17.2 * fNu * (1 + 0.488 * fNu ** (-7 / 6)) * ((nNu * h * theta2) / (omegaM * fNu)) ** 2 : 0, // eq. 14 over k^2
    qNuPerK: fNu > 0 ? (3.92 * h * theta2 * Math.sqrt(nNu / fNu)) / omegaM : 0, // eq. 23 over k
    bAmplitude: 1.24 * fNu ** 0.64 * nNu ** (0.3 + 0.6 * fNu), // eq. 22
    fCbPow: pCb > 0 ? fCb ** (0.7 / pCb) : 1,
  };
}

/** Master transfer function T_master = T_sup B (eqs. 16–24); k in h/Mpc. */
export function masterTransferEH99(p: EisensteinHu99, kH: number): number {
  const k = kH * p.h; // 1/Mpc
  const ks = 0.43 * k * p.soundHorizonFit;
  const gammaEff = p.omegaM * (p.sqrtAlphaNu + (1 - p.sqrtAlphaNu) / (1 + ks * ks * ks * ks)); // eq. 16
  const qEff = (k * p.theta2) / gammaEff; // eq. 17
  const l = Math.log(Math.E + 1.84 * p.betaC * p.sqrtAlphaNu * qEff); // eq. 19
  const c = 14.4 + 325 / (1 + 60.5 * qEff ** 1.08); // eq. 20
  const tSup = l / (l + c * qEff * qEff); // eq. 18
  if (p.fNu === 0) return tSup;
  const qNu = p.qNuPerK * kH;
  const q08 = qNu ** 0.8;
  return tSup * (1 + p.bAmplitude / (1 / (q08 * q08) + q08)); // eqs. 22, 24
}

/**
 * Free-streaming growth suppression of eqs. 12–14. With D1 the growth of a
 * universe in which all matter clusters, normalised to D1 = (1 + z_eq) a early
 * on, returns for one k the ratios D_cb / D1 and D_cbnu / D1 and the factors
 * dlnD/dlnD1 of both fields (multiply by f1 = dlnD1/dlna for the growth rates).
 */
export interface NeutrinoGrowth {
  cold: number;
  total: number;
  coldRate: number;
  totalRate: number;
}

/** y_fs(k) of eq. 14. */
export function freeStreamingFactor(p: EisensteinHu99, kH: number): number {
  return p.yFsPerK2 * kH * kH;
}

export function neutrinoGrowthEH99(p: EisensteinHu99, yFs: number, d1: number, out: NeutrinoGrowth): NeutrinoGrowth {
  const pc = p.pCb;
  const x07 = (d1 / (1 + yFs)) ** 0.7;
  const coldBase = 1 + x07;
  const totalBase = p.fCbPow + x07;
  const d1Pow = d1 ** -pc;
  out.cold = coldBase ** (pc / 0.7) * d1Pow; // eq. 12 divided by D1
  out.total = totalBase ** (pc / 0.7) * d1Pow; // eq. 13 divided by D1
  out.coldRate = 1 - pc / coldBase;
  out.totalRate = 1 - pc + (pc * x07) / totalBase;
  return out;
}
