import { describe, expect, it } from 'vitest';
import { continuousBinNodes } from '../../src/bispectrum/continuous-bin-nodes.js';
import { averageOverTriangleNodes } from '../../src/bispectrum/orientation-average.js';
import { orientationRule } from '../../src/bispectrum/orientation-rule.js';
import { TreeBispectrumModel } from '../../src/bispectrum/tree-bispectrum-model.js';
import { TreeDirectIntegrand } from '../../src/bispectrum/tree-direct-integrand.js';
import { TreeMultipoleEvaluator } from '../../src/bispectrum/tree-multipole-evaluator.js';
import { TreeTemplateIntegrand } from '../../src/bispectrum/tree-template-integrand.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';
import { expectTemplatesClose } from './support/expect-templates.js';

const spectrum = analyticSpectrum();
const params = { b1: 2.1, b2: -0.4, bG2: 0.2, f: 0.8, bispShotPower: 0.7, bispShotConst: 1.3 };
const bins = enumerateTriangleBins(shellGrid(0.02, 0.1, 0.02));
const nodes = continuousBinNodes(bins, 3);

describe('precomputed angular averages (polynomial model)', () => {
  const rule = orientationRule(3, 5);
  const settings = { spectrum, numberDensity: 2e-4, irResummation: false };

  it('give the templates of the generic orientation average to 1e-12', () => {
    const fast = new TreeMultipoleEvaluator(nodes, [0, 2, 4], rule).templates(settings, false);
    const generic = averageOverTriangleNodes(nodes, new TreeTemplateIntegrand(settings), [0, 2, 4], rule);
    expectTemplatesClose(fast, generic, 1e-12);
  });

  it('give B_l of the generic orientation average to 1e-12', () => {
    const fast = new TreeMultipoleEvaluator(nodes, [0, 2], rule).evaluate(settings, params, false);
    const generic = averageOverTriangleNodes(nodes, new TreeDirectIntegrand(settings, params), [0, 2], rule);
    const nb = bins.size;
    for (let b = 0; b < nb; b++) for (let m = 0; m < 2; m++) expect(Math.abs(fast[m * nb + b] - generic[2 * b + m])).toBeLessThanOrEqual(1e-12 * Math.abs(generic[2 * b]));
  });
});

describe('angle-averaged BAO damping (irAngleAveraged)', () => {
  it('equals the per-leg damping when Sigma_tot does not depend on mu (f = 0 inside the damping; JCAP 07 (2018) 053 form)', () => {
    const common = { spectrum, numberDensity: 2e-4, fForBaoDamping: 0, bins, volumeOrder: 3 };
    const perLeg = new TreeBispectrumModel(common).evaluate(params);
    const averaged = new TreeBispectrumModel({ ...common, irAngleAveraged: true }).evaluate(params);
    for (let i = 0; i < perLeg.length; i++) expect(Math.abs(averaged[i] / perLeg[i] - 1)).toBeLessThan(1e-10);
  });

  it('stays within 1% of the per-leg damping in B_0 and moves B_2 by less than 5% of B_0 at k <= 0.1 (size measured in docs/bispectrum-convergence.md)', () => {
    const common = { spectrum, numberDensity: 2e-4, bins, volumeOrder: 3 };
    const perLeg = new TreeBispectrumModel(common).evaluate(params);
    const averaged = new TreeBispectrumModel({ ...common, irAngleAveraged: true }).evaluate(params);
    const nb = bins.size;
    let moved = 0;
    for (let b = 0; b < nb; b++) {
      expect(Math.abs(averaged[b] / perLeg[b] - 1)).toBeLessThan(0.01);
      expect(Math.abs(averaged[nb + b] - perLeg[nb + b]) / Math.abs(perLeg[b])).toBeLessThan(0.05);
      moved = Math.max(moved, Math.abs(averaged[b] / perLeg[b] - 1));
    }
    expect(moved).toBeGreaterThan(1e-5); // it is a different model, not the same one
  });
});
