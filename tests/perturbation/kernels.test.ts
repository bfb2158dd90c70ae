import { describe, expect, it } from 'vitest';
import {
  bs2ToGalileon,
  galileonToBs2,
  kernelF2,
  kernelG2,
  kernelGalileonTidal,
  kernelZ1,
  kernelZ2,
} from '../../src/perturbation/kernels.js';
import { gaussLegendre } from '../../src/numerics/gauss-legendre.js';

describe('second-order kernels', () => {
  it('F2 is 2/7 for an equilateral triangle, 0 for k2 = -k1 and 2 for k2 = k1 (REFERENCES.md; Bernardeau et al. 2002 eq. 45)', () => {
    expect(kernelF2(0.1, 0.1, -0.5)).toBeCloseTo(2 / 7, 15);
    expect(kernelF2(0.07, 0.07, -1)).toBeCloseTo(0, 15);
    expect(kernelF2(0.07, 0.07, 1)).toBeCloseTo(2, 15);
  });

  it('G2 vanishes for k2 = -k1 (momentum conservation; Bernardeau et al. 2002 eq. 46)', () => {
    expect(kernelG2(0.05, 0.05, -1)).toBeCloseTo(0, 15);
    expect(kernelG2(0.05, 0.05, 1)).toBeCloseTo(2, 15);
  });

  it('the angular mean of F2 at fixed lengths is 17/21 (from memory: the monopole of F2)', () => {
    const { nodes, weights } = gaussLegendre(4);
    let mean = 0;
    for (let i = 0; i < nodes.length; i++) mean += 0.5 * weights[i] * kernelF2(0.03, 0.11, nodes[i]);
    expect(mean).toBeCloseTo(17 / 21, 14);
  });

  it('the Galileon tidal kernel is mu^2 - 1 (docs/conventions.md) and vanishes for parallel vectors', () => {
    expect(kernelGalileonTidal(1)).toBe(0);
    expect(kernelGalileonTidal(0)).toBe(-1);
    expect(kernelGalileonTidal(0.5)).toBeCloseTo(-0.75, 15);
  });

  it('Z2 reduces to b1 F2 + b2/2 + bG2 sigma^2 when f = 0 and to F2 for unbiased matter (Scoccimarro et al. 1999 eq. 13)', () => {
    const p = { b1: 1.7, b2: 0.3, bG2: -0.2, f: 0 };
    const z2 = kernelZ2(p, 0.1, 0.06, 0.3, 0.4, -0.7);
    expect(z2).toBeCloseTo(1.7 * kernelF2(0.1, 0.06, 0.3) + 0.15 - 0.2 * (0.09 - 1), 14);
    expect(kernelZ2({ b1: 1, b2: 0, bG2: 0, f: 0 }, 0.1, 0.06, 0.3, 0.2, 0.9)).toBeCloseTo(kernelF2(0.1, 0.06, 0.3), 15);
    expect(kernelZ1(2, 0.8, 0.5)).toBeCloseTo(2.2, 15);
  });

  it('Z2 along the line of sight for k1 = k2 gives b1 F2 + f G2 + f b1 + f^2 (Scoccimarro et al. 1999 eq. 13 with mu = mu1 = mu2 = 1)', () => {
    const b1 = 1.5;
    const f = 0.8;
    // k1 = k2 parallel to the line of sight: F2 = G2 = 2, the velocity term is (f k/2)(2/k)(b1 + f) with k = 2 k1.
    const z2 = kernelZ2({ b1, b2: 0, bG2: 0, f }, 0.05, 0.05, 1, 1, 1);
    expect(z2).toBeCloseTo(2 * b1 + 2 * f + 2 * f * (b1 + f), 13);
  });
});

describe('b_s2 convention', () => {
  it('b2/2 + bG2 sigma^2 equals b2\'/2 + (b_s2/2)(mu^2 - 1/3) for any angle (kernel identity sigma^2 = S2 - 2/3)', () => {
    const b2 = 0.37;
    const bG2 = -0.21;
    const { b2: b2s, bs2 } = galileonToBs2(b2, bG2);
    for (const mu of [-1, -0.4, 0, 0.25, 0.9]) {
      expect(b2 / 2 + bG2 * kernelGalileonTidal(mu)).toBeCloseTo(b2s / 2 + (bs2 / 2) * (mu * mu - 1 / 3), 15);
    }
    const back = bs2ToGalileon(b2s, bs2);
    expect(back.b2).toBeCloseTo(b2, 15);
    expect(back.bG2).toBeCloseTo(bG2, 15);
  });

  it('maps the local-Lagrangian bG2 = -2/7 (b1 - 1) to b_s2 = -4/7 (b1 - 1) (common practice; Baldauf et al. 2012, Chan et al. 2012)', () => {
    const b1 = 2.1;
    expect(galileonToBs2(0, (-2 / 7) * (b1 - 1)).bs2).toBeCloseTo((-4 / 7) * (b1 - 1), 15);
  });
});
