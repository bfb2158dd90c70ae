import { axisScale } from './axis-scale.js';
import { divergingColour } from './diverging-colour.js';
import { INK } from './palette.js';
import { rotationAbout, svgLine, svgRect, svgText } from './svg-elements.js';

const STEPS = 48;

/**
 * A vertical colour bar for the diverging scale on [-limit, +limit], with
 * ticks on its right and a rotated label.
 */
export function renderDivergingColourBar(left: number, top: number, width: number, height: number, limit: number, label: string): string {
  let out = '';
  for (let i = 0; i < STEPS; i++) {
    // Step i covers values from the top (+limit) downwards.
    const t = 1 - (2 * (i + 0.5)) / STEPS;
    out += svgRect(left, top + (height * i) / STEPS, width, height / STEPS + 0.5, { fill: divergingColour(t) });
  }
  out += svgRect(left, top, width, height, { fill: 'none', stroke: INK, 'stroke-width': 0.8 });
  const scale = axisScale('linear', [-limit, limit], [top + height, top], 5);
  for (const v of scale.ticks.values) {
    const y = scale.map(v);
    out += svgLine(left + width, y, left + width + 4, y, { stroke: INK });
    out += svgText(left + width + 7, y + 4, scale.tickLabel(v));
  }
  const lx = left + width + 42;
  const ly = top + height / 2;
  out += svgText(lx, ly, label, { 'text-anchor': 'middle', transform: rotationAbout(90, lx, ly) });
  return out;
}
