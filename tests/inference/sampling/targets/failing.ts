/** Test targets that fail: by throwing, by returning NaN, or by ending their worker thread. */
import { existsSync, writeFileSync } from 'node:fs';

const unitGaussian = (x: Float64Array) => {
  let q = 0;
  for (const v of x) q += v * v;
  return -0.5 * q;
};

/** Throws when x0 > above; otherwise a unit Gaussian. */
export function throwingTarget(options: { above: number }): (x: Float64Array) => number {
  return (x) => {
    if (x[0] > options.above) throw new Error(`model undefined for x0 = ${x[0]}`);
    return unitGaussian(x);
  };
}

/** Returns NaN when x0 > above (zero probability); otherwise a unit Gaussian. */
export function nanTarget(options: { above: number }): (x: Float64Array) => number {
  return (x) => (x[0] > options.above ? Number.NaN : unitGaussian(x));
}

/**
 * Ends its worker thread (process.exit inside a worker ends only the thread)
 * on its `after`-th call. With `marker`, only the first worker to get there
 * crashes: it writes the marker file first, and later workers see it.
 */
export function crashingTarget(options: { after: number; marker?: string }): (x: Float64Array) => number {
  let calls = 0;
  return (x) => {
    if (++calls === options.after) {
      if (options.marker === undefined) process.exit(3);
      if (!existsSync(options.marker)) {
        writeFileSync(options.marker, 'crashed once\n');
        process.exit(3);
      }
    }
    return unitGaussian(x);
  };
}
