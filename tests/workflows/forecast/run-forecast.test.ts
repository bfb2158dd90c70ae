import { describe, expect, it } from 'vitest';
import { InputError, InputErrors } from '../../../src/contracts/input-error.js';
import { runForecast, type ForecastResult } from '../../../src/workflows/forecast/run-forecast.js';

const SMALL = {
  survey: { bins: [{ zMin: 0.4, zMax: 0.6, nbar: 3e-4, volume: 2e9 }] },
  parameters: ['lnAs', 'b1', 'b2', 'bG2', 'pStochConst', 'bispShotPower'],
  power: { kMin: 0.01, kMax: 0.15, dk: 0.01 },
  bispectrum: { kMin: 0.02, kMax: 0.1, dk: 0.02 },
};

const sigma = (r: ForecastResult, set: 'power' | 'bispectrum' | 'joint', name: string) => {
  const e = r.sets[set]?.errors;
  if (!e) throw new Error(`no errors for ${set}: ${r.sets[set]?.singular}`);
  return e.marginalised[e.names.indexOf(name)];
};

describe('Fisher forecast of a survey', () => {
  const base = runForecast(SMALL);

  it('adding B to P tightens the bias and amplitude errors; B alone constrains b2 and bG2, P alone does not read them', () => {
    for (const n of ['lnAs', 'b1']) {
      expect(sigma(base, 'joint', n)).toBeLessThan(sigma(base, 'power', n));
      expect(base.improvement[n].overPower).toBeGreaterThan(1);
    }
    for (const n of ['b2', 'bG2']) expect(sigma(base, 'joint', n)).toBeLessThan(sigma(base, 'bispectrum', n));
    expect(base.sets.power?.errors?.names).not.toContain('b2');
    // Conditional errors never exceed marginalised ones.
    const j = base.sets.joint!.errors!;
    j.names.forEach((_, a) => expect(j.conditional[a]).toBeLessThanOrEqual(j.marginalised[a] * (1 + 1e-12)));
    expect(base.assumptions.join('\n')).toMatch(/tree-level bispectrum/);
    expect(base.assumptions.join('\n')).toMatch(/no super-sample or non-Gaussian terms/);
  });

  it('errors shrink with the bispectrum k_max and with the number density (more triangles, less shot noise: Sefusatti & Komatsu 2007, PRD 76, 083004)', () => {
    const wider = runForecast({ ...SMALL, bispectrum: { ...SMALL.bispectrum, kMax: 0.14 } });
    const denser = runForecast({ ...SMALL, survey: { bins: [{ ...SMALL.survey.bins[0], nbar: 1e-3 }] } });
    for (const n of ['b1', 'b2', 'bG2', 'lnAs']) {
      expect(sigma(wider, 'bispectrum', n)).toBeLessThan(sigma(base, 'bispectrum', n));
      expect(sigma(wider, 'joint', n)).toBeLessThan(sigma(base, 'joint', n));
      expect(sigma(denser, 'joint', n)).toBeLessThan(sigma(base, 'joint', n));
    }
  });

  it('an external Gaussian prior tightens its parameter below both the prior width and the data-only error', () => {
    const withPrior = runForecast({ ...SMALL, prior: { sigmas: { lnAs: 0.01 } } });
    expect(sigma(withPrior, 'joint', 'lnAs')).toBeLessThan(0.01);
    expect(sigma(withPrior, 'joint', 'lnAs')).toBeLessThan(sigma(base, 'joint', 'lnAs'));
    expect(sigma(withPrior, 'joint', 'b1')).toBeLessThan(sigma(base, 'joint', 'b1'));
    // A prior given as a Fisher matrix gives the same answer as the same widths.
    const asMatrix = runForecast({ ...SMALL, prior: { names: ['lnAs'], fisher: [[1e4]] } });
    expect(sigma(asMatrix, 'joint', 'lnAs')).toBeCloseTo(sigma(withPrior, 'joint', 'lnAs'), 12);
  });

  it('sums independent redshift bins: two identical bins give errors smaller by sqrt(2) on the shared parameter when bias is per bin', () => {
    const two = runForecast({ ...SMALL, parameters: ['lnAs', 'b1'], survey: { bins: [SMALL.survey.bins[0], SMALL.survey.bins[0]] } });
    const one = runForecast({ ...SMALL, parameters: ['lnAs', 'b1'] });
    expect(two.sets.joint!.fisher.names).toEqual(['lnAs', 'b1_z1', 'b1_z2']);
    expect(sigma(one, 'joint', 'lnAs') / sigma(two, 'joint', 'lnAs')).toBeCloseTo(Math.SQRT2, 6);
  });

  it('refuses bad input with clear errors naming the key', () => {
    const bad = (over: object) => () => runForecast({ ...SMALL, ...over });
    expect(bad({ survey: { bins: [{ zMin: 0.4, zMax: 0.6, nbar: 0, volume: -1 }] } })).toThrow(InputErrors);
    expect(bad({ survey: { bins: [{ zMin: 0.4, zMax: 0.6, nbar: 0, volume: -1 }] } })).toThrow(/nbar must be a positive[\s\S]*volume must be a positive/);
    expect(bad({ parameters: ['b1', 'bQuux'] })).toThrow(/"bQuux" is neither a cosmology parameter nor read by the models/);
    expect(bad({ prior: { sigmas: { w0: 0.1 } } })).toThrow(/"w0" is not among the forecast parameters/);
    expect(bad({ power: { kMin: 0.01, kMax: 0.005, dk: 0.01 }, colour: 1 })).toThrow(/colour is not a forecast key[\s\S]*power.kMax \(0.005\) is below kMin/);
    expect(bad({ parameters: ['b1', 'bQuux'] })).toThrow(InputError);
  });

  it('reports a singular Fisher matrix, naming the parameter without information', () => {
    // The constant shot noise has no quadrupole or hexadecapole: with P2 and P4 alone it is unconstrained.
    const r = runForecast({ ...SMALL, parameters: ['b1', 'pStochConst'], power: { kMin: 0.01, kMax: 0.1, dk: 0.01, multipoles: [2, 4] }, bispectrum: null });
    expect(r.sets.joint?.errors).toBeUndefined();
    expect(r.sets.joint?.singular).toMatch(/do not constrain "pStochConst"/);
    expect(r.warnings.join()).toMatch(/"pStochConst" changes the model/);
  });
});
