import { describe, expect, it } from 'vitest';
import { DEFAULT_VOLUME_ORDER } from '../../src/bispectrum/bin-averaging.js';
import { continuousBinNodes } from '../../src/bispectrum/continuous-bin-nodes.js';
import { orientationRule } from '../../src/bispectrum/orientation-rule.js';
import { TreeMultipoleEvaluator } from '../../src/bispectrum/tree-multipole-evaluator.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const spectrum = analyticSpectrum();
const params = { b1: 1.9, b2: 0.4, bG2: -0.3, f: 0.7, bispShotPower: 1, bispShotConst: 1 };
// The low-k corner, where bins are widest relative to k and most bins are cut by the triangle inequality.
const bins = enumerateTriangleBins(shellGrid(0.01, 0.06, 0.01));
const rule = orientationRule(4, 5);

function evaluateAt(order: number): Float64Array {
  return new TreeMultipoleEvaluator(continuousBinNodes(bins, order), [0, 2], rule).evaluate({ spectrum, numberDensity: 3e-4 }, params);
}

describe('continuous bin average', () => {
  it('converges exponentially in the Gauss–Legendre order thanks to the domain splitting; the default order reaches 1e-6', () => {
    const ref = evaluateAt(9);
    const err = (order: number) => {
      const v = evaluateAt(order);
      let e = 0;
      for (let b = 0; b < bins.size; b++) {
        e = Math.max(e, Math.abs(v[b] / ref[b] - 1), Math.abs(v[bins.size + b] / ref[bins.size + b] - 1));
      }
      return e;
    };
    const errors = [2, 3, 4, 5].map(err);
    for (let i = 1; i < errors.length; i++) expect(errors[i]).toBeLessThan(errors[i - 1] / 8);
    expect(err(DEFAULT_VOLUME_ORDER)).toBeLessThan(1e-6);
  });
});
