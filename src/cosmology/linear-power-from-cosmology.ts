import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { LogLogSpline } from '../numerics/cubic-spline.js';
import { Background, backgroundOf } from './background.js';
import { baoDampingScales, DEFAULT_BAO_SCALE, DEFAULT_SEPARATION_SCALE } from './bao-damping-scales.js';
import type { CosmologyParameters } from './cosmology-parameters.js';
import { eisensteinHu98, transferEH98, transferNoWiggleEH98 } from './eisenstein-hu-1998.js';
import {
  eisensteinHu99,
  freeStreamingFactor,
  neutrinoGrowthEH99,
  type EisensteinHu99,
  type NeutrinoGrowth,
} from './eisenstein-hu-1999.js';
import { GrowthHistory } from './growth-history.js';
import { NeutrinoSuppressionTable } from './neutrino-suppression-table.js';
import { HUBBLE_DISTANCE_MPC_H, NEUTRINO_EV_PER_OMEGA } from './physical-constants.js';
import { topHatSigma } from './top-hat-variance.js';

export interface LinearPowerOptions {
  /** Log-spaced grid on which the spectra are built and then interpolated. */
  readonly kMin?: number;
  readonly kMax?: number;
  readonly points?: number;
  /** Include photons and massless neutrinos in E(z) (default true). */
  readonly radiation?: boolean;
  /** BAO scale r (Mpc/h) and separation scale k_s (h/Mpc) of the damping integrals. */
  readonly baoScale?: number;
  readonly separationScale?: number;
}

/** Primordial pivot scale of A_s, 1/Mpc. */
const PIVOT_MPC = 0.05;

/**
 * Linear theory of one cosmology at one redshift: the cold (cdm + baryon)
 * spectrum the galaxies trace (the LinearSpectrum contract) and the total
 * matter spectrum, both with their no-wiggle parts.
 *
 * Transfer (docs/conventions.md, "Cosmology"):
 *   T_cb(k, z) = T_EH98(k) * [T_EH99(k; f_nu) / T_EH99(k; 0)] * D_cb(k, z) / D1(z),
 * with T_EH98 the wiggle form (no-wiggle form for P_nw), the EH99 ratio the
 * neutrino suppression at fixed total omega_m, and D_cb / D1 the EH99
 * free-streaming growth; T_m uses D_cbnu. Amplitude (A_s, curvature
 * perturbation; e.g. Komatsu et al. 2009, ApJS 180, 330, eq. 74):
 *   P(k) = (8 pi^2 / 25) A_s (k / k_pivot)^(n_s - 1) k (c/H0)^4 T^2 D^2 / Omega_m^2.
 */
export class CosmologyLinearPower implements LinearSpectrum {
  readonly redshift: number;
  readonly parameters: CosmologyParameters;
  readonly background: Background;
  readonly growth: GrowthHistory;
  readonly kMin: number;
  readonly kMax: number;
  readonly k: Float64Array;
  /** Spectra on the grid `k`: cold field and total matter, with and without wiggles. */
  readonly powerCold: Float64Array;
  readonly powerColdNoWiggle: Float64Array;
  readonly powerMatterGrid: Float64Array;
  readonly powerMatterNoWiggleGrid: Float64Array;
  /** Scale-independent growth D(z) (D / a -> 1 in matter domination) and f(z) of all matter. */
  readonly growthFactor: number;
  readonly growthRateLargeScale: number;
  readonly sigma2BAO: number;
  readonly deltaSigma2BAO: number;
  /** sigma8 of the cold field at this redshift (the contract's sigma8). */
  readonly sigma8: number;
  /** sigma8 of the total matter at this redshift and at z = 0. */
  readonly sigma8Matter: number;
  readonly sigma8MatterToday: number;
  /** ln(10^10 A_s), given or implied by sigma8. */
  readonly lnAs: number;
  /** Sound horizon at the drag epoch (EH98 eq. 6) in Mpc/h. */
  readonly soundHorizonDrag: number;
  private readonly eh99: EisensteinHu99 | undefined;
  private readonly d1: number;
  private readonly coldSpline: LogLogSpline;
  private readonly coldNoWiggleSpline: LogLogSpline;
  /** Built on first use: most callers only need the cold field. */
  private matterSplines: { wiggle: LogLogSpline; noWiggle: LogLogSpline } | undefined;

