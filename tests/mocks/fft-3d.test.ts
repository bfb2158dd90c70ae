import { describe, expect, it } from 'vitest';
import { RealFourier3d, signedFrequency } from '../../src/numerics/fft-3d.js';
import { numpyMockFixture } from './numpy-fixture.js';

describe('3-D real FFT', () => {
  it('matches numpy.fft.rfftn on an 8^3 field (tests/fixtures/numpy-mocks)', () => {
    const { n, field, re, im } = numpyMockFixture.fft;
    const f = new RealFourier3d(n);
    const spec = f.forward(Float64Array.from(field));
    let worst = 0;
    for (let c = 0; c < re.length; c++) {
      worst = Math.max(worst, Math.abs(spec[2 * c] - re[c]), Math.abs(spec[2 * c + 1] - im[c]));
    }
    expect(worst).toBeLessThan(1e-12);
  });

  it('inverts its forward transform and leaves the input alone', () => {
    const n = 16;
    const f = new RealFourier3d(n);
    const x = new Float64Array(n ** 3).map((_, i) => Math.sin(0.37 * i) + ((i * 7919) % 13) / 13);
    const copy = x.slice();
    const spec = f.forward(x);
    const specCopy = spec.slice();
    const back = f.inverse(spec);
    expect(x).toEqual(copy);
    expect(spec).toEqual(specCopy);
    let worst = 0;
    for (let i = 0; i < x.length; i++) worst = Math.max(worst, Math.abs(back[i] - x[i]));
    expect(worst).toBeLessThan(1e-12);
  });

  it('puts a plane wave exp(2 pi i k.x/n) at the signed frequency k', () => {
    const n = 8;
    const f = new RealFourier3d(n);
    const [kx, ky, kz] = [-3, 2, 1];
    const x = new Float64Array(n ** 3);
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) for (let c = 0; c < n; c++) {
      x[(a * n + b) * n + c] = Math.cos((2 * Math.PI * (kx * a + ky * b + kz * c)) / n);
    }
    const spec = f.forward(x);
    let peak = -1;
    let others = 0;
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) for (let c = 0; c <= n / 2; c++) {
      const idx = (a * n + b) * f.nzHalf + c;
      const amp = Math.hypot(spec[2 * idx], spec[2 * idx + 1]);
      if (signedFrequency(a, n) === kx && signedFrequency(b, n) === ky && c === kz) peak = amp;
      else others = Math.max(others, amp);
    }
    expect(peak).toBeCloseTo(n ** 3 / 2, 9); // cos = (e^{+i} + e^{-i})/2; only +k has kz > 0
    expect(others).toBeLessThan(1e-9);
  });

  it('rejects sizes that are not powers of two', () => {
    expect(() => new RealFourier3d(12)).toThrow(/power of two/);
  });
});
