import { describe, expect, it } from 'vitest';
import { discreteBoxBinAverage } from '../../../src/bispectrum/lattice/discrete-box-average.js';
import { latticeMemoisedSpectrum } from '../../../src/bispectrum/lattice/memoised-spectrum.js';
import { TreeDirectIntegrand } from '../../../src/bispectrum/tree-direct-integrand.js';
import { combineTreeTemplates } from '../../../src/bispectrum/tree-template-combination.js';
import { TreeTemplateIntegrand } from '../../../src/bispectrum/tree-template-integrand.js';
import { validateCosmology } from '../../../src/cosmology/cosmology-parameters.js';
import { linearPowerFromCosmology } from '../../../src/cosmology/linear-power-from-cosmology.js';
import { fixtureBins } from './support/fixture.js';

describe('discrete box as a fourth averaging choice of the tree model', () => {
  it('averaged templates combine to the directly averaged B_0 and B_2, on the plain and the memoised spectrum', () => {
    const spectrum = linearPowerFromCosmology(validateCosmology({ h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044 }), 0.5);
    const boxSize = 300;
    const bins = fixtureBins(0.03, 0.025, 5);
    const params = { b1: 1.9, b2: 0.3, bG2: -0.25, f: spectrum.growthRateLargeScale, bispShotPower: 0.8, bispShotConst: 1.2 };
    const multipoles = [0, 2];
    const settings = { spectrum, numberDensity: 2e-4, velocityDispersion: 3 };
    const templates = discreteBoxBinAverage(bins, boxSize, new TreeTemplateIntegrand(settings), { multipoles, cache: false });
    const memoised = discreteBoxBinAverage(bins, boxSize, new TreeTemplateIntegrand({ ...settings, spectrum: latticeMemoisedSpectrum(spectrum, boxSize) }), {
      multipoles,
      cache: false,
    });
    expect(Array.from(memoised.values)).toEqual(Array.from(templates.values));
    const direct = discreteBoxBinAverage(bins, boxSize, new TreeDirectIntegrand(settings, params), { multipoles, cache: false });
    const combined = combineTreeTemplates(templates.values, multipoles.length, params); // [multipole][bin]
    for (let b = 0; b < bins.size; b++) {
      for (let m = 0; m < multipoles.length; m++) {
        const want = direct.values[b * multipoles.length + m];
        expect(Math.abs(combined[m * bins.size + b] - want) / Math.abs(direct.values[b * multipoles.length])).toBeLessThan(1e-10);
      }
    }
  });
});
