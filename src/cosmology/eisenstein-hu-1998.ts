/**
 * Eisenstein & Hu 1998 (ApJ 496, 605) fitting formulae for the matter transfer
 * function of cold dark matter plus baryons, with the acoustic wiggles
 * (eqs. 16–24) and in the smooth "no-wiggle" form (eqs. 28–31). Wavenumbers
 * are taken in h/Mpc and converted to 1/Mpc, the unit of the paper.
 */
export interface EisensteinHu98 {
  readonly h: number;
  readonly omegaM: number;
  readonly omegaB: number;
  /** Sound horizon at the drag epoch from eq. 6, Mpc. */
  readonly soundHorizon: number;
  /** Fitted sound horizon of eq. 26, Mpc (used by the no-wiggle form). */
  readonly soundHorizonFit: number;
  readonly kEq: number;
  readonly zEq: number;
  readonly zDrag: number;
  readonly kSilk: number;
  readonly alphaC: number;
  readonly betaC: number;
  readonly alphaB: number;
  readonly betaB: number;
  readonly betaNode: number;
  readonly fb: number;
  readonly fc: number;
  readonly alphaGamma: number;
  readonly theta2: number;
}

/** Eq. 26: s ~ 44.5 ln(9.83 / omega_m) / sqrt(1 + 10 omega_b^(3/4)) Mpc. */
export function soundHorizonFitEH98(omegaM: number, omegaB: number): number {
  return (44.5 * Math.log(9.83 / omegaM)) / Math.sqrt(1 + 10 * omegaB ** 0.75);
}

/** Precompute the k-independent pieces for omega_m = Omega_m h^2, omega_b = Omega_b h^2. */
export function eisensteinHu98(h: number, omegaM: number, omegaB: number, tCmb: number): EisensteinHu98 {
  const theta = tCmb / 2.7;
  const theta2 = theta * theta;
  const fb = omegaB / omegaM;
  const fc = 1 - fb;
  const zEq = 2.5e4 * omegaM / (theta2 * theta2); // eq. 2
  const kEq = 7.46e-2 * omegaM / theta2; // eq. 3, 1/Mpc
  const b1 = 0.313 * omegaM ** -0.419 * (1 + 0.607 * omegaM ** 0.674); // eq. 4
  const b2 = 0.238 * omegaM ** 0.223;
  const zDrag = ((1291 * omegaM ** 0.251) / (1 + 0.659 * omegaM ** 0.828)) * (1 + b1 * omegaB ** b2);
  const baryonRatio = (z: number) => (31.5 * omegaB) / (theta2 * theta2) / (z / 1e3); // eq. 5
  const rEq = baryonRatio(zEq);
  const rDrag = baryonRatio(zDrag);
  const soundHorizon =
    (2 / (3 * kEq)) * Math.sqrt(6 / rEq) * Math.log((Math.sqrt(1 + rDrag) + Math.sqrt(rDrag + rEq)) / (1 + Math.sqrt(rEq))); // eq. 6
  const kSilk = 1.6 * omegaB ** 0.52 * omegaM ** 0.73 * (1 + (10.4 * omegaM) ** -0.95); // eq. 7
  const a1 = (46.9 * omegaM) ** 0.67 * (1 + (32.1 * omegaM) ** -0.532); // eq. 11
  const a2 = (12.0 * omegaM) ** 0.424 * (1 + (45.0 * omegaM) ** -0.582);
  const alphaC = a1 ** -fb * a2 ** -(fb * fb * fb);
  const bb1 = 0.944 / (1 + (458 * omegaM) ** -0.708); // eq. 12
  const bb2 = (0.395 * omegaM) ** -0.0266;
  const betaC = 1 / (1 + bb1 * (fc ** bb2 - 1));
  const y = (1 + zEq) / (1 + zDrag);
  const sq = Math.sqrt(1 + y);
  const gFun = y * (-6 * sq + (2 + 3 * y) * Math.log((sq + 1) / (sq - 1))); // eq. 15
  const alphaB = 2.07 * kEq * soundHorizon * (1 + rDrag) ** -0.75 * gFun; // eq. 14
  const betaB = 0.5 + fb + (3 - 2 * fb) * Math.sqrt((17.2 * omegaM) ** 2 + 1); // eq. 24
  const betaNode = 8.41 * omegaM ** 0.435; // eq. 23
  const alphaGamma = 1 - 0.328 * Math.log(431 * omegaM) * fb + 0.38 * Math.log(22.3 * omegaM) * fb * fb; // eq. 31
  return {
    h, omegaM, omegaB, soundHorizon, soundHorizonFit: soundHorizonFitEH98(omegaM, omegaB),
    kEq, zEq, zDrag, kSilk, alphaC, betaC, alphaB, betaB, betaNode, fb, fc, alphaGamma, theta2,
  };
}

/** Eqs. 19–20: T0(k; alpha, beta) = L / (L + C q^2), given q^2 and the alpha-free part 386 / (1 + 69.9 q^1.08) of C. */
function pressurelessTransfer(q: number, q2: number, cTail: number, alpha: number, beta: number): number {
  const l = Math.log(Math.E + 1.8 * beta * q);
  return l / (l + (14.2 / alpha + cTail) * q2);
}

/** Full transfer function with baryon acoustic oscillations, eqs. 16–24; k in h/Mpc. */
export function transferEH98(p: EisensteinHu98, kH: number): number {
  const k = kH * p.h;
  const q = k / (13.41 * p.kEq); // eq. 10
  const q2 = q * q;
  const cTail = 386 / (1 + 69.9 * q ** 1.08); // eq. 20
  const ks = k * p.soundHorizon;
  const r = ks / 5.4;
  const r2 = r * r;
  const f = 1 / (1 + r2 * r2); // eq. 18
  const tc = f * pressurelessTransfer(q, q2, cTail, 1, p.betaC) + (1 - f) * pressurelessTransfer(q, q2, cTail, p.alphaC, p.betaC); // eq. 17
  const node = p.betaNode / ks;
  const sTilde = p.soundHorizon / Math.cbrt(1 + node * node * node); // eq. 22
  const x = k * sTilde;
  const j0 = x < 1e-4 ? 1 - (x * x) / 6 : Math.sin(x) / x;
  const b = p.betaB / ks;
  const u = ks / 5.2;
  const tb =
    (pressurelessTransfer(q, q2, cTail, 1, 1) / (1 + u * u) +
      (p.alphaB / (1 + b * b * b)) * Math.exp(-((k / p.kSilk) ** 1.4))) *
    j0; // eq. 21
  return p.fb * tb + p.fc * tc; // eq. 16
}

/** Smooth transfer function without acoustic oscillations, eqs. 28–31; k in h/Mpc. */
export function transferNoWiggleEH98(p: EisensteinHu98, kH: number): number {
  const k = kH * p.h;
  const ks = 0.43 * k * p.soundHorizonFit;
  const gammaEff = (p.omegaM / p.h) * (p.alphaGamma + (1 - p.alphaGamma) / (1 + ks * ks * ks * ks)); // eq. 30, Omega_m h
  const q = (kH * p.theta2) / gammaEff; // eq. 28
  const l0 = Math.log(2 * Math.E + 1.8 * q); // eq. 29
  const c0 = 14.2 + 731 / (1 + 62.5 * q);
  return l0 / (l0 + c0 * q * q);
}
