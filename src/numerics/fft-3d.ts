import FFT from 'fft.js';

/**
 * Three-dimensional discrete Fourier transform of a real field on an n^3 grid
 * (n a power of two), built from the radix-4 one-dimensional transforms of
 * fft.js. Sign and normalisation (the numpy.fft convention):
 *   forward:  F[k] = sum_x f[x] exp(-2 pi i k.x / n)        (no factor)
 *   inverse:  f[x] = n^-3 sum_k F[k] exp(+2 pi i k.x / n)
 *
 * Layouts. Real fields: Float64Array of n^3, index (ix n + iy) n + iz.
 * Spectra keep the half of the modes with kz >= 0 (the rest follow from
 * F[-k] = conj F[k]): interleaved (re, im) Float64Array of 2 n n (n/2 + 1),
 * complex index (ix n + iy)(n/2 + 1) + iz, with ix, iy in 0..n-1 standing for
 * the signed frequencies of `signedFrequency` and iz in 0..n/2.
 */
export class RealFourier3d {
  readonly n: number;
  /** n/2 + 1: length of the last (kz) axis of a spectrum. */
  readonly nzHalf: number;
  private readonly line: FFT;
  private readonly bufIn: Float64Array;
  private readonly bufOut: Float64Array;
  private readonly realRow: Float64Array;

  constructor(n: number) {
    if (!Number.isInteger(n) || n < 2 || (n & (n - 1)) !== 0) {
      throw new RangeError(`RealFourier3d: the grid size must be a power of two >= 2, got ${n}`);
    }
    this.n = n;
    this.nzHalf = n / 2 + 1;
    this.line = new FFT(n);
    this.bufIn = new Float64Array(2 * n);
    this.bufOut = new Float64Array(2 * n);
    this.realRow = new Float64Array(n);
  }

  /** Number of Float64 values in a spectrum: 2 n n (n/2 + 1). */
  get spectrumLength(): number {
    return 2 * this.n * this.n * this.nzHalf;
  }

  createSpectrum(): Float64Array {
    return new Float64Array(this.spectrumLength);
  }

  createField(): Float64Array {
    return new Float64Array(this.n ** 3);
  }

  /** Forward transform of `field` (left untouched) into `out`. */
  forward(field: Float64Array, out: Float64Array = this.createSpectrum()): Float64Array {
    const { n, nzHalf, line, bufOut, realRow } = this;
    this.checkLengths(field, out);
    for (let row = 0; row < n * n; row++) {
      realRow.set(field.subarray(row * n, row * n + n));
      line.realTransform(bufOut, realRow);
      out.set(bufOut.subarray(0, 2 * nzHalf), 2 * row * nzHalf);
    }
    this.transformStrided(out, nzHalf, n * nzHalf, false); // y axis
    this.transformStrided(out, n * nzHalf, nzHalf, false); // x axis
    return out;
  }

  /** Inverse transform of `spectrum` (left untouched) into `out`, with the 1/n^3 factor. */
  inverse(spectrum: Float64Array, out: Float64Array = this.createField(), scratch?: Float64Array): Float64Array {
    const { n, nzHalf, line, bufIn, bufOut } = this;
    this.checkLengths(out, spectrum);
    const work = scratch ?? new Float64Array(spectrum.length);
    if (work.length !== spectrum.length) throw new RangeError('RealFourier3d.inverse: scratch has the wrong length');
    work.set(spectrum);
    this.transformStrided(work, n * nzHalf, nzHalf, true); // x axis
    this.transformStrided(work, nzHalf, n * nzHalf, true); // y axis
    for (let row = 0; row < n * n; row++) {
      const base = 2 * row * nzHalf;
      for (let k = 0; k < nzHalf; k++) {
        bufIn[2 * k] = work[base + 2 * k];
        bufIn[2 * k + 1] = work[base + 2 * k + 1];
      }
      for (let k = nzHalf; k < n; k++) {
        bufIn[2 * k] = work[base + 2 * (n - k)];
        bufIn[2 * k + 1] = -work[base + 2 * (n - k) + 1];
      }
      line.inverseTransform(bufOut, bufIn);
      const o = row * n;
      for (let z = 0; z < n; z++) out[o + z] = bufOut[2 * z];
    }
    return out;
  }

  /**
   * Complex transforms of length n along one axis of a spectrum: `stride` is
   * the complex-index step along that axis, `outer` the step between the
   * starts of the lines along the other grid axis.
   */
  private transformStrided(data: Float64Array, stride: number, outer: number, inverse: boolean): void {
    const { n, nzHalf, line, bufIn, bufOut } = this;
    for (let a = 0; a < n; a++) {
      for (let iz = 0; iz < nzHalf; iz++) {
        const start = a * outer + iz;
        for (let m = 0; m < n; m++) {
          const c = 2 * (start + m * stride);
          bufIn[2 * m] = data[c];
          bufIn[2 * m + 1] = data[c + 1];
        }
        if (inverse) line.inverseTransform(bufOut, bufIn);
        else line.transform(bufOut, bufIn);
        for (let m = 0; m < n; m++) {
          const c = 2 * (start + m * stride);
          data[c] = bufOut[2 * m];
          data[c + 1] = bufOut[2 * m + 1];
        }
      }
    }
  }

  private checkLengths(field: Float64Array, spectrum: Float64Array): void {
    if (field.length !== this.n ** 3) throw new RangeError(`RealFourier3d: a field needs ${this.n ** 3} values, got ${field.length}`);
    if (spectrum.length !== this.spectrumLength) {
      throw new RangeError(`RealFourier3d: a spectrum needs ${this.spectrumLength} values, got ${spectrum.length}`);
    }
  }
}

/** Signed frequency of grid index i on an axis of n points: 0..n/2-1, then -n/2..-1. */
export function signedFrequency(i: number, n: number): number {
  return i < n / 2 ? i : i - n;
}
