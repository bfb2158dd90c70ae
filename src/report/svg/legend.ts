import { svgMarker, type MarkerKind } from './markers.js';
import { INK } from './palette.js';
import { richTextWidthEm } from './rich-text.js';
import { FONT_SIZE } from './svg-document.js';
import { svgLine, svgRect, svgText } from './svg-elements.js';

export interface LegendEntry {
  label: string;
  colour: string;
  /** How the sample swatch is drawn. */
  swatch: 'line' | 'dashed' | 'marker' | 'marker-line' | 'band';
  marker?: MarkerKind;
}

const ROW = 16;
const SWATCH = 20;

/** A legend box whose top-right corner sits at (right, top). */
export function renderLegend(entries: readonly LegendEntry[], right: number, top: number): string {
  if (entries.length === 0) return '';
  const textWidth = Math.max(...entries.map((e) => richTextWidthEm(e.label))) * FONT_SIZE;
  const width = SWATCH + 14 + textWidth;
  const left = right - width;
  let out = svgRect(left, top, width, entries.length * ROW + 6, {
    fill: '#ffffff',
    'fill-opacity': 0.85,
    stroke: '#bbbbbb',
    'stroke-width': 0.8,
  });
  entries.forEach((entry, i) => {
    const cy = top + 3 + ROW * i + ROW / 2;
    out += renderSwatch(entry, left + 5, cy) + svgText(left + 10 + SWATCH, cy + 4, entry.label, { fill: INK });
  });
  return out;
}

/** Height of a one-line legend drawn by renderLegendRow. */
export const LEGEND_ROW_HEIGHT = 18;

/** A legend on one line, entries side by side, right-aligned to `right`, centred vertically on y. */
export function renderLegendRow(entries: readonly LegendEntry[], right: number, y: number): string {
  const widths = entries.map((e) => SWATCH + 5 + richTextWidthEm(e.label) * FONT_SIZE + 14);
  let x = right - widths.reduce((a, b) => a + b, 0) + 14;
  let out = '';
  entries.forEach((entry, i) => {
    out += renderSwatch(entry, x, y) + svgText(x + SWATCH + 5, y + 4, entry.label, { fill: INK });
    x += widths[i];
  });
  return out;
}

function renderSwatch(entry: LegendEntry, x0: number, cy: number): string {
  if (entry.swatch === 'marker') return svgMarker(entry.marker ?? 'circle', x0 + SWATCH / 2, cy, 3.5, entry.colour);
  if (entry.swatch === 'band') {
    return svgRect(x0, cy - 5, SWATCH, 10, { fill: entry.colour, 'fill-opacity': 0.35, stroke: entry.colour, 'stroke-width': 1 });
  }
  const line = svgLine(x0, cy, x0 + SWATCH, cy, {
    stroke: entry.colour,
    'stroke-width': 1.8,
    'stroke-dasharray': entry.swatch === 'dashed' ? '5 3' : undefined,
  });
  return entry.swatch === 'marker-line' ? line + svgMarker(entry.marker ?? 'circle', x0 + SWATCH / 2, cy, 3.5, entry.colour) : line;
}
