import { svgLine } from './svg-elements.js';

/** A vertical error bar from yLow to yHigh (pixels) at x, with short caps. */
export function svgErrorBar(x: number, yLow: number, yHigh: number, colour: string, cap = 2.5): string {
  const attrs = { stroke: colour, 'stroke-width': 1 };
  return (
    svgLine(x, yLow, x, yHigh, attrs) +
    (cap > 0 ? svgLine(x - cap, yLow, x + cap, yLow, attrs) + svgLine(x - cap, yHigh, x + cap, yHigh, attrs) : '')
  );
}
