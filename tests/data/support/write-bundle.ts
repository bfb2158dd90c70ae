import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Random } from '../../../src/numerics/random.js';

/**
 * Test-support writer of small measurement bundles in a temporary folder: the
 * loader and covariance tests corrupt one piece at a time. The numbers are
 * arbitrary inputs for the code paths, not physics checks.
 */
export interface BundleFiles {
  metadata: Record<string, unknown>;
  files: Record<string, string>;
}

export const POWER_DK = 0.01;
export const BISPECTRUM_DK = 0.02;

export function powerCsv(bins = 5, multipoles = [0, 2], scale = 1, rng?: Random): string {
  const rows = [`k_centre,k_eff,modes,${multipoles.map((l) => `P${l}`).join(',')}`];
  for (let i = 0; i < bins; i++) {
    const c = 0.02 + i * POWER_DK;
    const vals = multipoles.map((l) => (scale * 1e4 * (1 + (rng ? 0.05 * rng.normal() : 0))) / (1 + l) / (1 + 10 * c));
    rows.push(`${c.toFixed(4)},${(c + 0.001).toFixed(4)},${Math.round(4000 * c * c * 1e3)},${vals.join(',')}`);
  }
  return rows.join('\n') + '\n';
}

/** Triangle bins (i, j, l) on centres 0.03 + n * 0.02 for n < shells, kept when c1 - c2 - c3 < 1.5 dk. */
export function bispectrumCsv(shells = 3, scale = 1, rng?: Random): string {
  const rows = ['k1_centre,k2_centre,k3_centre,k1_eff,k2_eff,k3_eff,triangles,B0'];
  const c = (n: number) => 0.03 + n * BISPECTRUM_DK;
  for (let i = 0; i < shells; i++) {
    for (let j = 0; j <= i; j++) {
      for (let l = 0; l <= j; l++) {
        if (!(c(i) - c(j) - c(l) < 1.5 * BISPECTRUM_DK - 1e-12)) continue;
        const b = (scale * 1e8 * (1 + (rng ? 0.05 * rng.normal() : 0))) / (1 + 100 * c(i) * c(j));
        rows.push([c(i), c(j), c(l)].map((v) => v.toFixed(4)).join(',') + ',' + [c(i), c(j), c(l)].map((v) => (v + 0.002).toFixed(4)).join(',') + `,${1000 + 10 * i + j + l},${b}`);
      }
    }
  }
  return rows.join('\n') + '\n';
}

export function baseBundle(): BundleFiles {
  return {
    metadata: {
      format: 'treble-measurement-1',
      redshift: 0.5,
      numberDensity: 3e-4,
      lineOfSight: 'z-axis',
      boxSize: 1000,
      fiducialCosmology: { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12 },
      power: { table: 'power.csv', dk: POWER_DK },
      bispectrum: { table: 'bispectrum.csv', dk: BISPECTRUM_DK },
    },
    files: { 'power.csv': powerCsv(), 'bispectrum.csv': bispectrumCsv() },
  };
}

/** Write the bundle into a new temporary folder and return its path. */
export function writeBundle(b: BundleFiles): string {
  const dir = mkdtempSync(join(tmpdir(), 'treble-bundle-'));
  writeFileSync(join(dir, 'measurement.json'), JSON.stringify(b.metadata, null, 1));
  for (const [name, text] of Object.entries(b.files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
  return dir;
}

/** `count` noisy mock tables of the base bundle under mocks/power and mocks/bispectrum. */
export function withMocks(b: BundleFiles, count: number, seed = 1): BundleFiles {
  const rng = new Random(seed);
  const files = { ...b.files };
  for (let r = 0; r < count; r++) {
    const id = String(r).padStart(4, '0');
    files[`mocks/power/${id}.csv`] = powerCsv(5, [0, 2], 1, rng);
    files[`mocks/bispectrum/${id}.csv`] = bispectrumCsv(3, 1, rng);
  }
  return { metadata: { ...b.metadata, realisations: { power: 'mocks/power', bispectrum: 'mocks/bispectrum' } }, files };
}
