/**
 * Priors of sampled parameters (log densities, normalised):
 *   uniform(min, max):      -ln(max - min) on [min, max];
 *   gaussian(mean, sigma):  -(x - mean)^2 / (2 sigma^2) - ln(sigma sqrt(2 pi)), optionally truncated
 *                           to [min, max] (the truncation is not renormalised: a constant);
 *   log-uniform(min, max):  -ln(x ln(max / min)) on [min, max], 0 < min;
 *   flat:                   improper unit density, allowed only for analytically marginalised parameters.
 * Outside the support the log density is -Infinity.
 */
export type PriorSpec =
  | { readonly kind: 'uniform'; readonly min: number; readonly max: number }
  | { readonly kind: 'gaussian'; readonly mean: number; readonly sigma: number; readonly min?: number; readonly max?: number }
  | { readonly kind: 'log-uniform'; readonly min: number; readonly max: number }
  | { readonly kind: 'flat' };

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

export function logPriorDensity(p: PriorSpec, x: number): number {
  switch (p.kind) {
    case 'uniform':
      return x >= p.min && x <= p.max ? -Math.log(p.max - p.min) : -Infinity;
    case 'gaussian': {
      if ((p.min !== undefined && x < p.min) || (p.max !== undefined && x > p.max)) return -Infinity;
      const z = (x - p.mean) / p.sigma;
      return -0.5 * z * z - Math.log(p.sigma) - LN_SQRT_2PI;
    }
    case 'log-uniform':
      return x >= p.min && x <= p.max ? -Math.log(x * Math.log(p.max / p.min)) : -Infinity;
    case 'flat':
      return 0;
  }
}

/** Problems with a prior specification, each naming `key`. */
export function priorProblems(p: unknown, key: string): string[] {
  const out: string[] = [];
  if (typeof p !== 'object' || p === null) return [`${key} must be an object with a "kind" (uniform, gaussian, log-uniform, flat)`];
  const v = p as Record<string, unknown>;
  const fields: Record<string, string[]> = { uniform: ['min', 'max'], gaussian: ['mean', 'sigma', 'min', 'max'], 'log-uniform': ['min', 'max'], flat: [] };
  const allowed = fields[String(v.kind)];
  if (!allowed) return [`${key}.kind must be uniform, gaussian, log-uniform or flat, got ${JSON.stringify(v.kind)}`];
  for (const k of Object.keys(v)) if (k !== 'kind' && !allowed.includes(k)) out.push(`${key}.${k} is not a field of a ${v.kind} prior (${allowed.join(', ')})`);
  const finite = (k: string, required: boolean) => {
    if (v[k] === undefined && !required) return;
    if (typeof v[k] !== 'number' || !Number.isFinite(v[k] as number)) out.push(`${key}.${k} must be a finite number, got ${JSON.stringify(v[k])}`);
  };
  if (v.kind === 'gaussian') {
    finite('mean', true);
    finite('sigma', true);
    finite('min', false);
    finite('max', false);
    if (typeof v.sigma === 'number' && !(v.sigma > 0)) out.push(`${key}.sigma must be positive, got ${v.sigma}`);
  } else if (v.kind !== 'flat') {
    finite('min', true);
    finite('max', true);
  }
  if (typeof v.min === 'number' && typeof v.max === 'number' && !(v.max > v.min)) out.push(`${key}: max (${v.max}) must exceed min (${v.min})`);
  if (v.kind === 'log-uniform' && typeof v.min === 'number' && !(v.min > 0)) out.push(`${key}.min must be positive for a log-uniform prior, got ${v.min}`);
  return out;
}
