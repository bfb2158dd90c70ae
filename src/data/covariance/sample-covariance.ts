import { InputError } from '../../contracts/input-error.js';

/**
 * Sample mean and unbiased sample covariance of N_s realisations (rows):
 * C = sum_r (x_r - mean)(x_r - mean)^T / (N_s - 1), row-major.
 */
export function sampleCovariance(realisations: readonly Float64Array[]): { mean: Float64Array; covariance: Float64Array; size: number; count: number } {
  const ns = realisations.length;
  if (ns < 2) throw new InputError(`sample covariance: needs at least 2 realisations, got ${ns}`, { where: 'realisations' });
  const n = realisations[0].length;
  realisations.forEach((r, i) => {
    if (r.length !== n) throw new InputError(`sample covariance: realisation ${i + 1} has ${r.length} entries, the first has ${n}`, { where: 'realisations' });
  });
  const mean = new Float64Array(n);
  for (const r of realisations) for (let i = 0; i < n; i++) mean[i] += r[i] / ns;
  const cov = new Float64Array(n * n);
  const d = new Float64Array(n);
  for (const r of realisations) {
    for (let i = 0; i < n; i++) d[i] = r[i] - mean[i];
    for (let i = 0; i < n; i++) {
      const di = d[i];
      const row = i * n;
      for (let j = 0; j <= i; j++) cov[row + j] += di * d[j];
    }
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const v = cov[i * n + j] / (ns - 1);
      cov[i * n + j] = v;
      cov[j * n + i] = v;
    }
  }
  return { mean, covariance: cov, size: n, count: ns };
}

/**
 * Hartlap, Simon & Schneider 2007 (A&A 464, 399, eq. 17; equation number from memory): the unbiased inverse
 * covariance is (N_s - N_d - 2)/(N_s - 1) times the inverse sample covariance.
 */
export function hartlapFactor(nSamples: number, nData: number): number {
  if (nSamples - nData - 2 <= 0) {
    throw new InputError(`Hartlap correction: ${nSamples} realisations are too few for ${nData} data points (needs N_s > N_d + 2)`, { where: 'covariance' });
  }
  return (nSamples - nData - 2) / (nSamples - 1);
}

/**
 * Percival et al. 2014 (MNRAS 439, 2531, eqs. 18 and 22; from memory) factors by
 * which the noise of a mock covariance inflates parameter variances, for N_s
 * mocks, N_d data points and N_p free parameters:
 *   A = 2 / [(N_s - N_d - 1)(N_s - N_d - 4)],  B = (N_s - N_d - 2) / [(N_s - N_d - 1)(N_s - N_d - 4)],
 *   m1 = [1 + B (N_d - N_p)] / [1 + A + B (N_p + 1)]   (variance from the likelihood width),
 *   m2 = m1 (N_s - 1) / (N_s - N_d - 2)                 (variance of best fits among mocks).
 */
export function percivalInflation(nSamples: number, nData: number, nParameters: number): { m1: number; m2: number } {
  const r = nSamples - nData;
  if (r - 4 <= 0) throw new InputError(`Percival et al. inflation: ${nSamples} realisations are too few for ${nData} data points (needs N_s > N_d + 4)`, { where: 'covariance' });
  const a = 2 / ((r - 1) * (r - 4));
  const b = (r - 2) / ((r - 1) * (r - 4));
  const m1 = (1 + b * (nData - nParameters)) / (1 + a + b * (nParameters + 1));
  return { m1, m2: (m1 * (nSamples - 1)) / (r - 2) };
}
