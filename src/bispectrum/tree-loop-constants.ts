import type { TreeBispectrumParameters } from './tree-template-terms.js';
import type { ResolvedTreeSettings } from './tree-settings.js';

/**
 * Per-evaluation constants of the B_l orientation loops (TreeMultipoleEvaluator
 * and tree-multipole-distorted.ts): the fingers-of-god switch and sigma_v^2/2,
 * the bias and growth parameters with b2/2 and f/2, and the stochastic terms
 * A_P b1 / nbar (times sum_i Z1_i P_i) and A_0 / nbar^2 summed over the phi
 * points of one mu node.
 */
export function directLoopConstants(s: ResolvedTreeSettings, p: TreeBispectrumParameters, phiCount: number) {
  const n1 = s.inverseDensity;
  return {
    fog: s.velocityDispersion > 0,
    halfSv2: 0.5 * s.velocityDispersion * s.velocityDispersion,
    b1: p.b1,
    bG2: p.bG2,
    f: p.f,
    hb2: 0.5 * p.b2,
    hf: 0.5 * p.f,
    stochConst: phiCount * p.bispShotConst * n1 * n1,
    stochP: p.bispShotPower * n1 * p.b1,
  };
}
