import { describe, expect, it } from 'vitest';
import { Random } from '../../../src/numerics/random.js';
import { autocovariance, summedAutocovariance } from '../../../src/inference/diagnostics/autocovariance.js';
import { integratedAutocorrelationTime } from '../../../src/inference/diagnostics/autocorrelation-time.js';

function ar1(random: Random, n: number, phi: number): Float64Array {
  const x = new Float64Array(n);
  let v = random.normal() / Math.sqrt(1 - phi * phi);
  for (let i = 0; i < n; i++) {
    v = phi * v + random.normal();
    x[i] = v;
  }
  return x;
}

describe('integrated autocorrelation time', () => {
  it('FFT autocovariance equals the direct sum', () => {
    const x = ar1(new Random(3), 157, 0.6);
    const acov = autocovariance(x);
    const mean = x.reduce((a, b) => a + b, 0) / x.length;
    for (const t of [0, 1, 5, 80, 156]) {
      let s = 0;
      for (let i = 0; i + t < x.length; i++) s += (x[i] - mean) * (x[i + t] - mean);
      expect(acov[t]).toBeCloseTo(s / x.length, 11);
    }
  });

  it('the summed autocovariance of three series (paired in complex transforms) equals the sum of each', () => {
    const random = new Random(4);
    const xs = [ar1(random, 90, 0.3), ar1(random, 90, 0.8), ar1(random, 90, -0.4)];
    const sum = summedAutocovariance(xs);
    const each = xs.map((x) => autocovariance(x));
    for (const t of [0, 1, 7, 89]) expect(sum[t]).toBeCloseTo(each[0][t] + each[1][t] + each[2][t], 11);
  });

  it('recovers tau = (1 + phi)/(1 - phi) of AR(1) chains within the windowed-estimator error', () => {
    // AR(1): rho(t) = phi^t, so tau = 1 + 2 phi/(1 - phi) = (1 + phi)/(1 - phi) (exact).
    const random = new Random(11);
    for (const phi of [0.5, 0.9]) {
      const chains = Array.from({ length: 8 }, () => ar1(random, 20_000, phi));
      const { tau, window, converged } = integratedAutocorrelationTime(chains);
      const exact = (1 + phi) / (1 - phi);
      // Sokal 1997, eq. (3.19): var(tau_hat) ~ 2 (2M + 1) / N tau^2 for N draws in all.
      const sd = exact * Math.sqrt((2 * (2 * window + 1)) / (8 * 20_000));
      expect(converged).toBe(true);
      // The window truncates sum_{t>M} phi^t: a bias of -2 phi^(M+1)/(1-phi), below 1e-2 tau here.
      expect(Math.abs(tau - exact)).toBeLessThan(5 * sd + 0.01 * exact);
    }
  });

  it('white noise has tau near 1 and a constant chain returns 1', () => {
    const random = new Random(5);
    const white = Float64Array.from({ length: 50_000 }, () => random.normal());
    const { tau, window } = integratedAutocorrelationTime([white]);
    expect(Math.abs(tau - 1)).toBeLessThan(5 * Math.sqrt((2 * (2 * window + 1)) / 50_000));
    expect(integratedAutocorrelationTime([new Float64Array(100).fill(2)]).tau).toBe(1);
  });
});
