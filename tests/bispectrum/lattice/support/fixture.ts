import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { enumerateTriangleBins, shellGrid, type TriangleBins } from '../../../../src/bispectrum/triangle-bins.js';
import type { TriangleIntegrand } from '../../../../src/bispectrum/triangle-integrand.js';

/** The numpy brute-force reference of tests/fixtures/numpy-lattice/lattice_triangles.py. */
export interface LatticeFixtureCase {
  readonly name: string;
  readonly boxSize: number;
  readonly kMin: number;
  readonly dk: number;
  readonly shellCount: number;
  readonly multipoles: number[];
  readonly bins: [number, number, number][];
  readonly counts: number[];
  readonly averages: (number | null)[][][];
}

export interface LatticeFixture {
  readonly cases: LatticeFixtureCase[];
  readonly continuum: { boxSize: number; kMin: number; dk: number; shellCount: number; bins: { bin: number[]; continuum: number }[] };
}

export function loadLatticeFixture(): LatticeFixture {
  const path = fileURLToPath(new URL('../../../fixtures/numpy-lattice/lattice_triangles.json', import.meta.url));
  return JSON.parse(readFileSync(path, 'utf8')) as LatticeFixture;
}

export function fixtureBins(kMin: number, dk: number, shellCount: number): TriangleBins {
  return enumerateTriangleBins(shellGrid(kMin, kMin + (shellCount - 1) * dk, dk));
}

function power(k: number): number {
  return k / (1 + (k / 0.05) ** 2) ** 2;
}

/** The same six components as the fixture script's `integrand`. */
export const fixtureIntegrand: TriangleIntegrand = {
  size: 6,
  evaluate(k1, k2, k3, mu1, mu2, mu3, out, offset) {
    out[offset] = 1;
    out[offset + 1] = k1 * k2 * k3;
    out[offset + 2] = mu1 * mu2;
    out[offset + 3] = mu2 ** 2 * mu3 ** 4 + k3 / k1;
    out[offset + 4] = power(k1) * power(k2) + power(k2) * power(k3) + power(k3) * power(k1);
    out[offset + 5] = mu1 + mu1 * mu2;
  },
};
