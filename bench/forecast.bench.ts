import { loadavg } from 'node:os';
import type { Benchmark } from './harness.js';
import { timeMedian } from './harness.js';
import { FORECAST_DEFAULT_PARAMETERS, runForecast } from '../src/workflows/index.js';

/**
 * A 10-parameter P + B Fisher forecast (FORECAST_DEFAULT_PARAMETERS: h,
 * omegaCdm, lnAs, mNu, b1, b2, bG2, pStochConst, bispShotPower, pCt0) for one
 * redshift bin: P0, P2, P4 on k = 0.01..0.2 (dk 0.01, 20 bins) and B0 on the
 * triangle bins of shells 0.02..0.15 (dk 0.01), analytic Gaussian covariance.
 * Four cosmology parameters x two steps x two sides = 16 new linear spectra
 * and model builds; the linear amplitudes take exact columns. Timed whole
 * (P alone, B alone and P + B from the same evaluations), median of 3 after 1.
 */
const spec = {
  survey: { bins: [{ zMin: 0.4, zMax: 0.6, nbar: 3e-4, volume: 3e9 }] },
  parameters: [...FORECAST_DEFAULT_PARAMETERS],
  power: { kMin: 0.01, kMax: 0.2, dk: 0.01 },
  bispectrum: { kMin: 0.02, kMax: 0.15, dk: 0.01 },
};

const bench: Benchmark = {
  name: 'forecast',
  async run() {
    const loadAtStart = loadavg()[0];
    const t = timeMedian(() => runForecast(spec), 3, 1);
    const one = runForecast(spec);
    return {
      forecast10ParameterPB: { medianMs: t.medianMs, minMs: t.minMs, repeats: t.repeats },
      parameters: spec.parameters.length,
      powerBins: spec.power,
      bispectrumBins: spec.bispectrum,
      marginalisedJointSigmaMNu: one.sets.joint?.errors?.marginalised[spec.parameters.indexOf('mNu')],
      loadAverage1minAtStart: loadAtStart,
      loadAverage1minAtEnd: loadavg()[0],
    };
  },
};
export default bench;
