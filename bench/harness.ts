import { cpus, totalmem } from 'node:os';

/** One benchmark file: bench/<name>.bench.ts default-exports one of these. */
export interface Benchmark {
  readonly name: string;
  run(): Promise<Record<string, unknown>>;
}

/** Median wall time in ms of `fn` over `repeats` runs after `warmup` runs. */
export function timeMedian(fn: () => unknown, repeats = 30, warmup = 5): { medianMs: number; minMs: number; repeats: number } {
  for (let i = 0; i < warmup; i++) fn();
  const t = new Float64Array(repeats);
  for (let i = 0; i < repeats; i++) {
    const t0 = process.hrtime.bigint();
    fn();
    t[i] = Number(process.hrtime.bigint() - t0) / 1e6;
  }
  t.sort();
  return { medianMs: t[Math.floor(repeats / 2)], minMs: t[0], repeats };
}

export function machine(): Record<string, unknown> {
  const c = cpus();
  return {
    cpu: c[0]?.model ?? 'unknown',
    cores: c.length,
    memoryGiB: Math.round(totalmem() / 2 ** 30),
    node: process.version,
    platform: process.platform,
  };
}
