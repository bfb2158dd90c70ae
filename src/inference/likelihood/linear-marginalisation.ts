import { lgamma } from 'mathjs';
import { InputError } from '../../contracts/input-error.js';
import { choleskyFactor, choleskySolve } from '../../data/covariance/cholesky-factor.js';

/**
 * Analytic marginalisation over parameters theta that enter the model
 * linearly, m = m0 + A theta (Taylor & Kitching 2010, MNRAS 408, 865).
 * Inputs are whitened by the covariance factor: r = L^{-1}(d - m0), a_j = L^{-1} A_j.
 *
 * Gaussian likelihood N(d; m, C/h) (h the Hartlap factor, 1 otherwise) with priors
 * N(theta_j; mu_j, sigma_j), or a flat unit-density prior when sigma_j = Infinity:
 *   F = h A^T C^{-1} A + diag(1/sigma^2),  b = h A^T C^{-1} (d - m0) + mu/sigma^2,
 *   ln L_marg = ln N_0 - (h r.r + sum mu^2/sigma^2 - b^T F^{-1} b)/2 - (ln det F)/2
 *               + (p/2) ln 2 pi - sum_gaussian ln(sigma sqrt(2 pi)),
 * ln N_0 = -(ln det(C/h) + n ln 2 pi)/2. The best-fit (conditional posterior mode)
 * is theta_hat = F^{-1} b.
 */
export interface LinearPrior {
  readonly mean: number;
  /** Infinity for a flat prior. */
  readonly sigma: number;
}

export interface MarginalResult {
  readonly logLikelihood: number;
  /** theta_hat = F^{-1} b. */
  readonly bestFit: Float64Array;
  /** Data chi-square h |r - a theta_hat|^2 at the best fit. */
  readonly chi2: number;
}

const LN_2PI = Math.log(2 * Math.PI);

function dot(x: Float64Array, y: Float64Array): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += x[i] * y[i];
  return s;
}

/** F (row-major p x p, data part only, times h) and the data part of b. */
function normalEquations(r: Float64Array, cols: readonly Float64Array[], h: number): { f: Float64Array; b: Float64Array } {
  const p = cols.length;
  const f = new Float64Array(p * p);
  const b = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    b[j] = h * dot(cols[j], r);
    for (let k = 0; k <= j; k++) f[j * p + k] = f[k * p + j] = h * dot(cols[j], cols[k]);
  }
  return { f, b };
}

function bestFitChi2(r: Float64Array, cols: readonly Float64Array[], theta: Float64Array, h: number): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) {
    let v = r[i];
    for (let j = 0; j < cols.length; j++) v -= cols[j][i] * theta[j];
    s += v * v;
  }
  return h * s;
}

function factorFisher(f: Float64Array, p: number, names: readonly string[]) {
  try {
    return choleskyFactor(f, p, 'linear-parameter Fisher matrix');
  } catch (e) {
    if (e instanceof InputError) {
      throw new InputError(`the data do not constrain the analytically marginalised parameters ${names.join(', ')} (${e.message}); give them Gaussian priors or do not marginalise them`, { where: 'parameters' });
    }
    throw e;
  }
}

export function marginaliseGaussian(r: Float64Array, cols: readonly Float64Array[], h: number, priors: readonly LinearPrior[], logDetC: number, names: readonly string[]): MarginalResult {
  const n = r.length;
  const p = cols.length;
  const { f, b } = normalEquations(r, cols, h);
  let priorQuad = 0;
  let priorNorm = 0;
  for (let j = 0; j < p; j++) {
    const { mean, sigma } = priors[j];
    if (sigma === Infinity) continue;
    const w = 1 / (sigma * sigma);
    f[j * p + j] += w;
    b[j] += mean * w;
    priorQuad += mean * mean * w;
    priorNorm += Math.log(sigma) + 0.5 * LN_2PI;
  }
  const factor = factorFisher(f, p, names);
  const theta = choleskySolve(factor, b);
  const chi2 = bestFitChi2(r, cols, theta, h);
  const logN0 = -0.5 * (logDetC - n * Math.log(h) + n * LN_2PI);
  const logLikelihood = logN0 - 0.5 * (h * dot(r, r) + priorQuad - dot(b, theta)) - 0.5 * factor.logDet + 0.5 * p * LN_2PI - priorNorm;
  return { logLikelihood, bestFit: theta, chi2 };
}

/**
 * Sellentin & Heavens 2016 (MNRAS 456, L132, eq. 6) likelihood with a sample
 * covariance S from N_s realisations, p data points:
 *   ln L = ln c_p - (ln det S)/2 - (N_s/2) ln[1 + chi2/(N_s - 1)],
 *   c_p = Gamma(N_s/2) / {[pi (N_s - 1)]^(p/2) Gamma((N_s - p)/2)}.
 */
export function sellentinHeavensLogLikelihood(chi2: number, logDetS: number, p: number, ns: number): number {
  const logC = lgamma(ns / 2) - 0.5 * p * Math.log(Math.PI * (ns - 1)) - lgamma((ns - p) / 2);
  return logC - 0.5 * logDetS - 0.5 * ns * Math.log1p(chi2 / (ns - 1));
}

/**
 * The same t-distribution integrated over linear parameters with flat priors:
 * chi2(theta) = chi2_min + (theta - theta_hat)^T F (theta - theta_hat), so with
 * nu = N_s - 1 + chi2_min the integral is a multivariate-t normalisation,
 *   ln L_marg = ln L_SH(chi2_min) + (q/2) ln(pi nu) - (ln det F)/2 + ln Gamma((N_s - q)/2) - ln Gamma(N_s/2)
 * for q marginalised parameters.
 */
export function marginaliseSellentinHeavens(r: Float64Array, cols: readonly Float64Array[], logDetS: number, ns: number, names: readonly string[]): MarginalResult {
  const q = cols.length;
  const { f, b } = normalEquations(r, cols, 1);
  const factor = factorFisher(f, q, names);
  const theta = choleskySolve(factor, b);
  const chi2 = bestFitChi2(r, cols, theta, 1);
  const nu = ns - 1 + chi2;
  const logLikelihood =
    sellentinHeavensLogLikelihood(chi2, logDetS, r.length, ns) + 0.5 * q * Math.log(Math.PI * nu) - 0.5 * factor.logDet + lgamma((ns - q) / 2) - lgamma(ns / 2);
  return { logLikelihood, bestFit: theta, chi2 };
}
