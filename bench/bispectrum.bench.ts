/**
 * Tree-level bispectrum speed (issue 3). One core, one process.
 * (a) full evaluation of B_0 and B_2, continuous bin average converged to 1e-6,
 *     from a new linear power spectrum (each repetition takes the next of several
 *     prepared spectra), for 477 bins (0.01–0.15, dk 0.01) and 6613 bins
 *     (0.01–0.2, dk 0.005); geometry (bin nodes, pair kernels, orientation
 *     weights) is precomputed once and timed separately; the producer's own cost
 *     of building a spectrum is reported apart as well.
 * (b) re-evaluation for new bias and stochastic parameters from templates
 *     (TreeTemplateCombiner, the path of TreeBispectrumModel.evaluate; the
 *     JavaScript combineTreeTemplates is timed beside it).
 * The default path is the WebAssembly SIMD loop (compiled-multipole-kernel.ts);
 * the JavaScript loop it compiles is timed in the same run for the ratio.
 * Also, for reference: the same full evaluation with the angle-averaged BAO
 * damping (an approximation; the model is then polynomial in the cosines and
 * uses precomputed angular averages), without IR resummation, and with AP
 * distortion, and the template build with AP distortion (the path a fit with
 * free alpha_par, alpha_perp takes on every call).
 */
import type { Benchmark } from './harness.js';
import { timeMedian } from './harness.js';
import {
  continuousBinNodes,
  DEFAULT_VOLUME_ORDER,
  enumerateTriangleBins,
  orientationRule,
  shellGrid,
  TreeBispectrumModel,
  TreeMultipoleEvaluator,
  defaultTreeOrientationRule,
  resolveTreeSettings,
  combineTreeTemplates,
  TreeTemplateCombiner,
} from '../src/bispectrum/index.js';
import { linearPowerFromCosmology, validateCosmology } from '../src/cosmology/index.js';
import type { LinearSpectrum } from '../src/contracts/linear-spectrum.js';
import { Random } from '../src/numerics/random.js';

const cosmology = (h: number) =>
  validateCosmology({ h, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044, mNu: 0.06, massiveNuCount: 1 }, { path: 'cosmology', file: 'bench' });

/** Mean CPU time (user + system) per call in ms: on a shared, oversubscribed machine closer to one idle core than wall time. */
function cpuMean(fn: () => unknown, repeats: number): number {
  fn();
  const c0 = process.cpuUsage();
  for (let i = 0; i < repeats; i++) fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000 / repeats;
}

function maxRelative(a: Float64Array, b: Float64Array): number {
  let e = 0;
  for (let i = 0; i < a.length; i++) e = Math.max(e, Math.abs(a[i] / b[i] - 1));
  return e;
}

