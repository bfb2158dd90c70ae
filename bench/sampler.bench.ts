/**
 * Sampler speed: (1) wall time per ensemble step for a 20 ms busy-wait
 * likelihood on 1 and 2 workers and the speed-up (target >= 1.8x on 2
 * cores); the same for a likelihood that sleeps 20 ms (no CPU used: the
 * pool's parallelism apart from competition for the cores); (2) sampler
 * overhead per proposal for a trivial likelihood, on this thread and through
 * 1 and 2 workers; (3) the whole run driver (history, chain file,
 * checkpoints, stopping checks) per proposal.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { Random } from '../src/numerics/random.js';
import type { BatchEvaluator } from '../src/inference/sampling/batch-evaluator.js';
import { normalizeLogPosteriorReference } from '../src/inference/sampling/log-posterior-reference.js';
import { openEvaluator } from '../src/inference/sampling/open-evaluator.js';
import { sampleEnsemble } from '../src/inference/sampling/sample-ensemble.js';
import { StretchMoveKernel } from '../src/inference/sampling/stretch-move-kernel.js';
import type { Benchmark } from './harness.js';

const dim = 4;
const target = (busyMs: number, sleepMs = 0) =>
  normalizeLogPosteriorReference({
    module: new URL('../tests/inference/sampling/targets/gaussian.ts', import.meta.url).href,
    exportName: 'gaussianTarget',
    options: { mean: new Array(dim).fill(0), covariance: Array.from({ length: dim }, (_, i) => Array.from({ length: dim }, (_, j) => (i === j ? 1 : 0))), busyMs, sleepMs },
  });

/** Milliseconds per step of a stretch-move ensemble (startup excluded): median and fastest of `repeats` timed blocks. */
async function msPerStep(evaluator: BatchEvaluator, walkers: number, steps: number, repeats: number): Promise<{ median: number; fastest: number }> {
  const random = new Random(1);
  const positions = Float64Array.from({ length: walkers * dim }, () => random.normal());
  const kernel = new StretchMoveKernel(dim, 2, {
    step: 0,
    positions: Array.from(positions),
    logPosterior: new Array<number>(walkers).fill(0),
    accepted: new Array<number>(walkers).fill(0),
    random: random.getState(),
  });
  const evaluate = async (points: Float64Array) => (await evaluator.evaluate(points, dim)).values;
  await kernel.advance(evaluate); // warm-up
  const times: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    for (let s = 0; s < steps; s++) await kernel.advance(evaluate);
    times.push((performance.now() - t0) / steps);
  }
  times.sort((a, b) => a - b);
  return { median: times[Math.floor(repeats / 2)], fastest: times[0] };
}

async function withEvaluator<T>(busyMs: number, workers: number, fn: (e: BatchEvaluator) => Promise<T>, sleepMs = 0): Promise<T> {
  const evaluator = await openEvaluator(target(busyMs, sleepMs), workers, 0);
  try {
    return await fn(evaluator);
  } finally {
    await evaluator.close();
  }
}

const bench: Benchmark = {
  name: 'sampler',
  async run() {
    const loadBefore = loadavg()[0];
    const walkers = 16;
    const slow1 = await withEvaluator(20, 1, (e) => msPerStep(e, walkers, 2, 5));
    const slow2 = await withEvaluator(20, 2, (e) => msPerStep(e, walkers, 2, 5));
    const sleep1 = await withEvaluator(0, 1, (e) => msPerStep(e, walkers, 2, 3), 20);
    const sleep2 = await withEvaluator(0, 2, (e) => msPerStep(e, walkers, 2, 3), 20);
    const trivial: Record<string, number> = {};
    for (const workers of [0, 1, 2]) {
      const ms = await withEvaluator(0, workers, (e) => msPerStep(e, 32, workers === 0 ? 400 : 100, 5));
      trivial[`workers${workers}`] = (ms.median * 1000) / 32;
    }
    const dir = mkdtempSync(join(tmpdir(), 'treble-bench-'));
    const steps = 3000;
    const t0 = performance.now();
    await sampleEnsemble({
      parameters: Array.from({ length: dim }, (_, i) => ({ name: `x${i}`, start: 0, scale: 1 })),
      target: target(0),
      output: join(dir, 'run'),
      seed: 1,
      walkers: 32,
      workers: 0,
      maxSteps: steps,
      progress: 'off',
      handleInterrupt: false,
      checkpointSeconds: 1,
    });
    const driverUs = ((performance.now() - t0) * 1000) / (steps * 32);
    rmSync(dir, { recursive: true, force: true });
    return {
      busyLikelihoodMs: 20,
      walkers,
      msPerStepOneWorker: slow1,
      msPerStepTwoWorkers: slow2,
      speedUpTwoOverOne: { median: slow1.median / slow2.median, fastest: slow1.fastest / slow2.fastest },
      speedUpTarget: 1.8,
      sleepingLikelihoodSpeedUpTwoOverOne: sleep1.median / sleep2.median,
      loadAverage1min: { before: loadBefore, after: loadavg()[0] },
      idealMsPerStepOneWorker: walkers * 20,
      trivialLikelihoodMicrosecondsPerProposal: trivial,
      wholeRunMicrosecondsPerProposalThisThread: driverUs,
      note: 'load average above the 2 cores means other work competed for them; startup (worker spawn and module load) excluded from the per-step figures; the whole-run figure includes it, plus chain file, checkpoints and stopping checks every 100 steps',
    };
  },
};

export default bench;
