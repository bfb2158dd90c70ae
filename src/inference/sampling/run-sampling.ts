import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { InputError } from '../../contracts/input-error.js';
import { Random } from '../../numerics/random.js';
import { WorkerCrashError, type BatchEvaluator } from './batch-evaluator.js';
import { ChainHistory } from './chain-history.js';
import { appendDurably, chainCsvHeader, chainCsvRows, chainFilePaths, readChainCsv, writeJsonAtomically } from './chain-files.js';
import { acceptanceSummary } from './draw-summary.js';
import { emptyFailureCounts, LikelihoodFailureError, tallyFailures, type FailureCounts } from './failure-tally.js';
import { openEvaluator } from './open-evaluator.js';
import { ProgressDisplay } from './progress-display.js';
import { drawStartingPoint, withinParameterBounds } from './sampled-parameter.js';
import type { ProposalEvaluator, SamplerKernel } from './sampler-kernel.js';
import { readCheckpoint, runFingerprint, writeCheckpoint } from './sampling-checkpoint.js';
import { SamplingHaltedError } from './sampling-halted-error.js';
import type { RunDiagnostics, SamplingMethod } from './sampling-method.js';
import type { ValidatedRunSettings } from './sampling-settings.js';
import { buildSidecar, type RunStatus } from './sidecar.js';

export interface SamplingResult {
  readonly stopReason: Exclude<RunStatus, 'running' | 'halted'>;
  readonly steps: number;
  readonly files: { chain: string; sidecar: string; state: string };
  readonly parameterNames: readonly string[];
  /** All draws of the run (burn-in included); diagnostics.burnInSteps says what to drop. */
  readonly history: ChainHistory;
  readonly diagnostics: RunDiagnostics;
  readonly failures: FailureCounts;
  /** Worker replacements made in this session. */
  readonly workerRestarts: number;
}

const startingRounds = 100;

/**
 * Drive one sampling method: start or resume, step, check the stopping rule
 * every checkEvery steps, checkpoint every checkpointSeconds (chain rows are
 * appended, then the state written atomically), show progress, and stop on
 * convergence, maxSteps, SIGINT / abort (with a final checkpoint) or a
 * failure (SamplingHaltedError, with the checkpoint of the last whole step).
 */
