import { describe, expect, it } from 'vitest';
import { averageOverTriangleNodes } from '../../src/bispectrum/orientation-average.js';
import { orientationRule } from '../../src/bispectrum/orientation-rule.js';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { TreeDirectIntegrand } from '../../src/bispectrum/tree-direct-integrand.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { Random } from '../../src/numerics/random.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';
import { randomTreeParameters } from './support/random-parameters.js';

describe('template path equals direct path', () => {
  const bins = enumerateTriangleBins(shellGrid(0.02, 0.08, 0.02));
  const spectrum = analyticSpectrum();
  const settings = { spectrum, velocityDispersion: 3, alphaPar: 1.02, alphaPerp: 0.99, numberDensity: 4e-4 };

  it('to 1e-10 relative for random parameters, continuous average with damping and AP', () => {
    const model = new TreeBispectrumModel({ ...settings, bins, orientationNodes: { mu: 3, phi: 4 }, volumeOrder: 2 });
    const rng = new Random(7);
    for (let trial = 0; trial < 5; trial++) {
      const p = randomTreeParameters(rng);
      const fromTemplates = model.evaluate({ ...p, alphaPar: 1.02, alphaPerp: 0.99, bispSigmaV: 3 });
      const direct = model.evaluateDirect({ ...p, alphaPar: 1.02, alphaPerp: 0.99, bispSigmaV: 3 });
      const untabulated = averageOverTriangleNodes(model.nodes, new TreeDirectIntegrand(settings, p as never), [0, 2], orientationRule(3, 4));
      for (let b = 0; b < bins.size; b++) {
        for (let m = 0; m < 2; m++) {
          const d = direct[m * bins.size + b];
          expect(Math.abs(fromTemplates[m * bins.size + b] - d)).toBeLessThan(1e-10 * Math.abs(d));
          // The tabulated spectrum the model uses costs less than 1e-7 against the original.
          expect(Math.abs(d / untabulated[b * 2 + m] - 1)).toBeLessThan(1e-7);
        }
      }
    }
  });

  it('linearPart rebuilds the model exactly from offset and columns in b2, bG2 and the stochastic amplitudes', () => {
    const model = new TreeBispectrumModel({ ...settings, bins, averaging: 'centres' });
    const p = randomTreeParameters(new Random(3));
    const names = ['b2', 'bG2', 'bispShotPower', 'bispShotConst'];
    const dec = model.linearPart(p, names);
    const full = model.evaluate(p);
    for (let i = 0; i < full.length; i++) {
      let v = dec.offset[i];
      names.forEach((n, j) => (v += p[n] * dec.columns[j][i]));
      expect(Math.abs(v - full[i])).toBeLessThan(1e-12 * Math.abs(full[i]));
    }
    expect(() => model.linearPart(p, ['b1'])).toThrow(/not a linear parameter/);
  });
});
