import { irResummedPower } from '../perturbation/ir-resummed-power.js';
import { kernelZ1 } from '../perturbation/kernels.js';
import { apVolumeFactor } from './alcock-paczynski.js';
import { reduceToMultipoles } from './bin-sampling.js';
import { trueCoordinates, type PowerModelSetup } from './power-model-setup.js';
import type { PowerParameters } from './power-parameters.js';

/**
 * Multipoles straight from the formula, point by point (no templates):
 *   P_obs(k, mu) = P_true(q, nu) / (alphaPar alphaPerp^2) + (s0 + s2 k^2 mu^2) / nbar,
 *   P_true = [Z1(q, nu)^2 - q^2 (c0 + c2 nu^2 + c4 nu^4) - cFog q^4 nu^4] P_IR(q, nu),
 * with Z1 = b1 + f(q) nu^2 (Kaiser 1987, MNRAS 227, 1) and P_IR the IR-resummed
 * spectrum of src/perturbation.
 * Stochastic terms live in observed coordinates (docs/conventions.md, power).
 */
export function evaluatePowerMultipolesDirect(setup: PowerModelSetup, p: PowerParameters, out?: Float64Array): Float64Array {
  const { spectrum, sampling, nbar, dampingGrowthRate } = setup;
  const { q, nu } = trueCoordinates(setup, p.alphaPar, p.alphaPerp);
  const volume = apVolumeFactor(p.alphaPar, p.alphaPerp);
  const values = new Float64Array(q.length);
  for (let j = 0; j < q.length; j++) {
    const qj = q[j];
    const n2 = nu[j] * nu[j];
    const fq = (p.f * spectrum.growthRate(qj)) / spectrum.growthRateLargeScale;
    const z1 = kernelZ1(p.b1, fq, nu[j]);
    const shape = z1 * z1 - qj * qj * (p.pCt0 + p.pCt2 * n2 + p.pCt4 * n2 * n2) - p.pCtFog * qj ** 4 * n2 * n2;
    const kmu = sampling.k[j] * sampling.mu[j];
    values[j] = shape * irResummedPower(spectrum, qj, nu[j], dampingGrowthRate) * volume + (p.pStochConst + p.pStochK2Mu2 * kmu * kmu) / nbar;
  }
  return reduceToMultipoles(sampling, values, out ?? new Float64Array(sampling.weights.length * sampling.binCount));
}
