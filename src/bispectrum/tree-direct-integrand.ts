import { kernelZ1, kernelZ2, type BiasForKernels } from '../perturbation/kernels.js';
import type { TriangleIntegrand } from './triangle-integrand.js';
import { fillTrianglePhysics, TRIANGLE_SCRATCH_SIZE } from './triangle-physics.js';
import type { TreeBispectrumParameters } from './tree-template-terms.js';
import { resolveTreeSettings, type ResolvedTreeSettings, type TreeBispectrumSettings } from './tree-settings.js';

/**
 * The tree-level redshift-space galaxy bispectrum itself (one value) for given
 * parameters, straight from the kernels Z1 and Z2 (Scoccimarro, Couchman &
 * Frieman 1999, eq. 14):
 *   B = D_FoG [2 Z1(q1) Z1(q2) Z2(q1, q2) P1 P2 + 2 cyclic] / (apar aperp^2)^2
 *     + [A_P (1/nbar) sum_i b1 Z1(q_i) P_i + A_0 / nbar^2] / (apar aperp^2)^2.
 * The template path (TreeTemplateIntegrand) must agree with it.
 */
export class TreeDirectIntegrand implements TriangleIntegrand {
  readonly size = 1;
  readonly settings: ResolvedTreeSettings;
  private readonly params: TreeBispectrumParameters;
  private readonly scratch = new Float64Array(TRIANGLE_SCRATCH_SIZE);

  constructor(settings: TreeBispectrumSettings | ResolvedTreeSettings, params: TreeBispectrumParameters) {
    this.settings = 'inverseDensity' in settings ? settings : resolveTreeSettings(settings);
    this.params = params;
  }

  evaluate(k1: number, k2: number, k3: number, mu1: number, mu2: number, mu3: number, out: Float64Array, offset: number): void {
    const s = this.scratch;
    fillTrianglePhysics(this.settings, k1, k2, k3, mu1, mu2, mu3, s);
    const p = this.params;
    const z1a = kernelZ1(p.b1, p.f, s[3]);
    const z1b = kernelZ1(p.b1, p.f, s[4]);
    const z1c = kernelZ1(p.b1, p.f, s[5]);
    const det =
      2 * z1a * z1b * pairZ2(p, s, 0, 1, 2) * s[6] * s[7] +
      2 * z1b * z1c * pairZ2(p, s, 1, 2, 0) * s[7] * s[8] +
      2 * z1c * z1a * pairZ2(p, s, 2, 0, 1) * s[8] * s[6];
    const n1 = this.settings.inverseDensity;
    const stoch = p.bispShotPower * n1 * p.b1 * (z1a * s[6] + z1b * s[7] + z1c * s[8]) + p.bispShotConst * n1 * n1;
    out[offset] = s[10] * (s[9] * det + stoch);
  }
}

function pairZ2(p: BiasForKernels, s: Float64Array, a: number, b: number, c: number): number {
  const qa = s[a];
  const qb = s[b];
  const cosAB = (s[c] * s[c] - qa * qa - qb * qb) / (2 * qa * qb);
  return kernelZ2(p, qa, qb, cosAB, s[3 + a], s[3 + b]);
}
