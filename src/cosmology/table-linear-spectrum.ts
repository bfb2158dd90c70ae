import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { LogLogSpline } from '../numerics/cubic-spline.js';
import { baoDampingScales, DEFAULT_BAO_SCALE, DEFAULT_SEPARATION_SCALE } from './bao-damping-scales.js';
import type { CosmologyParameters } from './cosmology-parameters.js';
import { linearPowerFromCosmology, type CosmologyLinearPower } from './linear-power-from-cosmology.js';
import type { PowerTable } from './power-table.js';
import { topHatSigma } from './top-hat-variance.js';
import { DEFAULT_SMOOTHING_WIDTH_DEX, noWiggleByLogGaussianFilter } from './wiggle-split.js';

export interface TableSpectrumOptions {
  readonly baoScale?: number;
  readonly separationScale?: number;
  /** Width in log10 k of the Gaussian used by the wiggle split. */
  readonly smoothingWidthDex?: number;
  /** Warn when asked for k beyond this factor outside the table (default 1.5). */
  readonly farFactor?: number;
  /** Receives extrapolation warnings (default: process.emitWarning). */
  readonly onWarning?: (message: string) => void;
}

function defaultWarning(message: string): void {
  process.emitWarning(message, 'TrebleExtrapolationWarning');
}

/**
 * A LinearSpectrum from a user table of the cold-field linear power at one
 * redshift. Log-log cubic-spline interpolation inside the table; outside it a
 * power law with the end logarithmic slope, and a warning (once per end) when
 * asked more than `farFactor` beyond an end. The cosmology supplies the growth
 * rate f(k) (ODE growth with the EH99 neutrino scale dependence) and the smooth
 * EH98 reference of the wiggle split.
 */
export class TableLinearSpectrum implements LinearSpectrum {
  readonly redshift: number;
  readonly kMin: number;
  readonly kMax: number;
  readonly table: PowerTable;
  /** P_nw at the table wavenumbers. */
  readonly noWiggleAtRows: Float64Array;
  readonly growthRateLargeScale: number;
  readonly sigma2BAO: number;
  readonly deltaSigma2BAO: number;
  readonly sigma8: number;
  /** The cosmology's own EH spectrum at the same redshift (growth and split reference). */
  readonly reference: CosmologyLinearPower;
  private readonly spline: LogLogSpline;
  private readonly noWiggleSpline: LogLogSpline;
  private readonly farFactor: number;
  private readonly warn: (message: string) => void;
  private warnedLow = false;
  private warnedHigh = false;

  constructor(table: PowerTable, params: CosmologyParameters, redshift: number, options: TableSpectrumOptions = {}) {
    this.table = table;
    this.redshift = redshift;
    this.kMin = table.k[0];
    this.kMax = table.k[table.k.length - 1];
    this.farFactor = options.farFactor ?? 1.5;
    this.warn = options.onWarning ?? defaultWarning;
    this.reference = linearPowerFromCosmology(params, redshift);
    this.growthRateLargeScale = this.reference.growthRateLargeScale;
    this.spline = new LogLogSpline(table.k, table.p);
    const ref = this.reference;
    this.noWiggleAtRows = noWiggleByLogGaussianFilter(
      table.k,
      table.p,
      (k) => ref.powerNoWiggle(k),
      options.smoothingWidthDex ?? DEFAULT_SMOOTHING_WIDTH_DEX,
    );
    this.noWiggleSpline = new LogLogSpline(table.k, this.noWiggleAtRows);
    // sigma8 over [1e-4, 50] h/Mpc at least, extrapolating silently where the table is narrower.
    const lo = Math.log(Math.min(this.kMin, 1e-4));
    const hi = Math.log(Math.max(this.kMax, 50));
    const m = 1001;
    const dlnK = (hi - lo) / (m - 1);
    const grid = new Float64Array(m);
    for (let i = 0; i < m; i++) grid[i] = this.spline.at(Math.exp(lo + i * dlnK));
    this.sigma8 = topHatSigma(lo, dlnK, grid, 8);
    const damping = baoDampingScales(
      (q) => this.noWiggleSpline.at(q),
      options.baoScale ?? DEFAULT_BAO_SCALE,
      options.separationScale ?? DEFAULT_SEPARATION_SCALE,
    );
    this.sigma2BAO = damping.sigma2;
    this.deltaSigma2BAO = damping.deltaSigma2;
  }

  private checkRange(k: number): void {
    if (k < this.kMin / this.farFactor && !this.warnedLow) {
      this.warnedLow = true;
      this.warn(`${this.table.source}: k = ${k} h/Mpc is far below the table (kMin = ${this.kMin}); extrapolating as a power law`);
    } else if (k > this.kMax * this.farFactor && !this.warnedHigh) {
      this.warnedHigh = true;
      this.warn(`${this.table.source}: k = ${k} h/Mpc is far above the table (kMax = ${this.kMax}); extrapolating as a power law`);
    }
  }

  power(k: number): number {
    if (k < this.kMin || k > this.kMax) this.checkRange(k);
    return this.spline.at(k);
  }

  powerNoWiggle(k: number): number {
    if (k < this.kMin || k > this.kMax) this.checkRange(k);
    return this.noWiggleSpline.at(k);
  }

  growthRate(k: number): number {
    return this.reference.growthRate(k);
  }
}

/** Entry point: a LinearSpectrum from a user table plus the cosmology that made it. */
export function linearSpectrumFromTable(
  table: PowerTable,
  params: CosmologyParameters,
  redshift: number,
  options: TableSpectrumOptions = {},
): TableLinearSpectrum {
  return new TableLinearSpectrum(table, params, redshift, options);
}
