import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** tests/fixtures/scipy-power/redshift_multipoles.json, made by the script beside it. */
export interface ScipyMultipoleCase {
  readonly params: Record<string, number>;
  readonly P0: number[];
  readonly P2: number[];
  readonly P4: number[];
}

export interface ScipyMultipoleFixture {
  readonly k: number[];
  readonly cases: Record<string, ScipyMultipoleCase>;
  readonly baoDampingP0: { b1: number; f: number; values: number[] };
}

export const scipyMultipoles: ScipyMultipoleFixture = JSON.parse(
  readFileSync(fileURLToPath(new URL('../../fixtures/scipy-power/redshift_multipoles.json', import.meta.url)), 'utf8'),
);

/** Largest |model - fixture| over P0, P2, P4 of each bin, relative to that bin's |P0| (model in multipole-major order). */
export function worstDeviationFromFixture(model: Float64Array, c: ScipyMultipoleCase): number {
  const n = c.P0.length;
  let worst = 0;
  [c.P0, c.P2, c.P4].forEach((ref, m) => {
    for (let i = 0; i < n; i++) worst = Math.max(worst, Math.abs(model[m * n + i] - ref[i]) / Math.abs(c.P0[i]));
  });
  return worst;
}
