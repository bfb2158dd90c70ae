/**
 * Test target: a multivariate Gaussian log-density (normalisation dropped),
 * optionally busy-waiting `busyMs` per call to stand in for a slow likelihood,
 * or sleeping `sleepMs` (no CPU used: isolates the pool's parallelism from
 * competition for the cores).
 */
import { choleskyFactor, solveLower } from '../../../../src/data/covariance/cholesky-factor.js';

export interface GaussianTargetOptions {
  mean: number[];
  covariance: number[][];
  busyMs?: number;
  sleepMs?: number;
}

export function busyWait(ms: number): void {
  const until = performance.now() + ms;
  while (performance.now() < until) {
    // spin: a CPU-bound stand-in for a model evaluation
  }
}

export function gaussianTarget(options: GaussianTargetOptions): (theta: Float64Array) => number {
  const d = options.mean.length;
  const factor = choleskyFactor(Float64Array.from(options.covariance.flat()), d);
  const mean = Float64Array.from(options.mean);
  const diff = new Float64Array(d);
  const white = new Float64Array(d);
  const busyMs = options.busyMs ?? 0;
  const sleepMs = options.sleepMs ?? 0;
  const sleeper = new Int32Array(new SharedArrayBuffer(4));
  return (theta) => {
    if (busyMs > 0) busyWait(busyMs);
    if (sleepMs > 0) Atomics.wait(sleeper, 0, 0, sleepMs);
    for (let i = 0; i < d; i++) diff[i] = theta[i] - mean[i];
    solveLower(factor, diff, white);
    let q = 0;
    for (let i = 0; i < d; i++) q += white[i] * white[i];
    return -0.5 * q;
  };
}

/** C_ij = s_i s_j r^|i-j|: the correlated test Gaussian. */
export function bandedCovariance(sd: readonly number[], r: number): number[][] {
  return sd.map((si, i) => sd.map((sj, j) => si * sj * r ** Math.abs(i - j)));
}
