import { InputErrors } from '../../contracts/input-error.js';
import type { Background } from '../../cosmology/background.js';
import { GrowthHistory } from '../../cosmology/growth-history.js';

/**
 * A survey for a forecast: redshift bins, each with a comoving volume (given,
 * or from a sky area and the bin's redshift range through the fiducial
 * background) and a mean number density; fiducial bias per bin, with defaults:
 *   b1  = 0.84 D(0)/D(z)  — an emission-line-galaxy-like evolution
 *         (DESI Collaboration 2016, arXiv:1611.00036, sec. 2.4; from memory);
 *   b2  = 0.412 - 2.143 b1 + 0.929 b1^2 + 0.008 b1^3 — the separate-universe fit
 *         of Lazeyras et al. 2016, JCAP 02, 018, eq. 5.2 (from memory), in the
 *         delta_g ⊃ (b2/2) delta^2 convention of docs/conventions.md;
 *   bG2 = -2/7 (b1 - 1) — local Lagrangian bias (common practice; Baldauf et al.
 *         2012, PRD 86, 083540).
 * The effective redshift of a bin is the middle of its range.
 */
export interface SurveyBinSpec {
  readonly zMin: number;
  readonly zMax: number;
  /** (h/Mpc)^3. */
  readonly nbar: number;
  /** (Mpc/h)^3; overrides the sky-area volume. */
  readonly volume?: number;
  readonly b1?: number;
  readonly b2?: number;
  readonly bG2?: number;
}

export interface SurveySpec {
  readonly name?: string;
  /** Square degrees; needed for bins without a volume. */
  readonly skyArea?: number;
  readonly bins: readonly SurveyBinSpec[];
}

export interface SurveyBin {
  readonly zMin: number;
  readonly zMax: number;
  readonly zEff: number;
  readonly volume: number;
  readonly nbar: number;
  readonly bias: { readonly b1: number; readonly b2: number; readonly bG2: number };
  /** Which bias values came from the defaults above. */
  readonly defaulted: readonly string[];
}

const FULL_SKY_DEG2 = (4 * Math.PI * (180 / Math.PI) ** 2); // 41252.96 deg^2

export function defaultB2(b1: number): number {
  return 0.412 - 2.143 * b1 + 0.929 * b1 * b1 + 0.008 * b1 * b1 * b1;
}

export function defaultBG2(b1: number): number {
  return (-2 / 7) * (b1 - 1);
}

/** Comoving volume (Mpc/h)^3 of a sky area (deg^2) between two redshifts. */
export function shellVolume(background: Background, skyArea: number, zMin: number, zMax: number): number {
  const fSky = skyArea / FULL_SKY_DEG2;
  const r1 = background.comovingDistance(zMin);
  const r2 = background.comovingDistance(zMax);
  return ((4 * Math.PI) / 3) * fSky * (r2 ** 3 - r1 ** 3);
}

const BIN_KEYS = ['zMin', 'zMax', 'nbar', 'volume', 'b1', 'b2', 'bG2'];

export function resolveSurvey(raw: unknown, background: Background, key = 'survey'): SurveyBin[] {
  const problems: string[] = [];
  const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
  if (typeof raw !== 'object' || raw === null) throw new InputErrors([`${key} must be an object with "bins"`]);
  const s = raw as Record<string, unknown>;
  for (const k of Object.keys(s)) if (!['name', 'skyArea', 'bins'].includes(k)) problems.push(`${key}.${k} is not a survey key (name, skyArea, bins)`);
  if (s.skyArea !== undefined && !(isNum(s.skyArea) && s.skyArea > 0 && s.skyArea <= FULL_SKY_DEG2 * (1 + 1e-12))) {
    problems.push(`${key}.skyArea must be in (0, ${FULL_SKY_DEG2.toFixed(2)}] square degrees, got ${JSON.stringify(s.skyArea)}`);
  }
  if (!Array.isArray(s.bins) || s.bins.length === 0) {
    problems.push(`${key}.bins must be a non-empty list of redshift bins`);
    throw new InputErrors(problems);
  }
  const growth = new GrowthHistory(background);
  const out: SurveyBin[] = [];
  s.bins.forEach((b: unknown, i: number) => {
    const at = `${key}.bins[${i}]`;
    if (typeof b !== 'object' || b === null) {
      problems.push(`${at} must be an object`);
      return;
    }
    const bin = b as Record<string, unknown>;
    for (const k of Object.keys(bin)) if (!BIN_KEYS.includes(k)) problems.push(`${at}.${k} is not a bin key (${BIN_KEYS.join(', ')})`);
    const { zMin, zMax, nbar, volume } = bin;
    if (!isNum(zMin) || zMin < 0) problems.push(`${at}.zMin must be a non-negative number, got ${JSON.stringify(zMin)}`);
    if (!isNum(zMax) || !(isNum(zMin) && zMax > zMin)) problems.push(`${at}.zMax must be a number above zMin, got ${JSON.stringify(zMax)}`);
    if (!isNum(nbar) || nbar <= 0) problems.push(`${at}.nbar must be a positive number density in (h/Mpc)^3, got ${JSON.stringify(nbar)}`);
    if (volume !== undefined && !(isNum(volume) && volume > 0)) problems.push(`${at}.volume must be a positive volume in (Mpc/h)^3, got ${JSON.stringify(volume)}`);
    if (volume === undefined && s.skyArea === undefined) problems.push(`${at}: give a volume, or a survey skyArea to compute it from`);
    for (const k of ['b1', 'b2', 'bG2']) if (bin[k] !== undefined && !isNum(bin[k])) problems.push(`${at}.${k} must be a finite number`);
    if (bin.b1 !== undefined && isNum(bin.b1) && bin.b1 <= 0) problems.push(`${at}.b1 must be positive, got ${bin.b1}`);
    if (problems.length) return;
    const z0 = zMin as number;
    const z1 = zMax as number;
    const zEff = 0.5 * (z0 + z1);
    const defaulted: string[] = [];
    const b1 = isNum(bin.b1) ? bin.b1 : (defaulted.push('b1'), (0.84 * growth.factor(0)) / growth.factor(zEff));
    const b2 = isNum(bin.b2) ? bin.b2 : (defaulted.push('b2'), defaultB2(b1));
    const bG2 = isNum(bin.bG2) ? bin.bG2 : (defaulted.push('bG2'), defaultBG2(b1));
    out.push({
      zMin: z0,
      zMax: z1,
      zEff,
      volume: isNum(volume) ? volume : shellVolume(background, s.skyArea as number, z0, z1),
      nbar: nbar as number,
      bias: { b1, b2, bG2 },
      defaulted,
    });
  });
  if (problems.length) throw new InputErrors(problems);
  return out;
}
