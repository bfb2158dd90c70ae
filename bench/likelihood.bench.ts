import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Benchmark } from './harness.js';
import { timeMedian } from './harness.js';
import { enumerateTriangleBins, shellGrid, TreeBispectrumModel } from '../src/bispectrum/index.js';
import { PLANCK_2018, linearPowerFromCosmology } from '../src/cosmology/index.js';
import { binVolumeTriangleCount, continuousModeCount, writeMeasurementBundle } from '../src/data/index.js';
import { createJointLikelihood } from '../src/inference/likelihood/index.js';
import { PowerMultipoleModel } from '../src/power/index.js';

/**
 * One joint likelihood call for P0, P2, P4 on 40 k bins plus B0 on 1,000
 * triangle bins (1,120 data), analytic Gaussian covariance, 8 parameters
 * marginalised analytically (pCt0, pCt2, pCt4, pStochConst, b2, bG2,
 * bispShotPower, bispShotConst):
 *   (a) at fixed linear power (fixed-template mode, amplitude fixed): new b1 and
 *       fsigma8 at fixed dilations, and with new dilations too;
 *   (b) with a new cosmology (full mode): a new EH linear spectrum, new models.
 * The measurement is the model itself at Planck 2018 (only timing is measured here).
 */
const z = 0.5;
const nbar = 3e-4;
const box = 2000;
const pBins = { kMin: 0.01, dk: 0.005, count: 40 };
const grid = shellGrid(0.02, 0.3, 0.01);
const all = enumerateTriangleBins(grid);
const size = 1000;
const bins = { ...all, size, indices: all.indices.slice(0, 3 * size), centres: all.centres.slice(0, 3 * size) };
const fiducial = { b1: 2, f: 0.75, b2: 0.5, bG2: -0.3, pCt0: 2, pCt2: 1, pCt4: 0, pStochConst: 1, bispShotPower: 1, bispShotConst: 1 };

/** A dense positive-definite covariance for the timing: 0.01 |v_i v_j| (0.7 delta_ij + 0.3), i.e. 30% correlations everywhere. */
function denseCovariance(values: ArrayLike<number>, n: number): Float64Array {
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) m[i * n + j] = (i === j ? 1 : 0.3) * 0.01 * Math.abs(values[i] * values[j]);
  }
  return m;
}

function writeBenchBundle(dir: string): void {
  const spectrum = linearPowerFromCosmology(PLANCK_2018, z);
  const p = new PowerMultipoleModel({ spectrum, bins: pBins, nbar }).evaluate(fiducial);
  const b = new TreeBispectrumModel({ spectrum, bins, multipoles: [0], numberDensity: nbar, averaging: 'centres' }).evaluate(fiducial);
  const centres = Array.from({ length: pBins.count }, (_, i) => pBins.kMin + i * pBins.dk);
  const kf = (2 * Math.PI) / box;
  const data = [...p, ...b];
  writeMeasurementBundle(dir, {
    redshift: z,
    numberDensity: nbar,
    lineOfSight: 'z-axis',
    boxSize: box,
    fiducialCosmology: { h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044 },
    power: { centres, effective: centres, counts: centres.map((c) => continuousModeCount(c, pBins.dk, box ** 3)), dk: pBins.dk, multipoles: [0, 2, 4], values: [p.slice(0, 40), p.slice(40, 80), p.slice(80)] },
    bispectrum: {
      centres: bins.centres,
      effective: bins.centres,
      counts: Array.from({ length: size }, (_, t) => binVolumeTriangleCount(Array.from(bins.centres.subarray(3 * t, 3 * t + 3)), grid.dk, kf)),
      dk: grid.dk,
      multipoles: [0],
      values: [b],
    },
    covariance: { matrix: denseCovariance(data, data.length), size: data.length },
  });
}

