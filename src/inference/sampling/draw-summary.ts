/** Mean and standard deviation (n - 1 denominator) of the draws of several chains together. */
export function meanAndSd(chains: readonly Float64Array[]): { mean: number; sd: number } {
  let n = 0;
  let sum = 0;
  for (const c of chains) {
    for (let i = 0; i < c.length; i++) sum += c[i];
    n += c.length;
  }
  const mean = sum / n;
  let ss = 0;
  for (const c of chains) for (let i = 0; i < c.length; i++) ss += (c[i] - mean) ** 2;
  return { mean, sd: Math.sqrt(ss / (n - 1)) };
}

/** Acceptance fractions accepted/steps over members: mean, min, max. */
export function acceptanceSummary(accepted: Float64Array, steps: number): { mean: number; min: number; max: number } {
  if (steps === 0) return { mean: 0, min: 0, max: 0 };
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  for (const a of accepted) {
    const f = a / steps;
    sum += f;
    min = Math.min(min, f);
    max = Math.max(max, f);
  }
  return { mean: sum / accepted.length, min, max };
}
