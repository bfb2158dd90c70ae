import { describe, expect, it } from 'vitest';
import { choleskyFactor, solveLower } from '../../../src/data/covariance/cholesky-factor.js';
import { marginaliseSellentinHeavens, sellentinHeavensLogLikelihood } from '../../../src/inference/likelihood/linear-marginalisation.js';
import { gaussLegendreOn } from '../../../src/numerics/gauss-legendre.js';
import { DenseGaussian, randomCovariance, randomVector } from './support/dense-reference.js';
import { fixtures } from './support/scipy-fixtures.js';

describe('Sellentin–Heavens t-distribution likelihood', () => {
  it('matches its published formula as a scipy multivariate t (Sellentin & Heavens 2016, MNRAS 456, L132, eq. 6)', () => {
    // The fixture evaluates scipy.stats.multivariate_t with df = N_s - p and
    // shape S (N_s - 1)/(N_s - p), which is eq. 6 rewritten; here the code's own form is evaluated.
    const t = fixtures.t_distribution;
    const p = t.mean.length;
    const s = Float64Array.from(t.covariance.flat());
    const dense = new DenseGaussian(s, p);
    t.points.forEach((x, i) => {
      const chi2 = dense.chi2(Float64Array.from(x), Float64Array.from(t.mean));
      expect(sellentinHeavensLogLikelihood(chi2, dense.logDet, p, t.ns)).toBeCloseTo(t.logpdf[i], 9);
    });
  });

  it('tends to the Gaussian likelihood for many realisations (common practice)', () => {
    const chi2 = 7.3;
    const logDet = 2.1;
    const p = 5;
    const gauss = -0.5 * (chi2 + logDet + p * Math.log(2 * Math.PI));
    expect(Math.abs(sellentinHeavensLogLikelihood(chi2, logDet, p, 1e7) - gauss)).toBeLessThan(1e-5);
    expect(Math.abs(sellentinHeavensLogLikelihood(chi2, logDet, p, 30) - gauss)).toBeGreaterThan(1e-2);
  });

  it('integrated over 2 flat linear parameters equals brute-force integration of the t-distribution', () => {
    const n = 8;
    const ns = 25;
    const cov = randomCovariance(n, 3);
    const dense = new DenseGaussian(cov, n);
    const factor = choleskyFactor(cov, n);
    const k = Float64Array.from({ length: n }, (_, i) => 0.5 + i * 0.25);
    const cols = [Float64Array.from(k, () => 1), Float64Array.from(k, (v) => v)];
    const data = randomVector(n, 9, 1, 3);
    const logLAt = (theta: number[]) => {
      const m = Float64Array.from(k, (_, i) => theta[0] * cols[0][i] + theta[1] * cols[1][i]);
      return sellentinHeavensLogLikelihood(dense.chi2(data, m), dense.logDet, n, ns);
    };
    const res = marginaliseSellentinHeavens(solveLower(factor, data), cols.map((c) => solveLower(factor, c)), factor.logDet, ns, ['a', 'b']);
    // Wide box (the t tails are heavier than Gaussian), centred on the best fit.
    const rules = [0, 1].map((j) => gaussLegendreOn(160, res.bestFit[j] - 60, res.bestFit[j] + 60));
    const ref = logLAt([res.bestFit[0], res.bestFit[1]]);
    let sum = 0;
    for (let a = 0; a < 160; a++) for (let b = 0; b < 160; b++) sum += rules[0].weights[a] * rules[1].weights[b] * Math.exp(logLAt([rules[0].nodes[a], rules[1].nodes[b]]) - ref);
    expect(Math.abs(res.logLikelihood - (ref + Math.log(sum)))).toBeLessThan(1e-6);
  });
});
