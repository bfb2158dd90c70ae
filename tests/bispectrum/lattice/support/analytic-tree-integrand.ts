import { kernelZ1, kernelZ2 } from '../../../../src/perturbation/kernels.js';
import type { TriangleIntegrand } from '../../../../src/bispectrum/triangle-integrand.js';

/**
 * Test-support integrand: a redshift-space tree-like bispectrum from the shared
 * kernels with an analytic power P(k) = A k / (1 + (k/0.05)^2)^2, and its
 * b1 Z1-weighted shot-noise-like piece. Not the project's model (src/bispectrum
 * owns that); just a realistic, mu-even function to exercise the machinery.
 */
export function analyticTreeIntegrand(amplitude: number): TriangleIntegrand {
  const bias = { b1: 1.8, b2: 0.4, bG2: -0.2, f: 0.75 };
  const p = (k: number): number => (amplitude * 3e5 * k) / (1 + (k / 0.05) ** 2) ** 2;
  const pair = (ka: number, kb: number, kc: number, ma: number, mb: number): number => {
    const cosAB = (kc * kc - ka * ka - kb * kb) / (2 * ka * kb);
    return 2 * kernelZ1(bias.b1, bias.f, ma) * kernelZ1(bias.b1, bias.f, mb) * kernelZ2(bias, ka, kb, cosAB, ma, mb) * p(ka) * p(kb);
  };
  return {
    size: 2,
    evaluate(k1, k2, k3, mu1, mu2, mu3, out, offset) {
      out[offset] = pair(k1, k2, k3, mu1, mu2) + pair(k2, k3, k1, mu2, mu3) + pair(k3, k1, k2, mu3, mu1);
      out[offset + 1] = kernelZ1(bias.b1, bias.f, mu1) * p(k1) + kernelZ1(bias.b1, bias.f, mu2) * p(k2) + kernelZ1(bias.b1, bias.f, mu3) * p(k3);
    },
  };
}
