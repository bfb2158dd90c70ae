import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { wrap, type Remote } from 'comlink';
import { InputError } from '../../contracts/input-error.js';
import { WorkerCrashError, type BatchEvaluator } from './batch-evaluator.js';
import { nodeEndpoint } from './comlink-node.js';
import type { EvaluatedBatch } from './evaluate-points.js';
import type { ModeClimb } from '../optimize/climb-from-start.js';
import type { LogPosteriorReference } from './log-posterior-reference.js';
import type { BoundedParameter } from './sampled-parameter.js';
import type { SamplingWorkerApi } from './worker-entry.js';
import { samplingWorkerEntry } from './module-locations.js';

const tsxBootstrap =
  "import('tsx/esm/api').then(({ register }) => { register(); return import(require('node:worker_threads').workerData.entry); });";

/** Default pool size: the cores this process may use. */
export function defaultWorkerCount(): number {
  return availableParallelism();
}

interface Slot {
  readonly worker: Worker;
  readonly remote: Remote<SamplingWorkerApi>;
  /** Rejects when the worker exits or fails; never resolves. */
  readonly death: Promise<never>;
}

/**
 * A pool of worker threads, each holding its own copy of the log-posterior.
 * A batch is cut into one contiguous chunk per worker; results come back in
 * the order of the points, so the outcome never depends on the pool size.
 * A worker that dies is replaced and its chunk retried, up to `maxRestarts`
 * replacements per pool; after that evaluate() rejects with WorkerCrashError.
 */
export class WorkerPool implements BatchEvaluator {
  private readonly slots: Slot[] = [];
  private closing = false;
  restarts = 0;

  private constructor(
    private readonly target: Required<LogPosteriorReference>,
    private readonly maxRestarts: number,
  ) {}

  get workers(): number {
    return this.slots.length;
  }

  static async start(target: Required<LogPosteriorReference>, workers: number, maxRestarts: number): Promise<WorkerPool> {
    const pool = new WorkerPool(target, maxRestarts);
    try {
      const slots = await Promise.all(Array.from({ length: workers }, () => pool.spawn()));
      pool.slots.push(...slots);
    } catch (err) {
      await pool.close();
      throw err;
    }
    return pool;
  }

  private async spawn(): Promise<Slot> {
    const entry = samplingWorkerEntry();
    const needsTsx = entry.typescript || /\.[cm]?ts$/.test(this.target.module);
    // `--import tsx` in a worker's execArgv does not reach the worker's own entry
    // file (Node 20), so TypeScript goes through a bootstrap that registers tsx first.
    const worker = needsTsx
      ? new Worker(tsxBootstrap, { eval: true, workerData: { entry: entry.url.href } })
      : new Worker(entry.url);
    const death = new Promise<never>((_, reject) => {
      worker.once('error', (err) => reject(new WorkerCrashError(`sampling worker failed: ${err.message}`)));
      worker.once('exit', (code) => reject(new WorkerCrashError(`sampling worker exited with code ${code}`)));
    });
    death.catch(() => undefined); // observed through races below
    const remote = wrap<SamplingWorkerApi>(nodeEndpoint(worker));
    try {
      await Promise.race([remote.load(this.target), death]);
    } catch (err) {
      await worker.terminate();
      if (err instanceof WorkerCrashError) throw err;
      throw new InputError((err as Error).message);
    }
    return { worker, remote, death };
  }

  async evaluate(points: Float64Array, dim: number): Promise<EvaluatedBatch> {
    const count = points.length / dim;
    const results = await Promise.all(
      this.chunks(count).map(([lo, hi], i) => this.evaluateOn(i, points.slice(lo * dim, hi * dim), dim)),
    );
    const values = new Float64Array(count);
    const status = new Uint8Array(count);
    let firstError: string | null = null;
    let o = 0;
    for (const r of results) {
      values.set(r.values, o);
      status.set(r.status, o);
      o += r.values.length;
      firstError ??= r.firstError;
    }
    return { values, status, firstError };
  }

  /** Contiguous index ranges [lo, hi), one per worker, sizes differing by at most one; empty ones left out. */
  private chunks(count: number): [number, number][] {
    const w = this.slots.length;
    const out: [number, number][] = [];
    for (let i = 0; i < w; i++) {
      const lo = Math.floor((i * count) / w);
      const hi = Math.floor(((i + 1) * count) / w);
      if (hi > lo) out.push([lo, hi]);
    }
    return out;
  }

  /** Local maximisations from each start (count x dim), the starts shared out over the workers. */
  async climb(starts: Float64Array, parameters: readonly BoundedParameter[]): Promise<ModeClimb[]> {
    const dim = parameters.length;
    const parts = await Promise.all(
      this.chunks(starts.length / dim).map(([lo, hi], i) =>
        Promise.race([this.slots[i].remote.climb(starts.slice(lo * dim, hi * dim), parameters), this.slots[i].death]),
      ),
    );
    return parts.flat();
  }

  private async evaluateOn(index: number, chunk: Float64Array, dim: number): Promise<EvaluatedBatch> {
    for (;;) {
      const slot = this.slots[index];
      try {
        // The chunk is copied (not transferred) so that a retry still has it.
        return await Promise.race([slot.remote.evaluate(chunk, dim), slot.death]);
      } catch (err) {
        if (!(err instanceof WorkerCrashError) || this.closing) throw err;
        if (this.restarts >= this.maxRestarts) {
          throw new WorkerCrashError(
            `${err.message} while evaluating ${chunk.length / dim} point(s), the first at [${Array.from(chunk.subarray(0, dim)).join(', ')}]; ` +
              `${this.restarts} replacement(s) already made (limit workerRestarts = ${this.maxRestarts})`,
          );
        }
        this.restarts++;
        this.slots[index] = await this.spawn();
      }
    }
  }

  async close(): Promise<void> {
    this.closing = true;
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
    this.slots.length = 0;
  }
}