const marginalised = {
  pCt0: { prior: { kind: 'gaussian', mean: 0, sigma: 30 }, marginalise: true },
  pCt2: { prior: { kind: 'gaussian', mean: 0, sigma: 30 }, marginalise: true },
  pCt4: { prior: { kind: 'gaussian', mean: 0, sigma: 30 }, marginalise: true },
  pStochConst: { prior: { kind: 'gaussian', mean: 1, sigma: 1 }, marginalise: true },
  b2: { prior: { kind: 'gaussian', mean: 0, sigma: 5 }, marginalise: true },
  bG2: { prior: { kind: 'gaussian', mean: 0, sigma: 5 }, marginalise: true },
  bispShotPower: { prior: { kind: 'flat' }, marginalise: true },
  bispShotConst: { prior: { kind: 'flat' }, marginalise: true },
};
const models = { bispectrum: { averaging: 'centres' } };
const templateParameters = {
  b1: { prior: { kind: 'uniform', min: 0.5, max: 4 }, start: 2 },
  fsigma8: { prior: { kind: 'uniform', min: 0.1, max: 1 }, start: 0.45 },
  alphaPar: { prior: { kind: 'uniform', min: 0.8, max: 1.2 }, start: 1 },
  alphaPerp: { prior: { kind: 'uniform', min: 0.8, max: 1.2 }, start: 1 },
  templateAmplitude: { value: 1 },
  ...marginalised,
};
const fullParameters = {
  h: { prior: { kind: 'uniform', min: 0.6, max: 0.75 }, start: 0.6736 },
  omegaB: { value: 0.02237 },
  omegaCdm: { prior: { kind: 'uniform', min: 0.1, max: 0.14 }, start: 0.12 },
  ns: { value: 0.9649 },
  lnAs: { prior: { kind: 'uniform', min: 2.5, max: 3.5 }, start: 3.044 },
  b1: { prior: { kind: 'uniform', min: 0.5, max: 4 }, start: 2 },
  ...marginalised,
};

const bench: Benchmark = {
  name: 'likelihood',
  async run() {
    const dir = mkdtempSync(join(tmpdir(), 'treble-likelihood-bench-'));
    try {
      writeBenchBundle(dir);
      const gaussian = { bundle: dir, covariance: { source: 'gaussian' }, models };
      const template = createJointLikelihood({ ...gaussian, cosmology: { mode: 'fixed-template' }, parameters: templateParameters });
      const dense = createJointLikelihood({ ...gaussian, covariance: { source: 'matrix' }, cosmology: { mode: 'fixed-template' }, parameters: templateParameters });
      const full = createJointLikelihood({ ...gaussian, cosmology: { mode: 'full' }, parameters: fullParameters });
      const theta = Float64Array.from([2, 0.45, 1, 1]);
      let step = 0;
      const newBias = (L: typeof template) => () => {
        theta[0] = 2 + 1e-6 * (step++ % 1000);
        return L.logPosterior(theta);
      };
      const newDilations = () => {
        theta[2] = 1 + 1e-6 * (step++ % 1000);
        return template.logPosterior(theta);
      };
      const cosmo = Float64Array.from([0.6736, 0.12, 3.044, 2]);
      const newCosmology = () => {
        cosmo[0] = 0.6736 + 1e-6 * (step++ % 1000);
        return full.logPosterior(cosmo);
      };
      return {
        setup: `P0, P2, P4 x 40 k bins + B0 x ${size} triangle bins (centres), ${template.size} data, 8 parameters marginalised, EH98 Planck 2018 at z = ${z}`,
        covariance: template.describe().covariance,
        covarianceBlocks: template.factor.blocks.length,
        fixedPowerNewBiasMs: timeMedian(newBias(template), 300, 30),
        fixedPowerNewBiasDenseCovarianceMs: timeMedian(newBias(dense), 100, 10),
        fixedPowerNewDilationsMs: timeMedian(newDilations, 10, 2),
        newCosmologyMs: timeMedian(newCosmology, 10, 2),
      };
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};
export default bench;