const bench: Benchmark = {
  name: 'bispectrum',
  async run() {
    const t0 = performance.now();
    const spectra: LinearSpectrum[] = [0.66, 0.67, 0.68, 0.69].map((h) => linearPowerFromCosmology(cosmology(h), 0.61));
    const spectrumBuildMs = (performance.now() - t0) / spectra.length;
    const params = { b1: 2, b2: 0.4, bG2: -0.3, f: spectra[0].growthRateLargeScale, bispShotPower: 1, bispShotConst: 1 };
    const settingsOf = (spectrum: LinearSpectrum) => ({ spectrum, numberDensity: 3e-4 });
    const results: Record<string, unknown> = { linearSpectrumBuildMs: spectrumBuildMs, settings: 'IR resummation on, no FoG damping, alpha = 1, nbar = 3e-4' };
    for (const [kMin, kMax, dk, repeats] of [
      [0.01, 0.15, 0.01, 15],
      [0.01, 0.2, 0.005, 5],
    ]) {
      const bins = enumerateTriangleBins(shellGrid(kMin, kMax, dk));
      const rule = defaultTreeOrientationRule(resolveTreeSettings(settingsOf(spectra[0])), 2, kMax + dk);
      const g0 = performance.now();
      const nodes = continuousBinNodes(bins, DEFAULT_VOLUME_ORDER);
      const evaluator = new TreeMultipoleEvaluator(nodes, [0, 2], rule);
      const geometryMs = performance.now() - g0;
      let next = 0;
      const full = timeMedian(() => evaluator.evaluate(settingsOf(spectra[next++ % spectra.length]), params), repeats, 2);
      const fullCpuMs = cpuMean(() => evaluator.evaluate(settingsOf(spectra[next++ % spectra.length]), params), repeats);
      const jsEvaluator = new TreeMultipoleEvaluator(nodes, [0, 2], rule, { compiledKernel: false });
      const jsCpuMs = cpuMean(() => jsEvaluator.evaluate(settingsOf(spectra[next++ % spectra.length]), params), repeats);
      const compiledAgainCpuMs = cpuMean(() => evaluator.evaluate(settingsOf(spectra[next++ % spectra.length]), params), repeats);
      // The averaged templates a fit rebuilds for a new spectrum: compiled and JavaScript loops, interleaved.
      const templatesCpuMs = cpuMean(() => evaluator.templates(settingsOf(spectra[next++ % spectra.length])), repeats);
      const templatesJsCpuMs = cpuMean(() => jsEvaluator.templates(settingsOf(spectra[next++ % spectra.length])), repeats);
      const templatesAgainCpuMs = cpuMean(() => evaluator.templates(settingsOf(spectra[next++ % spectra.length])), repeats);
      // Accuracy of the converged setting against a much finer bin-volume quadrature and orientation rule.
      const value = evaluator.evaluate(settingsOf(spectra[0]), params);
      const fine = new TreeMultipoleEvaluator(continuousBinNodes(bins, DEFAULT_VOLUME_ORDER + 3), [0, 2], orientationRule(8, 10)).evaluate(
        settingsOf(spectra[0]),
        params,
      );
      const model = new TreeBispectrumModel({ ...settingsOf(spectra[0]), bins });
      const tb0 = performance.now();
      const templates = model.templates({});
      const templateBuildMs = performance.now() - tb0;
      const rng = new Random(11);
      const out = new Float64Array(2 * bins.size);
      const draws = Array.from({ length: 64 }, () => ({
        b1: 1 + 2 * rng.uniform(),
        b2: rng.uniform() - 0.5,
        bG2: -0.5 * rng.uniform(),
        f: 0.6 + 0.3 * rng.uniform(),
        bispShotPower: 2 * rng.uniform(),
        bispShotConst: 2 * rng.uniform(),
      }));
      let d = 0;
      const combiner = new TreeTemplateCombiner(2);
      combiner.load(templates);
      const reeval = timeMedian(() => combiner.combine(draws[d++ % draws.length], out), 200, 20);
      const reevalCpuMs = cpuMean(() => combiner.combine(draws[d++ % draws.length], out), 2000);
      const reevalJsCpuMs = cpuMean(() => combineTreeTemplates(templates, 2, draws[d++ % draws.length], out), 2000);
      // The same evaluation with IR resummation off (the model is then a polynomial in the cosines and the
      // exact 3 x 5 rule applies), and with AP distortion (true wavenumbers per orientation point).
      const noIR = (spectrum: LinearSpectrum) => ({ ...settingsOf(spectrum), irResummation: false });
      const polyRule = defaultTreeOrientationRule(resolveTreeSettings(noIR(spectra[0])), 2, kMax + dk);
      const polyEvaluator = new TreeMultipoleEvaluator(nodes, [0, 2], polyRule);
      const noIrCpuMs = cpuMean(() => polyEvaluator.evaluate(noIR(spectra[next++ % spectra.length]), params), repeats);
      const ap = (spectrum: LinearSpectrum) => ({ ...settingsOf(spectrum), alphaPar: 1.02, alphaPerp: 0.99 });
      const apRule = defaultTreeOrientationRule(resolveTreeSettings(ap(spectra[0])), 2, kMax + dk);
      const apEvaluator = new TreeMultipoleEvaluator(nodes, [0, 2], apRule);
      const apCpuMs = cpuMean(() => apEvaluator.evaluate(ap(spectra[next++ % spectra.length]), params), Math.ceil(repeats / 3));
      const apTemplatesCpuMs = cpuMean(() => apEvaluator.templates(ap(spectra[next++ % spectra.length])), Math.ceil(repeats / 3));
      const apJsEvaluator = new TreeMultipoleEvaluator(nodes, [0, 2], apRule, { compiledKernel: false });
      const apTemplatesJsCpuMs = cpuMean(() => apJsEvaluator.templates(ap(spectra[next++ % spectra.length])), Math.ceil(repeats / 3));
      // The angle-averaged BAO damping (irAngleAveraged): polynomial model, precomputed angular averages per node.
      const averaged = (spectrum: LinearSpectrum) => ({ ...settingsOf(spectrum), irAngleAveraged: true });
      const avgRule = defaultTreeOrientationRule(resolveTreeSettings(averaged(spectra[0])), 2, kMax + dk);
      const avgEvaluator = new TreeMultipoleEvaluator(nodes, [0, 2], avgRule);
      const m0 = performance.now();
      const moments = avgEvaluator.angularMoments();
      const momentsMs = performance.now() - m0;
      const avgTimes = timeMedian(() => avgEvaluator.evaluate(averaged(spectra[next++ % spectra.length]), params), repeats, 2);
      const avgCpuMs = cpuMean(() => avgEvaluator.evaluate(averaged(spectra[next++ % spectra.length]), params), repeats);
      const avgValue = avgEvaluator.evaluate(averaged(spectra[0]), params);
      const avgFine = new TreeMultipoleEvaluator(continuousBinNodes(bins, DEFAULT_VOLUME_ORDER + 3), [0, 2], orientationRule(8, 10)).evaluate(averaged(spectra[0]), params);
      const nb = bins.size;
      let shiftB0 = 0;
      let shiftB2 = 0;
      for (let b = 0; b < nb; b++) {
        shiftB0 = Math.max(shiftB0, Math.abs(avgValue[b] / value[b] - 1));
        shiftB2 = Math.max(shiftB2, Math.abs(avgValue[nb + b] - value[nb + b]) / Math.abs(value[b]));
      }
      results[`bins${bins.size}`] = {
        binning: { kMin, kMax, dk, bins: bins.size },
        geometry: { volumeNodes: nodes.weight.length, orientationPoints: rule.weight.length, precomputeMs: geometryMs },
        pointsPerEvaluation: nodes.weight.length * rule.weight.length,
        fullEvaluationMs: full,
        fullEvaluationCpuMs: fullCpuMs,
        fullEvaluationTargetMs: bins.size === 477 ? 10 : 100,
        javascriptLoop: {
          fullEvaluationCpuMs: jsCpuMs,
          compiledCpuMsInterleaved: compiledAgainCpuMs,
          speedUpOfCompiledLoop: jsCpuMs / compiledAgainCpuMs,
        },
        maxRelativeDifferenceToFinerQuadrature: maxRelative(value, fine),
        withAngleAveragedDamping: {
          orientationPoints: avgRule.weight.length,
          angularMomentsPrecomputeMs: momentsMs,
          angularMomentsMB: moments.bytes / 1e6,
          fullEvaluationMs: avgTimes,
          fullEvaluationCpuMs: avgCpuMs,
          maxRelativeDifferenceToFinerQuadrature: maxRelative(avgValue, avgFine),
          modelShiftFromPerLegDamping: { maxRelativeB0: shiftB0, maxB2OverB0: shiftB2 },
        },
        withoutIrResummation: { orientationPoints: polyRule.weight.length, fullEvaluationCpuMs: noIrCpuMs },
        withAlcockPaczynski: { alphaPar: 1.02, alphaPerp: 0.99, orientationPoints: apRule.weight.length, fullEvaluationCpuMs: apCpuMs, templateBuildCpuMs: apTemplatesCpuMs, templateBuildJavascriptCpuMs: apTemplatesJsCpuMs },
        // First call of a new model: includes building its geometry.
        templateBuildFromNewSpectrumMs: templateBuildMs,
        templateBuildCpuMs: (templatesCpuMs + templatesAgainCpuMs) / 2,
        templateBuildJavascriptCpuMs: templatesJsCpuMs,
        templateReEvaluationMs: reeval,
        templateReEvaluationCpuMs: reevalCpuMs,
        templateReEvaluationTargetMs: 0.5,
        templateReEvaluationJavascriptCpuMs: reevalJsCpuMs,
      };
    }
    return results;
  },
};

export default bench;
