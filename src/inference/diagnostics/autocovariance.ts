import FFT from 'fft.js';

const transforms = new Map<number, FFT>();
function transformOfSize(size: number): FFT {
  let t = transforms.get(size);
  if (t === undefined) {
    t = new FFT(size);
    transforms.set(size, t);
  }
  return t;
}

/**
 * Sum over equal-length series of their autocovariances, each about its own
 * mean with the biased normalisation
 *   acov[t] = (1/n) sum_{i=0}^{n-1-t} (x_i - mean)(x_{i+t} - mean),  t = 0..n-1,
 * by FFT zero-padded to a power of two >= 2n (no wrap-around). Two real
 * series share one complex transform (x in the real part, y in the
 * imaginary): |X_k|^2 + |Y_k|^2 = (|Z_k|^2 + |Z_{N-k}|^2) / 2; the power
 * spectra are summed and transformed back once.
 */
export function summedAutocovariance(series: readonly ArrayLike<number>[]): Float64Array {
  const n = series.length === 0 ? 0 : series[0].length;
  const out = new Float64Array(n);
  if (n === 0) return out;
  let size = 4;
  while (size < 2 * n) size *= 2;
  const fft = transformOfSize(size);
  const input = new Float64Array(2 * size);
  const spectrum = new Float64Array(2 * size);
  const power = new Float64Array(2 * size);
  for (let s = 0; s < series.length; s += 2) {
    input.fill(0);
    for (let part = 0; part < 2 && s + part < series.length; part++) {
      const x = series[s + part];
      if (x.length !== n) throw new RangeError('summedAutocovariance: series of unequal length');
      let mean = 0;
      for (let i = 0; i < n; i++) mean += x[i];
      mean /= n;
      for (let i = 0; i < n; i++) input[2 * i + part] = x[i] - mean;
    }
    fft.transform(spectrum, input);
    for (let k = 0; k < size; k++) {
      const m = (size - k) % size;
      const a = spectrum[2 * k] ** 2 + spectrum[2 * k + 1] ** 2;
      const b = spectrum[2 * m] ** 2 + spectrum[2 * m + 1] ** 2;
      power[2 * k] += 0.5 * (a + b);
    }
  }
  fft.inverseTransform(spectrum, power); // fft.js's inverse includes the 1/size factor
  for (let t = 0; t < n; t++) out[t] = spectrum[2 * t] / n;
  return out;
}

/** Autocovariance of one series (see summedAutocovariance). */
export function autocovariance(series: ArrayLike<number>): Float64Array {
  return summedAutocovariance([series]);
}
