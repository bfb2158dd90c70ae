import { readFileSync } from 'node:fs';

/** Reference values from tests/fixtures/scipy-likelihood/make_likelihood_fixtures.py (numpy/scipy). */
export interface LikelihoodFixtures {
  sample: { realisations: number[][]; mean: number[]; covariance: number[][]; hartlap: number; precision_hartlap: number[][] };
  percival: { ns: number; nd: number; np: number; m1: number; m2: number };
  t_distribution: { ns: number; covariance: number[][]; mean: number[]; points: number[][]; logpdf: number[] };
  chi2_sf: { chi2: number; dof: number; sf: number }[];
  power_gaussian: { multipoles: Record<string, number>; nbar: number; modes: number; covariance: Record<string, number> };
}

export const fixtures = JSON.parse(readFileSync(new URL('../../../fixtures/scipy-likelihood/likelihood_fixtures.json', import.meta.url), 'utf8')) as LikelihoodFixtures;
