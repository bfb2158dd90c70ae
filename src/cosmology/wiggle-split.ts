import { CubicSpline, LogLogSpline } from '../numerics/cubic-spline.js';

/** Default width of the Gaussian smoothing in log10 k. */
export const DEFAULT_SMOOTHING_WIDTH_DEX = 0.25;

/**
 * No-wiggle part of a tabulated spectrum by Gaussian smoothing in log k of its
 * ratio to a smooth reference (Vlah, Seljak, Chu & Feng 2016, JCAP 03 (2016)
 * 057, appendix; width 0.25 in log10 k from memory):
 *   P_nw(k) = P_ref(k) * int dlog q  W(log k - log q) P(q) / P_ref(q),
 * W a unit-normalised Gaussian. The reference is the EH98 no-wiggle form of the
 * same cosmology, so the ratio is nearly flat and the smoothing only removes the
 * oscillations. Beyond the table the ratio is held at its end values.
 * Returns P_nw at the table wavenumbers.
 */
export function noWiggleByLogGaussianFilter(
  k: Float64Array,
  p: Float64Array,
  reference: (k: number) => number,
  widthDex = DEFAULT_SMOOTHING_WIDTH_DEX,
  samples = 1024,
): Float64Array {
  const n = k.length;
  const table = new LogLogSpline(k, p);
  const u0 = Math.log10(k[0]);
  const du = (Math.log10(k[n - 1]) - u0) / (samples - 1);
  const u = new Float64Array(samples);
  const ratio = new Float64Array(samples);
  for (let j = 0; j < samples; j++) {
    u[j] = u0 + j * du;
    const kj = 10 ** u[j];
    ratio[j] = table.at(kj) / reference(kj);
  }
  const half = Math.ceil((4 * widthDex) / du);
  const weights = new Float64Array(2 * half + 1);
  let norm = 0;
  for (let l = -half; l <= half; l++) {
    const t = (l * du) / widthDex;
    weights[l + half] = Math.exp(-0.5 * t * t);
    norm += weights[l + half];
  }
  const smooth = new Float64Array(samples);
  for (let j = 0; j < samples; j++) {
    let s = 0;
    for (let l = -half; l <= half; l++) {
      let m = j + l;
      if (m < 0) m = 0;
      else if (m >= samples) m = samples - 1;
      s += weights[l + half] * ratio[m];
    }
    smooth[j] = s / norm;
  }
  const smoothSpline = new CubicSpline(u, smooth);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = reference(k[i]) * smoothSpline.at(Math.log10(k[i]));
  return out;
}
