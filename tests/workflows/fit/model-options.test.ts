import { describe, expect, it } from 'vitest';
import { describeBispectrumModel } from '../../../src/workflows/fit/model-options.js';

describe('the bispectrum model as printed among a fit\'s assumptions', () => {
  it('says how the BAO damping enters, the fingers-of-god damping and the bin average', () => {
    expect(describeBispectrumModel(undefined)).toMatch(/IR resummation in each P .*bin average continuous$/);
    expect(describeBispectrumModel({ bispectrum: { irResummation: 'angle-averaged' } })).toMatch(/BAO damping averaged over the line of sight \(an approximation/);
    expect(describeBispectrumModel({ bispectrum: { irResummation: false, velocityDispersion: 4, averaging: 'effective' } })).toMatch(
      /no IR resummation, fingers-of-god damping sigma_v = 4 Mpc\/h; bin average effective$/,
    );
  });
});
