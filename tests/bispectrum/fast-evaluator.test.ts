import { describe, expect, it } from 'vitest';
import { continuousBinNodes } from '../../src/bispectrum/continuous-bin-nodes.js';
import { averageOverTriangleNodes } from '../../src/bispectrum/orientation-average.js';
import { orientationRule } from '../../src/bispectrum/orientation-rule.js';
import { TreeTemplateIntegrand } from '../../src/bispectrum/tree-template-integrand.js';
import { TreeDirectIntegrand } from '../../src/bispectrum/tree-direct-integrand.js';
import { TabulatedSpectrum } from '../../src/bispectrum/tabulated-spectrum.js';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { TreeMultipoleEvaluator } from '../../src/bispectrum/tree-multipole-evaluator.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';
import { expectTemplatesClose } from './support/expect-templates.js';

const spectrum = analyticSpectrum();
const params = { b1: 2.1, b2: -0.4, bG2: 0.2, f: 0.8, bispShotPower: 0.7, bispShotConst: 1.3 };

describe('fast full evaluation (TreeMultipoleEvaluator)', () => {
  const bins = enumerateTriangleBins(shellGrid(0.02, 0.1, 0.02));
  const nodes = continuousBinNodes(bins, 3);
  const rule = orientationRule(4, 6);
  const evaluator = new TreeMultipoleEvaluator(nodes, [0, 2], rule);

  const cases: Record<string, number | boolean>[] = [{}, { velocityDispersion: 5 }, { irResummation: false }, { alphaPar: 1.03, alphaPerp: 0.98 }];
  for (const extra of cases) {
    it(`agrees with the model's template path to 1e-10 (${JSON.stringify(extra)})`, () => {
      const settings = { spectrum, numberDensity: 2e-4, ...extra };
      const fast = evaluator.evaluate(settings, params);
      const model = new TreeBispectrumModel({ ...settings, bins, volumeOrder: 3, orientationNodes: { mu: 4, phi: 6 } });
      const slow = model.evaluate({
        ...params,
        alphaPar: (extra.alphaPar as number) ?? 1,
        alphaPerp: (extra.alphaPerp as number) ?? 1,
        bispSigmaV: (extra.velocityDispersion as number) ?? 0,
      });
      for (let i = 0; i < fast.length; i++) expect(Math.abs(fast[i] / slow[i] - 1)).toBeLessThan(1e-10);
    });
  }
});

describe('fast templates (TreeMultipoleEvaluator.templates)', () => {
  const apCases: Record<string, number>[] = [{}, { alphaPar: 1.04, alphaPerp: 0.97 }, { alphaPar: 0.95, alphaPerp: 0.95 }];
  for (const ap of apCases) {
    it(`equal the generic average of TreeTemplateIntegrand to 1e-12, with damping, IR and stochastic terms (${JSON.stringify(ap)})`, () => {
      const bins = enumerateTriangleBins(shellGrid(0.02, 0.08, 0.02));
      const nodes = continuousBinNodes(bins, 3);
      const rule = orientationRule(4, 6);
      const settings = { spectrum, numberDensity: 2e-4, velocityDispersion: 3, ...ap };
      const fast = new TreeMultipoleEvaluator(nodes, [0, 2], rule).templates(settings, false);
      const generic = averageOverTriangleNodes(nodes, new TreeTemplateIntegrand(settings), [0, 2], rule);
      expectTemplatesClose(fast, generic, 1e-12);
    });
  }

  it('with AP distortion, the fast B_l equal the generic average of TreeDirectIntegrand to 1e-12', () => {
    const bins = enumerateTriangleBins(shellGrid(0.02, 0.08, 0.02));
    const nodes = continuousBinNodes(bins, 3);
    const rule = orientationRule(4, 6);
    for (const extra of [{ velocityDispersion: 4 }, { irResummation: false }]) {
      const settings = { spectrum, numberDensity: 2e-4, alphaPar: 1.05, alphaPerp: 0.98, ...extra };
      const evaluator = new TreeMultipoleEvaluator(nodes, [0, 2], rule);
      const fast = evaluator.evaluate(settings, params, false);
      // On the re-tabulated spectrum as the model uses it: TabulatedSpectrum keeps P to 1e-8 (test below).
      const tabulated = evaluator.evaluate(settings, params);
      const generic = averageOverTriangleNodes(nodes, new TreeDirectIntegrand(settings, params), [0, 2], rule);
      const nb = bins.size;
      for (let b = 0; b < nb; b++) {
        for (let m = 0; m < 2; m++) {
          expect(Math.abs(fast[m * nb + b] - generic[2 * b + m])).toBeLessThanOrEqual(1e-12 * Math.abs(generic[2 * b]));
          expect(Math.abs(tabulated[m * nb + b] - generic[2 * b + m])).toBeLessThanOrEqual(1e-8 * Math.abs(generic[2 * b]));
        }
      }
    }
  });
});

describe('tabulated spectrum', () => {
  it('reproduces P and P_nw to 1e-8 relative over its range, with wiggles', () => {
    const tab = new TabulatedSpectrum(spectrum, 0.004, 0.3);
    for (let i = 0; i <= 5000; i++) {
      const k = 0.004 + (0.296 * i) / 5000;
      expect(Math.abs(tab.power(k) / spectrum.power(k) - 1)).toBeLessThan(1e-8);
      expect(Math.abs(tab.powerNoWiggle(k) / spectrum.powerNoWiggle(k) - 1)).toBeLessThan(1e-8);
    }
  });
});
