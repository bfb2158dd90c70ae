import { describe, expect, it } from 'vitest';
import { theoryErrorCovariance } from '../../../src/workflows/scale-cuts/theory-error-covariance.js';

describe('theoretical-error covariance (Baldauf et al. 2016, PRD 93, 123007)', () => {
  const entries = [
    { block: 'P0', k: [0.05] },
    { block: 'P0', k: [0.1] },
    { block: 'P2', k: [0.1] },
    { block: 'B0', k: [0.1, 0.1, 0.1] },
    { block: 'B0', k: [0.1, 0.1, 0.05] },
  ];
  const signal = Float64Array.of(1000, 800, 300, 1e6, 2e6);
  const env = { amplitude: 0.1, kRef: 0.1, slope: 2, correlationLength: 0.05 };
  const cov = theoryErrorCovariance(entries, signal, env);
  const n = entries.length;

  it('has variance (amplitude * signal * (k/kRef)^slope)^2 on the diagonal', () => {
    expect(cov[0]).toBeCloseTo((0.1 * 1000 * 0.25) ** 2, 9);
    expect(cov[1 * n + 1]).toBeCloseTo((0.1 * 800) ** 2, 9);
    expect(cov[4 * n + 4]).toBeCloseTo((0.1 * 2e6) ** 2, 3);
  });

  it('correlates entries of one block with a Gaussian in wavenumber distance, and not across blocks', () => {
    const rho = cov[0 * n + 1] / Math.sqrt(cov[0] * cov[n + 1]);
    expect(rho).toBeCloseTo(Math.exp(-(0.05 ** 2) / (2 * 0.05 ** 2)), 12);
    expect(cov[1 * n + 2]).toBe(0);
    expect(cov[1 * n + 3]).toBe(0);
    const rhoB = cov[3 * n + 4] / Math.sqrt(cov[3 * n + 3] * cov[4 * n + 4]);
    expect(rhoB).toBeCloseTo(Math.exp(-0.5), 12);
  });

  it('refuses a signal of the wrong length', () => {
    expect(() => theoryErrorCovariance(entries, Float64Array.of(1, 2), env)).toThrow(/5 data entries but 2/);
  });
});