  constructor(params: CosmologyParameters, redshift: number, options: LinearPowerOptions = {}) {
    if (!(redshift >= 0 && redshift <= 20)) throw new RangeError(`redshift must lie in [0, 20], got ${redshift}`);
    const kMin = options.kMin ?? 1e-5;
    const kMax = options.kMax ?? 100;
    const n = options.points ?? 1000;
    if (!(kMin > 0 && kMax > kMin && n >= 16)) throw new RangeError(`bad k grid: kMin ${kMin}, kMax ${kMax}, points ${n}`);
    this.redshift = redshift;
    this.parameters = params;
    this.kMin = kMin;
    this.kMax = kMax;
    const bg = backgroundOf(params, { radiation: options.radiation });
    this.background = bg;
    this.growth = new GrowthHistory(bg);
    const h = params.h;
    const omegaNu = params.mNu / NEUTRINO_EV_PER_OMEGA;
    const omegaM = params.omegaB + params.omegaCdm + omegaNu;
    const eh98 = eisensteinHu98(h, omegaM, params.omegaB, params.tCmb);
    this.soundHorizonDrag = eh98.soundHorizon * h;
    const massive = params.mNu > 0;
    const eh99 = massive ? eisensteinHu99(h, omegaM, params.omegaB, omegaNu, params.massiveNuCount, params.tCmb) : undefined;
    const eh99NoNu = massive ? eisensteinHu99(h, omegaM, params.omegaB, 0, params.massiveNuCount, params.tCmb) : undefined;
    this.eh99 = eh99;

    const dz = this.growth.factor(redshift);
    const d0 = this.growth.factor(0);
    this.growthFactor = dz;
    this.growthRateLargeScale = this.growth.rate(redshift);
    const zEq1 = 1 + (eh99?.zEq ?? eh98.zEq);
    this.d1 = zEq1 * dz;
    const d1Today = zEq1 * d0;

    const lnK0 = Math.log(kMin);
    const dlnK = Math.log(kMax / kMin) / (n - 1);
    const k = new Float64Array(n);
    const cold = new Float64Array(n);
    const coldNw = new Float64Array(n);
    const matter = new Float64Array(n);
    const matterNw = new Float64Array(n);
    const matterToday = new Float64Array(n);
    const nuTable =
      eh99 && eh99NoNu
        ? new NeutrinoSuppressionTable(eh99, eh99NoNu, lnK0, lnK0 + (n - 1) * dlnK, Math.ceil(n / 8) + 1, this.d1, d1Today)
        : undefined;
    const hubble4 = HUBBLE_DISTANCE_MPC_H ** 4;
    const omegaM0 = omegaM / (h * h);
    const shape = ((8 * Math.PI * Math.PI) / 25) * (hubble4 / (omegaM0 * omegaM0));
    const tilt = params.ns - 1;
    for (let i = 0; i < n; i++) {
      const lnK = lnK0 + i * dlnK;
      const ki = Math.exp(lnK);
      k[i] = ki;
      let ratio = 1;
      let gCold = 1;
      let gTotal = 1;
      let gToday = 1;
      if (nuTable) {
        ratio = nuTable.transferRatio.at(lnK);
        gCold = nuTable.coldGrowth.at(lnK);
        gTotal = nuTable.totalGrowth.at(lnK);
        gToday = nuTable.totalGrowthOther.at(lnK);
      }
      const tw = transferEH98(eh98, ki) * ratio;
      const tnw = transferNoWiggleEH98(eh98, ki) * ratio;
      const prim = shape * ki * Math.exp(tilt * Math.log((ki * h) / PIVOT_MPC));
      const c2 = prim * (gCold * dz) ** 2;
      const m2 = prim * (gTotal * dz) ** 2;
      cold[i] = c2 * tw * tw;
      coldNw[i] = c2 * tnw * tnw;
      matter[i] = m2 * tw * tw;
      matterNw[i] = m2 * tnw * tnw;
      matterToday[i] = prim * (gToday * d0 * tw) ** 2;
    }
    // Amplitude: A_s given, or fixed by sigma8 of the total matter at z = 0.
    const sigma8UnitToday = topHatSigma(lnK0, dlnK, matterToday, 8);
    let amplitude: number;
    if (params.lnAs !== undefined) amplitude = Math.exp(params.lnAs) * 1e-10;
    else amplitude = ((params.sigma8 as number) / sigma8UnitToday) ** 2;
    this.lnAs = Math.log(amplitude * 1e10);
    for (let i = 0; i < n; i++) {
      cold[i] *= amplitude;
      coldNw[i] *= amplitude;
      matter[i] *= amplitude;
      matterNw[i] *= amplitude;
    }
    const rootA = Math.sqrt(amplitude);
    this.sigma8MatterToday = sigma8UnitToday * rootA;
    this.sigma8 = topHatSigma(lnK0, dlnK, cold, 8);
    this.sigma8Matter = massive ? topHatSigma(lnK0, dlnK, matter, 8) : this.sigma8;
    this.k = k;
    this.powerCold = cold;
    this.powerColdNoWiggle = coldNw;
    this.powerMatterGrid = matter;
    this.powerMatterNoWiggleGrid = matterNw;
    const coldSpline = new LogLogSpline(k, cold);
    const coldNwSpline = new LogLogSpline(k, coldNw);
    this.coldSpline = coldSpline;
    this.coldNoWiggleSpline = coldNwSpline;
    if (!massive) this.matterSplines = { wiggle: coldSpline, noWiggle: coldNwSpline };
    const damping = baoDampingScales(
      (q) => coldNwSpline.at(q),
      options.baoScale ?? DEFAULT_BAO_SCALE,
      options.separationScale ?? DEFAULT_SEPARATION_SCALE,
    );
    this.sigma2BAO = damping.sigma2;
    this.deltaSigma2BAO = damping.deltaSigma2;
  }

