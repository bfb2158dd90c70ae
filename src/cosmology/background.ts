import { gaussLegendre } from '../numerics/gauss-legendre.js';
import type { CosmologyParameters } from './cosmology-parameters.js';
import { NONRELATIVISTIC_SLOPE, thermalNeutrinoClustering, thermalNeutrinoEnergy } from './neutrino-thermal-density.js';
import {
  HUBBLE_DISTANCE_MPC_H,
  NEUTRINO_EV_PER_OMEGA,
  masslessNeutrinoRatio,
  photonDensity,
} from './physical-constants.js';

/**
 * Physical densities (omega = Omega h^2) of a flat background. Dark energy
 * fills the rest: omegaDarkEnergy = h^2 - radiation - matter.
 */
export interface BackgroundDensities {
  readonly h: number;
  /** Photons plus the massless neutrino species, scaling as a^-4. */
  readonly omegaRadiation: number;
  /** Baryons plus cold dark matter. */
  readonly omegaCold: number;
  /** Massive neutrinos in the non-relativistic limit, sum m_nu / 93.14 eV. */
  readonly omegaNu: number;
  readonly w0: number;
  readonly wa: number;
  /**
   * Thermal history of the massive species: `count` degenerate species, each
   * with density `relativisticDensityPerSpecies` (omega) while relativistic.
   * Without it the massive neutrinos are pure matter (a^-3) at all times.
   */
  readonly massiveNu?: { readonly count: number; readonly relativisticDensityPerSpecies: number };
}

/** Background densities of the parameters; `radiation: false` drops photons and massless neutrinos. */
export function backgroundDensities(p: CosmologyParameters, options: { radiation?: boolean } = {}): BackgroundDensities {
  const massless = p.mNu > 0 ? 3 - p.massiveNuCount : 3;
  const radiation = options.radiation !== false;
  const perSpecies = photonDensity(p.tCmb) * masslessNeutrinoRatio(p.nEff);
  const base = {
    h: p.h,
    omegaRadiation: radiation ? photonDensity(p.tCmb) + perSpecies * massless : 0,
    omegaCold: p.omegaB + p.omegaCdm,
    omegaNu: p.mNu / NEUTRINO_EV_PER_OMEGA,
    w0: p.w0,
    wa: p.wa,
  };
  return radiation && p.mNu > 0
    ? { ...base, massiveNu: { count: p.massiveNuCount, relativisticDensityPerSpecies: perSpecies } }
    : base;
}

const distanceRule = gaussLegendre(16);

/**
 * Expansion history of a flat universe: E(z) = H(z)/H0 with radiation, matter
 * (cold + massive neutrinos) and dark energy w(a) = w0 + wa (1 - a)
 * (Chevallier & Polarski 2001; Linder 2003).
 */
export class Background {
  readonly h: number;
  /** Density parameters today (Omega, not omega). Radiation: photons and massless neutrinos. */
  readonly omegaRadiation0: number;
  /** Cold matter plus the massive neutrinos today. */
  readonly omegaMatter0: number;
  readonly omegaCold0: number;
  readonly omegaNu0: number;
  readonly omegaDarkEnergy0: number;
  readonly w0: number;
  readonly wa: number;
  private readonly constantW: boolean;
  /** Thermal neutrinos: Omega of all massive species while relativistic, and y = m / T_nu at a = 1. */
  private readonly nuRelativistic: number;
  private readonly nuMassOverTemperature: number;
  /** Massive neutrinos as pure matter (no thermal history). */
  private readonly nuAsMatter: number;

  constructor(d: BackgroundDensities) {
    const h2 = d.h * d.h;
    this.h = d.h;
    this.omegaRadiation0 = d.omegaRadiation / h2;
    this.omegaCold0 = d.omegaCold / h2;
    if (d.massiveNu && d.omegaNu > 0) {
      // G(y) -> NONRELATIVISTIC_SLOPE y fixes y so that the late-time density is omega_nu = sum m / 93.14 eV.
      const perSpecies = d.massiveNu.relativisticDensityPerSpecies;
      this.nuRelativistic = (d.massiveNu.count * perSpecies) / h2;
      this.nuMassOverTemperature = d.omegaNu / (d.massiveNu.count * perSpecies * NONRELATIVISTIC_SLOPE);
      this.nuAsMatter = 0;
      this.omegaNu0 = this.nuRelativistic * thermalNeutrinoEnergy(this.nuMassOverTemperature);
    } else {
      this.nuRelativistic = 0;
      this.nuMassOverTemperature = 0;
      this.nuAsMatter = d.omegaNu / h2;
      this.omegaNu0 = this.nuAsMatter;
    }
    this.omegaMatter0 = this.omegaCold0 + this.omegaNu0;
    this.omegaDarkEnergy0 = 1 - this.omegaRadiation0 - this.omegaMatter0;
    this.w0 = d.w0;
    this.wa = d.wa;
    this.constantW = d.wa === 0;
  }

  /** Massive-neutrino energy density in units of the critical density today. */
  private neutrinoEnergy(a: number, ia4: number): number {
    if (this.nuRelativistic === 0) return this.nuAsMatter * ia4 * a;
    return this.nuRelativistic * ia4 * thermalNeutrinoEnergy(this.nuMassOverTemperature * a);
  }

