import { describe, expect, it } from 'vitest';
import { sampledParametersFromPriors } from '../../../src/inference/sampling/sampled-parameters-from-priors.js';
import { validateSampledParameters } from '../../../src/inference/sampling/sampled-parameter.js';

describe('sampler parameters from priors', () => {
  it('takes bounds from the prior support and a start ball from its width or sigma', () => {
    const list = sampledParametersFromPriors({
      free: ['b1', 'h', 'mNu'],
      priors: [
        { kind: 'uniform', min: 0.5, max: 3.5 },
        { kind: 'gaussian', mean: 0.7, sigma: 0.02, min: 0.5 },
        { kind: 'log-uniform', min: 0.01, max: 1 },
      ],
      starts: Float64Array.of(2, 0.68, 0.06),
    });
    expect(list).toEqual([
      { name: 'b1', lower: 0.5, upper: 3.5, start: 2, scale: 0.03 },
      { name: 'h', lower: 0.5, upper: Infinity, start: 0.68, scale: 0.002 },
      { name: 'mNu', lower: 0.01, upper: 1, start: 0.06, scale: 0.0099 },
    ]);
    expect(validateSampledParameters(list).map((p) => p.name)).toEqual(['b1', 'h', 'mNu']);
  });
});
