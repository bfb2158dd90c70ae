import { describe, expect, it } from 'vitest';
import { centreTriangleNodes } from '../../src/bispectrum/bin-averaging.js';
import { averageOverTriangleNodes } from '../../src/bispectrum/orientation-average.js';
import { exactPolynomialOrientationRule, orientationRule } from '../../src/bispectrum/orientation-rule.js';
import { defaultTreeOrientationRule } from '../../src/bispectrum/tree-bispectrum-model.js';
import { TreeDirectIntegrand } from '../../src/bispectrum/tree-direct-integrand.js';
import { resolveTreeSettings } from '../../src/bispectrum/tree-settings.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const spectrum = analyticSpectrum();
const params = { b1: 1.9, b2: 0.4, bG2: -0.3, f: 0.7, bispShotPower: 1, bispShotConst: 1 };
const bins = enumerateTriangleBins(shellGrid(0.015, 0.135, 0.03));
const nodes = centreTriangleNodes(bins);

function maxRelative(a: Float64Array, b: Float64Array): number {
  let e = 0;
  for (let i = 0; i < a.length; i++) e = Math.max(e, Math.abs(a[i] / b[i] - 1));
  return e;
}

describe('orientation quadrature', () => {
  it('is exact for the polynomial model (degree 8 in the cosines) with the minimal rule, up to l = 4', () => {
    const d = new TreeDirectIntegrand({ spectrum, irResummation: false, numberDensity: 3e-4 }, params);
    const exact = averageOverTriangleNodes(nodes, d, [0, 2, 4], exactPolynomialOrientationRule(4));
    const fine = averageOverTriangleNodes(nodes, d, [0, 2, 4], orientationRule(12, 12));
    expect(maxRelative(exact, fine)).toBeLessThan(1e-12);
    // One node fewer in mu1 is no longer exact for l = 4.
    const short = averageOverTriangleNodes(nodes, d, [0, 2, 4], orientationRule(3, 5));
    expect(maxRelative(short, fine)).toBeGreaterThan(1e-9);
  });

  it('converges fast with fingers-of-god damping, IR resummation and AP; the default rule reaches 1e-6', () => {
    const settings = { spectrum, velocityDispersion: 6, alphaPar: 1.05, alphaPerp: 0.96, numberDensity: 3e-4 };
    const d = new TreeDirectIntegrand(settings, params);
    const ref = averageOverTriangleNodes(nodes, d, [0, 2], orientationRule(16, 20));
    const errors = [2, 3, 4, 5].map((m) => maxRelative(averageOverTriangleNodes(nodes, d, [0, 2], orientationRule(m, m + 2)), ref));
    for (let i = 1; i < errors.length; i++) expect(errors[i]).toBeLessThan(errors[i - 1] / 10);
    const rule = defaultTreeOrientationRule(resolveTreeSettings(settings), 2, 0.135);
    expect(maxRelative(averageOverTriangleNodes(nodes, d, [0, 2], rule), ref)).toBeLessThan(1e-6);
  });

  it('the default rule with IR resummation alone reaches 1e-6', () => {
    const settings = { spectrum, numberDensity: 3e-4 };
    const d = new TreeDirectIntegrand(settings, params);
    const ref = averageOverTriangleNodes(nodes, d, [0, 2], orientationRule(16, 20));
    const rule = defaultTreeOrientationRule(resolveTreeSettings(settings), 2, 0.135);
    expect(rule.weight.length).toBe(20);
    expect(maxRelative(averageOverTriangleNodes(nodes, d, [0, 2], rule), ref)).toBeLessThan(1e-6);
  });
});
