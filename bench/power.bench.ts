import type { Benchmark } from './harness.js';
import { timeMedian } from './harness.js';
import { PLANCK_2018, linearPowerFromCosmology } from '../src/cosmology/index.js';
import { PowerMultipoleModel, latticeBinModes, type PowerBinAveraging } from '../src/power/index.js';

/**
 * Power-spectrum multipoles P0, P2, P4 in 40 k bins (0.01 to 0.40 h/Mpc): the
 * cost for a new linear spectrum (linear theory, then model build + first
 * evaluation) and the template re-evaluation for new nuisance parameters.
 */
const bins = { kMin: 0.01, dk: 0.01, count: 40 };
const nuisance = { b1: 2, f: 0.75, pCt0: 3, pCt2: -1, pCt4: 0.5, pCtFog: 2, pStochConst: 1.05, pStochK2Mu2: 4 };

function buildAndEvaluate(averaging: PowerBinAveraging): () => Float64Array {
  const spectrum = linearPowerFromCosmology(PLANCK_2018, 0.5);
  return () => new PowerMultipoleModel({ spectrum, bins, nbar: 3e-4, averaging }).evaluate(nuisance);
}

const bench: Benchmark = {
  name: 'power',
  async run() {
    const spectrum = linearPowerFromCosmology(PLANCK_2018, 0.5);
    const model = new PowerMultipoleModel({ spectrum, bins, nbar: 3e-4 });
    model.evaluate(nuisance);
    let b1 = 2;
    const out = new Float64Array(model.entries.length);
    let alpha = 1;
    let box = 1000;
    return {
      setup: '3 multipoles x 40 k bins, 12 Gauss-Legendre nodes in mu, Planck 2018 EH spectrum at z = 0.5',
      linearSpectrumMs: timeMedian(() => linearPowerFromCosmology(PLANCK_2018, 0.5), 10, 2),
      newSpectrumModelBuildAndEvaluateMs: timeMedian(buildAndEvaluate({ kind: 'centre' }), 30, 5),
      newSpectrumModelBuildMeanKMs: timeMedian(buildAndEvaluate({ kind: 'mean-k' }), 30, 5),
      latticeModesEnumerationBox1000Ms: timeMedian(() => latticeBinModes((box += 1e-9), bins), 3, 0),
      newSpectrumLatticeBox1000Ms: timeMedian(buildAndEvaluate({ kind: 'lattice', boxSize: 1000 }), 10, 2),
      templateReevaluationMs: timeMedian(() => model.evaluate({ ...nuisance, b1: (b1 += 1e-6) }, out), 2000, 200),
      alphaChangeRebuildMs: timeMedian(() => model.evaluate({ ...nuisance, alphaPar: (alpha += 1e-6) }, out), 30, 5),
      directEvaluationMs: timeMedian(() => model.evaluateDirect(nuisance, out), 30, 5),
      linearPartMs: timeMedian(() => model.linearPart({ ...nuisance, b1: (b1 += 1e-6) }, ['pCt0', 'pCt2', 'pCt4', 'pCtFog', 'pStochConst', 'pStochK2Mu2']), 500, 50),
    };
  },
};
export default bench;
