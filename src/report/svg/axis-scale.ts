import { InputError } from '../../contracts/input-error.js';
import { linearTicks, type TickSet } from './linear-ticks.js';
import { logTicks } from './log-ticks.js';
import { linearTickLabel, logTickLabel } from './tick-label.js';

export type AxisKind = 'linear' | 'log';

/** A map from data values to pixels along one axis, with its ticks. */
export interface AxisScale {
  kind: AxisKind;
  domain: readonly [number, number];
  /** Pixel positions of domain[0] and domain[1] (y axes run downwards, so range[0] > range[1]). */
  range: readonly [number, number];
  map(value: number): number;
  ticks: TickSet;
  tickLabel(value: number): string;
}

export function axisScale(kind: AxisKind, domain: readonly [number, number], range: readonly [number, number], tickTarget = 5): AxisScale {
  const [d0, d1] = domain;
  if (!(d1 > d0)) throw new Error(`internal: empty axis domain [${d0}, ${d1}]`);
  if (kind === 'log') {
    if (!(d0 > 0)) throw new InputError(`log axis needs positive values, the smallest is ${d0}`);
    const l0 = Math.log10(d0);
    const span = Math.log10(d1) - l0;
    return {
      kind,
      domain,
      range,
      map: (v) => range[0] + ((Math.log10(v) - l0) / span) * (range[1] - range[0]),
      ticks: logTicks(d0, d1),
      tickLabel: logTickLabel,
    };
  }
  const ticks = linearTicks(d0, d1, tickTarget);
  return {
    kind,
    domain,
    range,
    map: (v) => range[0] + ((v - d0) / (d1 - d0)) * (range[1] - range[0]),
    ticks,
    tickLabel: (v) => linearTickLabel(v, ticks.step),
  };
}