  /** Linear power of the cold (cdm + baryon) field, (Mpc/h)^3. */
  power(k: number): number {
    return this.coldSpline.at(k);
  }

  powerNoWiggle(k: number): number {
    return this.coldNoWiggleSpline.at(k);
  }

  private matter(): { wiggle: LogLogSpline; noWiggle: LogLogSpline } {
    this.matterSplines ??= {
      wiggle: new LogLogSpline(this.k, this.powerMatterGrid),
      noWiggle: new LogLogSpline(this.k, this.powerMatterNoWiggleGrid),
    };
    return this.matterSplines;
  }

  /** Linear power of the total matter (cold + neutrinos). */
  powerMatter(k: number): number {
    return this.matter().wiggle.at(k);
  }

  powerMatterNoWiggle(k: number): number {
    return this.matter().noWiggle.at(k);
  }

  private neutrinoGrowthAt(k: number): NeutrinoGrowth | undefined {
    if (!this.eh99) return undefined;
    const out: NeutrinoGrowth = { cold: 1, total: 1, coldRate: 1, totalRate: 1 };
    return neutrinoGrowthEH99(this.eh99, freeStreamingFactor(this.eh99, k), this.d1, out);
  }

  /** Growth rate f(k) of the cold field (EH99 growth differentiated in ln a). */
  growthRate(k: number): number {
    return this.growthRateLargeScale * (this.neutrinoGrowthAt(k)?.coldRate ?? 1);
  }

  /** Growth rate f(k) of the total matter. */
  growthRateMatter(k: number): number {
    return this.growthRateLargeScale * (this.neutrinoGrowthAt(k)?.totalRate ?? 1);
  }

  /** Scale-dependent growth factors D_cb(k, z) and D_m(k, z) (-> D(z) as k -> 0). */
  growthFactorCold(k: number): number {
    return this.growthFactor * (this.neutrinoGrowthAt(k)?.cold ?? 1);
  }

  growthFactorMatter(k: number): number {
    return this.growthFactor * (this.neutrinoGrowthAt(k)?.total ?? 1);
  }

  /** sigma(R) of the cold field at this redshift, R in Mpc/h. */
  sigmaR(radius: number): number {
    return topHatSigma(Math.log(this.kMin), Math.log(this.kMax / this.kMin) / (this.k.length - 1), this.powerCold, radius);
  }

  /** sigma(R) of the total matter at this redshift. */
  sigmaRMatter(radius: number): number {
    return topHatSigma(Math.log(this.kMin), Math.log(this.kMax / this.kMin) / (this.k.length - 1), this.powerMatterGrid, radius);
  }
}

/** Entry point: the linear spectra of a cosmology at one redshift. */
export function linearPowerFromCosmology(
  params: CosmologyParameters,
  redshift: number,
  options: LinearPowerOptions = {},
): CosmologyLinearPower {
  return new CosmologyLinearPower(params, redshift, options);
}
