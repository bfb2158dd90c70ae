import FFT from 'fft.js';

/**
 * Autocovariance of a series about its own mean, by FFT with zero padding
 * to a power of two >= 2n (no circular wrap-around). Biased normalisation:
 * acov[t] = (1/n) sum_{i=0}^{n-1-t} (x_i - mean)(x_{i+t} - mean), t = 0..n-1.
 */
export function autocovariance(series: ArrayLike<number>): Float64Array {
  const n = series.length;
  const out = new Float64Array(n);
  if (n === 0) return out;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += series[i];
  mean /= n;
  let size = 4;
  while (size < 2 * n) size *= 2;
  const fft = new FFT(size);
  const input = new Float64Array(2 * size);
  for (let i = 0; i < n; i++) input[2 * i] = series[i] - mean;
  const spectrum = new Float64Array(2 * size);
  fft.transform(spectrum, input);
  for (let k = 0; k < size; k++) {
    const re = spectrum[2 * k];
    const im = spectrum[2 * k + 1];
    spectrum[2 * k] = re * re + im * im;
    spectrum[2 * k + 1] = 0;
  }
  fft.inverseTransform(input, spectrum); // fft.js's inverse includes the 1/size factor
  for (let t = 0; t < n; t++) out[t] = input[2 * t] / n;
  return out;
}