  /** (rho - 3p) of the massive neutrinos, the part that clusters like matter. */
  private neutrinoClustering(a: number, ia4: number): number {
    if (this.nuRelativistic === 0) return this.nuAsMatter * ia4 * a;
    return this.nuRelativistic * ia4 * thermalNeutrinoClustering(this.nuMassOverTemperature * a);
  }

  /** Ratio of the early-time radiation (photons, all neutrinos) to the cold matter: a_eq of the growth initial condition. */
  get equalityScaleFactor(): number {
    return (this.omegaRadiation0 + this.nuRelativistic) / (this.omegaCold0 + this.nuAsMatter);
  }

  /** rho_DE(a) / rho_DE(1) for w(a) = w0 + wa (1 - a). */
  darkEnergyScaling(a: number): number {
    if (this.constantW) return this.w0 === -1 ? 1 : a ** (-3 * (1 + this.w0));
    return a ** (-3 * (1 + this.w0 + this.wa)) * Math.exp(-3 * this.wa * (1 - a));
  }

  /** E^2(a) = H^2 / H0^2. */
  e2(a: number): number {
    const ia = 1 / a;
    const ia3 = ia * ia * ia;
    return (
      this.omegaRadiation0 * ia3 * ia +
      this.omegaCold0 * ia3 +
      this.neutrinoEnergy(a, ia3 * ia) +
      this.omegaDarkEnergy0 * this.darkEnergyScaling(a)
    );
  }

  /** E(z) = H(z) / H0. */
  e(z: number): number {
    return Math.sqrt(this.e2(1 / (1 + z)));
  }

  /** H(z) in km/s/Mpc. */
  hubble(z: number): number {
    return 100 * this.h * this.e(z);
  }

  /** d ln E / d ln a at scale factor a; the neutrinos obey d rho / d ln a = -3 (rho + p) = -4 rho + (rho - 3p). */
  dlnEdlna(a: number): number {
    return this.growthCoefficients(a).dlnEdlna;
  }

  /** Fraction of the critical density at a that clusters like matter: cold matter plus (rho - 3p) of the neutrinos. */
  clusteringFraction(a: number): number {
    return this.growthCoefficients(a).clusteringFraction;
  }

  /** Both coefficients of the growth equation at a, sharing one evaluation of the neutrino densities. */
  growthCoefficients(a: number): { dlnEdlna: number; clusteringFraction: number } {
    const ia = 1 / a;
    const ia3 = ia * ia * ia;
    const r = this.omegaRadiation0 * ia3 * ia;
    const c = this.omegaCold0 * ia3;
    const nu = this.neutrinoEnergy(a, ia3 * ia);
    const nuCl = this.neutrinoClustering(a, ia3 * ia);
    const w = this.w0 + this.wa * (1 - a);
    const de = this.omegaDarkEnergy0 * this.darkEnergyScaling(a);
    const e2 = r + c + nu + de;
    return {
      dlnEdlna: (-4 * r - 3 * c - 4 * nu + nuCl - 3 * (1 + w) * de) / (2 * e2),
      clusteringFraction: (c + nuCl) / e2,
    };
  }

  /** Matter density parameter Omega_m(z): cold matter plus the massive neutrinos' energy density. */
  omegaMatterAt(z: number): number {
    const a = 1 / (1 + z);
    const ia = 1 / a;
    const ia3 = ia * ia * ia;
    return (this.omegaCold0 * ia3 + this.neutrinoEnergy(a, ia3 * ia)) / this.e2(a);
  }

  /**
   * Comoving distance chi(z) = (c/H0) int_0^z dz'/E(z') in Mpc/h, integrated in
   * x = ln(1+z) by composite 16-point Gauss–Legendre on panels of width <= 0.25.
   */
  comovingDistance(z: number): number {
    if (z === 0) return 0;
    const xEnd = Math.log1p(z);
    const panels = Math.max(1, Math.ceil(Math.abs(xEnd) / 0.25));
    const width = xEnd / panels;
    let sum = 0;
    for (let p = 0; p < panels; p++) {
      const mid = (p + 0.5) * width;
      for (let i = 0; i < distanceRule.nodes.length; i++) {
        const x = mid + 0.5 * width * distanceRule.nodes[i];
        const onePlusZ = Math.exp(x);
        sum += distanceRule.weights[i] * (onePlusZ / Math.sqrt(this.e2(1 / onePlusZ)));
      }
    }
    return HUBBLE_DISTANCE_MPC_H * 0.5 * width * sum;
  }

  /** Transverse comoving distance D_M(z) in Mpc/h (flat: equal to chi). */
  transverseDistance(z: number): number {
    return this.comovingDistance(z);
  }

  /** Angular-diameter distance D_A = D_M / (1 + z) in Mpc/h. */
  angularDiameterDistance(z: number): number {
    return this.comovingDistance(z) / (1 + z);
  }
}

export function backgroundOf(p: CosmologyParameters, options: { radiation?: boolean } = {}): Background {
  return new Background(backgroundDensities(p, options));
}
