/**
 * Time to build a new linear power spectrum for a fresh cosmology: 1,000 k
 * points, EH98 with wiggles and no-wiggle, EH99 neutrino suppression and
 * scale-dependent growth, ODE growth, normalisation, sigma8 and the BAO
 * damping scales. Target: under 2 ms on one core.
 */
import { PLANCK_2018, linearPowerFromCosmology } from '../src/cosmology/index.js';
import { timeMedian, type Benchmark } from './harness.js';

let counter = 0;
function fresh(amplitude: 'lnAs' | 'sigma8') {
  counter++;
  // A slightly different cosmology on every call, so nothing can be cached.
  const base = { ...PLANCK_2018, h: 0.67 + 1e-7 * counter, mNu: 0.1, massiveNuCount: 3 };
  return amplitude === 'lnAs' ? base : { ...base, lnAs: undefined, sigma8: 0.81 };
}

const bench: Benchmark = {
  name: 'linear',
  async run() {
    const withAs = timeMedian(() => linearPowerFromCosmology(fresh('lnAs'), 0.5, { points: 1000 }), 200, 50);
    const withSigma8 = timeMedian(() => linearPowerFromCosmology(fresh('sigma8'), 0.5, { points: 1000 }), 200, 50);
    const noNeutrinos = timeMedian(() => linearPowerFromCosmology({ ...fresh('lnAs'), mNu: 0 }, 0.5, { points: 1000 }), 200, 50);
    return {
      what: 'linearPowerFromCosmology, 1000 k points, m_nu = 0.1 eV (3 species), z = 0.5',
      targetMs: 2,
      normalisedByAsMs: withAs,
      normalisedBySigma8Ms: withSigma8,
      masslessNeutrinosMs: noNeutrinos,
    };
  },
};
export default bench;
