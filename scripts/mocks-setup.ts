/**
 * Shared setup of the mock validation scripts: the fiducial cosmology (Planck
 * 2018 best fit, A&A 641, A6, Table 2, from memory; also in
 * /work/shared/REFERENCES.md), its linear spectrum from src/cosmology, and small
 * statistics helpers.
 */
import { linearPowerFromCosmology, validateCosmology } from '../src/cosmology/index.js';

export const FIDUCIAL = { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044 };

export function fiducialSpectrum(redshift: number) {
  return linearPowerFromCosmology(validateCosmology(FIDUCIAL), redshift, { kMin: 1e-4, kMax: 2 });
}

/** Mean and unbiased variance of each column of rows. */
export function columnMoments(rows: readonly Float64Array[]): { mean: Float64Array; variance: Float64Array } {
  const m = rows[0].length;
  const mean = new Float64Array(m);
  const variance = new Float64Array(m);
  for (const r of rows) for (let i = 0; i < m; i++) mean[i] += r[i] / rows.length;
  for (const r of rows) for (let i = 0; i < m; i++) variance[i] += (r[i] - mean[i]) ** 2 / (rows.length - 1);
  return { mean, variance };
}

export function argValue(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}
