import { describe, expect, it } from 'vitest';
import { kernelZ1, kernelZ2, type BiasForKernels } from '../../src/perturbation/kernels.js';
import { signedFrequency } from '../../src/numerics/fft-3d.js';
import { fundamentalFrequency } from '../../src/numerics/lattice-shell.js';
import { gaussianFieldSpectrum } from '../../src/mocks/gaussian-field.js';
import { secondOrderGalaxySpectrum } from '../../src/mocks/second-order-field.js';

const n = 8;
const mesh = { n, boxSize: 400 };
const kf = fundamentalFrequency(mesh.boxSize);
const nzHalf = n / 2 + 1;

/** F at any signed vector from the half-complex spectrum, F(-k) = conj F(k). */
function valueAt(spec: Float64Array, x: number, y: number, z: number): [number, number] {
  const s = z < 0 ? -1 : 1;
  const c = ((((s * x) % n) + n) % n) * n * nzHalf + ((((s * y) % n) + n) % n) * nzHalf + s * z;
  return [spec[2 * c], s * spec[2 * c + 1]];
}

describe('second-order redshift-space field', () => {
  it('equals the brute-force Z2 convolution of the dealiased linear field on every kept mode', () => {
    const bias: BiasForKernels = { b1: 1.7, b2: -0.6, bG2: -0.3, f: 0.8 };
    const linear = gaussianFieldSpectrum(mesh, (k) => 1e4 * Math.exp(-k / 0.05), 5);
    const out = secondOrderGalaxySpectrum(linear, mesh, bias);
    const kept: number[][] = [];
    for (let x = -3; x <= 3; x++) for (let y = -3; y <= 3; y++) for (let z = -3; z <= 3; z++) {
      const n2 = x * x + y * y + z * z;
      if (n2 > 0 && 9 * n2 < n * n) kept.push([x, y, z]);
    }
    let worst = 0;
    let scale = 0;
    let checked = 0;
    for (const [mx, my, mz] of kept) {
      if (mz < 0) continue;
      let re = 0;
      let im = 0;
      for (const [ax, ay, az] of kept) {
        const [bx, by, bz] = [mx - ax, my - ay, mz - az];
        const b2n = bx * bx + by * by + bz * bz;
        if (b2n === 0 || 9 * b2n >= n * n) continue;
        const ka = kf * Math.hypot(ax, ay, az);
        const kb = kf * Math.sqrt(b2n);
        const muAB = (kf * kf * (ax * bx + ay * by + az * bz)) / (ka * kb);
        const z2 = kernelZ2(bias, ka, kb, muAB, (kf * az) / ka, (kf * bz) / kb);
        const [ar, ai] = valueAt(linear, ax, ay, az);
        const [br, bi] = valueAt(linear, bx, by, bz);
        re += z2 * (ar * br - ai * bi);
        im += z2 * (ar * bi + ai * br);
      }
      const k = kf * Math.hypot(mx, my, mz);
      const z1 = kernelZ1(bias.b1, bias.f, (kf * mz) / k);
      const [lr, li] = valueAt(linear, mx, my, mz);
      const expRe = z1 * lr + re / n ** 3; // discrete convolution theorem: FT[a b] = n^-3 (A * B)
      const expIm = z1 * li + im / n ** 3;
      const [gr, gi] = valueAt(out, mx, my, mz);
      worst = Math.max(worst, Math.abs(gr - expRe), Math.abs(gi - expIm));
      scale = Math.max(scale, Math.abs(re / n ** 3), Math.abs(im / n ** 3));
      checked++;
    }
    expect(checked).toBeGreaterThan(30);
    expect(scale).toBeGreaterThan(0);
    expect(worst).toBeLessThan(1e-10 * scale);
  });

  it('zeroes the modes at and beyond n/3 k_f', () => {
    const linear = gaussianFieldSpectrum(mesh, () => 1e4, 9);
    const out = secondOrderGalaxySpectrum(linear, mesh, { b1: 1, b2: 1, bG2: 0, f: 0.5 });
    let beyond = 0;
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) for (let z = 0; z < nzHalf; z++) {
      const x = signedFrequency(a, n);
      const y = signedFrequency(b, n);
      if (9 * (x * x + y * y + z * z) >= n * n) {
        const c = (a * n + b) * nzHalf + z;
        beyond = Math.max(beyond, Math.abs(out[2 * c]), Math.abs(out[2 * c + 1]));
      }
    }
    expect(beyond).toBe(0);
  });
});
