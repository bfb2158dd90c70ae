import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/contracts/input-error.js';
import { PLANCK_2018, linearPowerFromCosmology, linearSpectrumFromTable, parsePowerTable } from '../../src/cosmology/index.js';
import { PowerMultipoleModel, type PowerModelOptions } from '../../src/power/index.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const base: PowerModelOptions = { spectrum: analyticSpectrum({ kMax: 0.5 }), bins: { kMin: 0.02, dk: 0.02, count: 10 }, nbar: 1e-3 };

function failure(fn: () => unknown): InputError {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    expect((err as Error).message).not.toContain('\n');
    return err as InputError;
  }
  throw new Error('expected an InputError');
}

describe('bad input to the power model', () => {
  it('k outside the linear table, at build time and after an AP dilation', () => {
    expect(failure(() => new PowerMultipoleModel({ ...base, bins: { kMin: 0.02, dk: 0.02, count: 30 } })).message).toMatch(
      /^bins: k = 0\.52 h\/Mpc lies outside the linear spectrum's range \[0\.0001, 0\.5\]/,
    );
    const model = new PowerMultipoleModel({ ...base, bins: { kMin: 0.02, dk: 0.02, count: 24 } });
    expect(failure(() => model.evaluate({ alphaPar: 0.9, alphaPerp: 0.9 })).message).toMatch(/alphaPar=0\.9, alphaPerp=0\.9/);
  });

  it('k beyond a user power table', () => {
    const eh = linearPowerFromCosmology(PLANCK_2018, 0.5);
    const rows = Array.from({ length: 40 }, (_, i) => 1e-3 * 300 ** (i / 39)); // 1e-3 .. 0.3 h/Mpc
    const table = parsePowerTable(rows.map((k) => `${k} ${eh.power(k)}`).join('\n'), 'pk.txt');
    const spectrum = linearSpectrumFromTable(table, PLANCK_2018, 0.5);
    const bins = { kMin: 0.01, dk: 0.01, count: 40 };
    expect(failure(() => new PowerMultipoleModel({ spectrum, bins, nbar: 1e-3 })).message).toMatch(/^bins: k = 0\.31 h\/Mpc lies outside/);
    expect(() => new PowerMultipoleModel({ spectrum, bins: { ...bins, count: 30 }, nbar: 1e-3 })).not.toThrow();
  });

  it('negative or missing number density', () => {
    expect(failure(() => new PowerMultipoleModel({ ...base, nbar: -1e-4 })).message).toMatch(/^nbar must be a positive/);
    expect(failure(() => new PowerMultipoleModel({ ...base, nbar: Number.NaN })).message).toMatch(/^nbar/);
  });

  it('unknown or repeated multipole order', () => {
    expect(failure(() => new PowerMultipoleModel({ ...base, multipoles: [0, 3] })).message).toBe(
      'multipoles: unknown multipole order 3 (the power model has 0, 2, 4)',
    );
    expect(failure(() => new PowerMultipoleModel({ ...base, multipoles: [6] })).message).toMatch(/order 6/);
    expect(failure(() => new PowerMultipoleModel({ ...base, multipoles: [2, 2] })).message).toMatch(/listed twice/);
  });

  it('bad bins, box, quadrature order and parameters', () => {
    expect(failure(() => new PowerMultipoleModel({ ...base, bins: { kMin: 0.005, dk: 0.02, count: 3 } })).message).toMatch(/^bins\.kMin/);
    expect(failure(() => new PowerMultipoleModel({ ...base, bins: { kMin: 0.02, dk: 0, count: 3 } })).message).toMatch(/^bins\.dk/);
    expect(failure(() => new PowerMultipoleModel({ ...base, bins: { kMin: 0.02, dk: 0.02, count: 2.5 } })).message).toMatch(/^bins\.count/);
    expect(failure(() => new PowerMultipoleModel({ ...base, averaging: { kind: 'lattice', boxSize: -5 } })).message).toMatch(/^boxSize/);
    expect(failure(() => new PowerMultipoleModel({ ...base, averaging: { kind: 'lattice', boxSize: 100 } })).message).toMatch(
      /^bins: shell 0 .* holds no wavevector/,
    );
    expect(failure(() => new PowerMultipoleModel({ ...base, muNodes: 1 })).message).toMatch(/^muNodes/);
    const model = new PowerMultipoleModel(base);
    expect(failure(() => model.evaluate({ alphaPerp: 0 })).message).toMatch(/^parameter alphaPerp must be positive/);
    expect(failure(() => model.evaluate({ b1: Number.NaN })).message).toMatch(/^parameter b1/);
  });
});
