import { Random } from '../../../src/numerics/random.js';

/** Bias, growth and stochastic parameters drawn over physically sensible ranges. */
export function randomTreeParameters(rng: Random): Record<string, number> {
  return {
    b1: 1 + 2 * rng.uniform(),
    b2: -1 + 2 * rng.uniform(),
    bG2: -0.8 + 1.2 * rng.uniform(),
    f: 0.4 + 0.6 * rng.uniform(),
    bispShotPower: 2 * rng.uniform(),
    bispShotConst: 2 * rng.uniform(),
  };
}
