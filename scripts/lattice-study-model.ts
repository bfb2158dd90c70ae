import { latticeMemoisedSpectrum } from '../src/bispectrum/lattice/memoised-spectrum.js';
import { TreeDirectIntegrand } from '../src/bispectrum/tree-direct-integrand.js';
import { TreeTemplateIntegrand } from '../src/bispectrum/tree-template-integrand.js';
import type { TreeBispectrumParameters } from '../src/bispectrum/tree-template-terms.js';
import type { TreeBispectrumSettings } from '../src/bispectrum/tree-settings.js';
import { linearPowerFromCosmology } from '../src/cosmology/linear-power-from-cosmology.js';
import { validateCosmology } from '../src/cosmology/cosmology-parameters.js';

/**
 * The model set-up shared by bench/lattice.bench.ts and the accuracy study
 * (scripts/lattice-accuracy-study.ts): the project's tree-level integrands on
 * the project's EH98 linear power (src/cosmology) at a Planck 2018 cosmology
 * (A&A 641, A6, Table 2, from memory), z = 0.5, a typical galaxy sample.
 * `latticeBox`: build on the lattice-memoised spectrum of that box (identical
 * values, faster on its lattice).
 */
export const STUDY_REDSHIFT = 0.5;
export const STUDY_NUMBER_DENSITY = 3e-4;

function studySettings(latticeBox?: number): TreeBispectrumSettings {
  const cosmology = validateCosmology({ h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044, mNu: 0.06, massiveNuCount: 1 });
  const spectrum = linearPowerFromCosmology(cosmology, STUDY_REDSHIFT);
  return { spectrum: latticeBox ? latticeMemoisedSpectrum(spectrum, latticeBox) : spectrum, numberDensity: STUDY_NUMBER_DENSITY };
}

export function studyTemplateIntegrand(latticeBox?: number): TreeTemplateIntegrand {
  return new TreeTemplateIntegrand(studySettings(latticeBox));
}

/** B itself at b1 = 2, b2 = 0.5, bG2 = -2/7 (b1 - 1) (local Lagrangian, common practice), Poisson shot noise. */
export function studyDirectIntegrand(latticeBox?: number): TreeDirectIntegrand {
  const settings = studySettings(latticeBox);
  const p: TreeBispectrumParameters = { b1: 2, b2: 0.5, bG2: (-2 / 7) * (2 - 1), f: settings.spectrum.growthRateLargeScale, bispShotPower: 1, bispShotConst: 1 };
  return new TreeDirectIntegrand(settings, p);
}