export async function runSampling(method: SamplingMethod, s: ValidatedRunSettings): Promise<SamplingResult> {
  const paths = chainFilePaths(s.output);
  const names = s.parameters.map((p) => p.name);
  const dim = names.length;
  const header = chainCsvHeader(method.memberLabel, names);
  const fingerprint = runFingerprint(s, method);
  const resuming = s.resume && existsSync(paths.state);

  let history: ChainHistory;
  let kernel: SamplerKernel | null = null;
  let failures = emptyFailureCounts();
  let memo: unknown = null;
  let note = '-';
  let expectedSteps: number | null = null;
  let converged = false;
  let chainBytes: number;
  if (resuming) {
    const cp = readCheckpoint(paths.state, fingerprint);
    history = readChainCsv(paths.chain, cp.chainBytes, header, method.members, dim);
    if (history.steps !== cp.steps) throw new InputError(`output: ${paths.chain} holds ${history.steps} steps, the checkpoint ${cp.steps}`);
    kernel = method.restoreKernel(cp.kernel);
    ({ failures, memo, note, expectedSteps, converged, chainBytes } = cp);
  } else {
    // A chain file without a checkpoint is from a run that never finished its first step: overwritten.
    if (existsSync(paths.state)) throw new InputError(`output: ${paths.state} exists; set resume to continue that run or choose another output`);
    mkdirSync(dirname(paths.chain), { recursive: true });
    writeFileSync(paths.chain, header);
    chainBytes = Buffer.byteLength(header);
    history = new ChainHistory(method.members, dim);
  }
  let written = history.steps;

  const evaluator: BatchEvaluator = await openEvaluator(s.target, s.workers, s.workerRestarts);
  const evaluate: ProposalEvaluator = async (points) => {
    const n = points.length / dim;
    const values = new Float64Array(n).fill(-Infinity);
    const inside: number[] = [];
    for (let i = 0; i < n; i++) if (withinParameterBounds(s.parameters, points, i * dim)) inside.push(i);
    if (inside.length > 0) {
      const packed = new Float64Array(inside.length * dim);
      inside.forEach((i, j) => packed.set(points.subarray(i * dim, (i + 1) * dim), j * dim));
      const batch = await evaluator.evaluate(packed, dim);
      tallyFailures(failures, batch, packed, dim);
      inside.forEach((i, j) => (values[i] = batch.values[j]));
      if (failures.thrown > s.maxLikelihoodErrors) throw new LikelihoodFailureError(failures, s.maxLikelihoodErrors, names);
    }
    return values;
  };

  const checkpoint = (k: SamplerKernel) => {
    chainBytes = appendDurably(paths.chain, chainCsvRows(history, written, history.steps), chainBytes);
    written = history.steps;
    writeCheckpoint(paths.state, { chainBytes, steps: k.step, converged, fingerprint, kernel: k.saveState(), failures, memo, note, expectedSteps });
  };
  const sidecar = (status: RunStatus, message: string | null, diagnostics: RunDiagnostics | null) =>
    writeJsonAtomically(paths.sidecar, buildSidecar(s, method, paths, { status, message, steps: history.steps, failures, diagnostics }));

  let interrupted = false;
  let interrupts = 0;
  const onInterrupt = () => {
    interrupted = true;
    if (++interrupts > 1) process.exit(130); // a second Ctrl-C does not wait for the step
  };
  if (s.handleInterrupt) process.on('SIGINT', onInterrupt);
  const display = new ProgressDisplay(s.progress, s.progressStream, s.progressSeconds);
  const snapshot = (k: SamplerKernel) => ({
    step: k.step,
    maxSteps: s.maxSteps,
    acceptance: acceptanceSummary(k.accepted, k.step).mean,
    note,
    expectedSteps,
  });

  try {
    if (kernel === null) kernel = method.createKernel(...(await startingPoints(method, s, evaluate)));
    sidecar('running', null, null);
    if (!resuming) checkpoint(kernel);
    let lastCheckpoint = Date.now();
    let lastYield = Date.now();
    let stopReason: SamplingResult['stopReason'];
    for (;;) {
      if (converged) {
        stopReason = 'converged';
        break;
      }
      if (interrupted || s.signal?.aborted) {
        stopReason = 'interrupted';
        break;
      }
      if (kernel.step >= s.maxSteps) {
        stopReason = 'max-steps';
        break;
      }
      const before = { ...failures };
      try {
        await kernel.advance(evaluate);
      } catch (err) {
        failures = before; // the failed step is redone on resume; do not count it twice
        throw err;
      }
      history.append(kernel.positions, kernel.logPosterior);
      if (kernel.step % s.checkEvery === 0) {
        const a = method.assess(history, memo);
        ({ memo, note, expectedSteps, converged } = a);
      }
      if (converged || Date.now() - lastCheckpoint >= s.checkpointSeconds * 1000) {
        checkpoint(kernel);
        lastCheckpoint = Date.now();
      }
      display.update(snapshot(kernel));
      if (Date.now() - lastYield >= 50) {
        // Let signals and timers in: evaluation on this thread never leaves the microtask queue.
        await new Promise((resolve) => setImmediate(resolve));
        lastYield = Date.now();
      }
    }
    checkpoint(kernel);
    const diagnostics = method.summarize(history, kernel.accepted);
    sidecar(stopReason, null, diagnostics);
    display.finish(snapshot(kernel), stopReason);
    return {
      stopReason,
      steps: kernel.step,
      files: paths,
      parameterNames: names,
      history,
      diagnostics,
      failures,
      workerRestarts: evaluator.restarts,
    };
  } catch (err) {
    if (!(err instanceof WorkerCrashError || err instanceof LikelihoodFailureError)) throw err;
    const k = kernel;
    if (k !== null) checkpoint(k);
    const where = k !== null ? `stopped at step ${k.step}; checkpoint ${paths.state} is intact (resume: true continues the run)` : 'stopped before the first step';
    const message = `${err.message}; ${where}`;
    sidecar('halted', message, null);
    if (k !== null) display.finish(snapshot(k), 'halted');
    throw new SamplingHaltedError(message, k !== null ? paths.state : null);
  } finally {
    if (s.handleInterrupt) process.off('SIGINT', onInterrupt);
    await evaluator.close();
  }
}

/**
 * Starting points of all members, drawn in member order from the seed; a
 * member whose point has zero probability is redrawn, up to 100 rounds.
 * Returns the points, their log-posteriors and the generator state after them.
 */
async function startingPoints(
  method: SamplingMethod,
  s: ValidatedRunSettings,
  evaluate: ProposalEvaluator,
): Promise<[Float64Array, Float64Array, ReturnType<Random['getState']>]> {
  const dim = s.parameters.length;
  const random = new Random(s.seed);
  const positions = new Float64Array(method.members * dim);
  const logPosterior = new Float64Array(method.members).fill(-Infinity);
  for (let round = 0; round < startingRounds; round++) {
    const todo: number[] = [];
    for (let m = 0; m < method.members; m++) if (!(logPosterior[m] > -Infinity)) todo.push(m);
    if (todo.length === 0) return [positions, logPosterior, random.getState()];
    const points = new Float64Array(todo.length * dim);
    todo.forEach((_, j) => drawStartingPoint(s.parameters, random, points, j * dim));
    const values = await evaluate(points);
    todo.forEach((m, j) => {
      positions.set(points.subarray(j * dim, (j + 1) * dim), m * dim);
      logPosterior[m] = values[j];
    });
  }
  throw new InputError(`parameters: no starting point with a finite log-posterior in ${startingRounds} draws; check the start and scale (or bounds) of the parameters`);
}
