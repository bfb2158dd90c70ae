import { InputError } from '../../contracts/input-error.js';
import type { Random } from '../../numerics/random.js';

/**
 * One sampled parameter as the samplers see it: hard bounds (points outside
 * get zero probability without calling the log-posterior) and how to draw
 * starting points: a Gaussian ball start +- scale when both are given,
 * otherwise uniform between finite bounds.
 */
export interface SampledParameter {
  readonly name: string;
  readonly lower?: number;
  readonly upper?: number;
  readonly start?: number;
  readonly scale?: number;
}

/** A validated parameter: bounds filled in (+-Infinity when open). */
export interface BoundedParameter {
  readonly name: string;
  readonly lower: number;
  readonly upper: number;
  readonly start: number | null;
  readonly scale: number | null;
}

export function validateSampledParameters(parameters: readonly SampledParameter[], field = 'parameters'): BoundedParameter[] {
  if (!Array.isArray(parameters) || parameters.length === 0) throw new InputError(`${field} must be a non-empty list`);
  const seen = new Set<string>();
  return parameters.map((p, i) => {
    const at = `${field}[${i}]`;
    if (typeof p?.name !== 'string' || !/^[A-Za-z_][A-Za-z0-9_]*$/.test(p.name)) {
      throw new InputError(`${at}.name must be an identifier (letters, digits, _), got ${JSON.stringify(p?.name)}`);
    }
    if (seen.has(p.name)) throw new InputError(`${at}.name "${p.name}" is listed twice`);
    seen.add(p.name);
    const lower = p.lower ?? -Infinity;
    const upper = p.upper ?? Infinity;
    if (typeof lower !== 'number' || Number.isNaN(lower)) throw new InputError(`${at}.lower must be a number`);
    if (typeof upper !== 'number' || Number.isNaN(upper)) throw new InputError(`${at}.upper must be a number`);
    if (!(lower < upper)) throw new InputError(`${at}: lower (${lower}) must be below upper (${upper})`);
    const start = p.start ?? null;
    const scale = p.scale ?? null;
    if (start !== null && !(Number.isFinite(start) && start >= lower && start <= upper)) {
      throw new InputError(`${at}.start must be a finite number within [lower, upper]`);
    }
    if (scale !== null && !(Number.isFinite(scale) && scale > 0)) throw new InputError(`${at}.scale must be a positive number`);
    if ((start === null || scale === null) && !(Number.isFinite(lower) && Number.isFinite(upper))) {
      throw new InputError(`${at} needs start and scale, or finite lower and upper bounds, to draw starting points`);
    }
    return { name: p.name, lower, upper, start, scale };
  });
}

/** True when theta lies within all bounds. */
export function withinParameterBounds(parameters: readonly BoundedParameter[], theta: Float64Array, offset = 0): boolean {
  for (let i = 0; i < parameters.length; i++) {
    const v = theta[offset + i];
    if (!(v >= parameters[i].lower && v <= parameters[i].upper)) return false;
  }
  return true;
}

/** Draw one starting point into out[offset ..]. */
export function drawStartingPoint(parameters: readonly BoundedParameter[], random: Random, out: Float64Array, offset = 0): void {
  for (let i = 0; i < parameters.length; i++) {
    const p = parameters[i];
    if (p.start !== null && p.scale !== null) {
      let v: number;
      let tries = 0;
      do {
        v = p.start + p.scale * random.normal();
        if (++tries > 1000) throw new InputError(`parameters[${i}]: the start ball ${p.start} +- ${p.scale} lies outside the bounds`);
      } while (!(v >= p.lower && v <= p.upper));
      out[offset + i] = v;
    } else {
      out[offset + i] = p.lower + (p.upper - p.lower) * random.uniform();
    }
  }
}
