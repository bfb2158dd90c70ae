import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fisherErrors } from '../../../src/inference/fisher/fisher-algebra.js';
import { selectionFisher } from '../../../src/inference/fisher/selection-fisher.js';
import { SourceModelVector } from '../../../src/inference/fisher/source-model-vector.js';
import { meanAndSd } from '../../../src/inference/sampling/draw-summary.js';
import { sampleEnsemble } from '../../../src/inference/sampling/sample-ensemble.js';
import { TRUTH } from '../scale-cuts/scan-fixture.js';
import { biasLikelihood } from './bias-posterior-target.js';

const NAMES = ['b1', 'b2', 'bG2', 'bispShotPower'];

describe('Fisher errors against a sampled posterior', () => {
  it('agree within 20% for b1, b2, bG2 and the shot amplitude at fixed cosmology (noiseless data)', async () => {
    const { bundle, source, selection, covariance } = biasLikelihood();
    const fisher = selectionFisher({ vector: new SourceModelVector(bundle, source), names: NAMES, fiducial: TRUTH, indices: selection.indices, covariance: covariance.matrix });
    const sigma = fisherErrors(fisher).marginalised;
    const target = { module: new URL('./bias-posterior-target.ts', import.meta.url).href, exportName: 'biasPosterior' };
    const parameters = NAMES.map((name, i) => ({ name, start: (TRUTH as Record<string, number>)[name], scale: sigma[i] }));
    const run = await sampleEnsemble({ parameters, target, output: join(mkdtempSync(join(tmpdir(), 'treble-fisher-')), 'bias'), seed: 11, workers: 0, progress: 'off', handleInterrupt: false, walkers: 16, maxSteps: 3000 });
    const burn = run.diagnostics.burnInSteps;
    NAMES.forEach((name, p) => {
      const { sd } = meanAndSd(run.history.seriesByMember(p, burn));
      expect(Math.abs(sd / sigma[p] - 1), `${name}: sampled sd ${sd}, Fisher ${sigma[p]}`).toBeLessThan(0.2);
    });
  });
});
