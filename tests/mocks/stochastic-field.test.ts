import { describe, expect, it } from 'vitest';
import { shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { fundamentalFrequency } from '../../src/numerics/lattice-shell.js';
import { measurePowerMultipoles } from '../../src/mocks/power-multipoles.js';
import { addWhiteNoise, poissonSampledSpectrum } from '../../src/mocks/stochastic-field.js';

const mesh = { n: 32, boxSize: 600 };
const kf = fundamentalFrequency(mesh.boxSize);
const shells = shellGrid(2 * kf, 14 * kf, 2 * kf);

/** Pooled P_0 over all shells and its standard error: Var P_0 = 2 P^2 / N_k per shell (common practice). */
function pooled(p: ReturnType<typeof measurePowerMultipoles>, level: number): { mean: number; se: number } {
  let modes = 0;
  let sum = 0;
  for (let s = 0; s < p.modes.length; s++) {
    modes += p.modes[s];
    sum += p.p0[s] * p.modes[s];
  }
  return { mean: sum / modes, se: level * Math.sqrt(2 / modes) };
}

describe('stochastic components', () => {
  it('white noise has the requested flat power', () => {
    const spec = addWhiteNoise(new Float64Array(2 * 32 * 32 * 17), mesh, 2500, 4);
    const { mean, se } = pooled(measurePowerMultipoles(spec, mesh, shells), 2500);
    expect(Math.abs(mean - 2500)).toBeLessThan(4 * se);
  });

  it('Poisson sampling of a uniform field has shot noise 1/nbar and nbar V objects on average', () => {
    const nbar = 2e-3;
    const { spectrum, objects, clippedCells } = poissonSampledSpectrum(new Float64Array(2 * 32 * 32 * 17), mesh, nbar, 8);
    const expected = nbar * mesh.boxSize ** 3;
    expect(Math.abs(objects - expected)).toBeLessThan(4 * Math.sqrt(expected)); // Poisson total
    expect(clippedCells).toBe(0);
    const { mean, se } = pooled(measurePowerMultipoles(spectrum, mesh, shells), 1 / nbar);
    expect(Math.abs(mean - 1 / nbar)).toBeLessThan(4 * se);
    // with the shot noise subtracted the pooled P_0 is consistent with zero
    const sub = pooled(measurePowerMultipoles(spectrum, mesh, shells, { shotNoise: 1 / nbar }), 1 / nbar);
    expect(Math.abs(sub.mean)).toBeLessThan(4 * sub.se);
  });
});
