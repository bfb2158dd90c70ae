import { GRID_GREY, INK } from './palette.js';
import { richTextWidthEm } from './rich-text.js';
import { FONT_SIZE } from './svg-document.js';
import type { Panel } from './panel.js';
import { rotationAbout, svgLine, svgRect, svgText } from './svg-elements.js';

export interface PanelAxesStyle {
  xLabel?: string;
  yLabel?: string;
  /** Print tick labels on the x axis (off for panels stacked above another). */
  xTickLabels?: boolean;
  yTickLabels?: boolean;
  /** Draw the y tick marks at all (off for panels whose y scale means nothing to the reader). */
  yTickMarks?: boolean;
  grid?: boolean;
  /** Leave out tick labels that would reach past the panel's edges (for panels packed side by side). */
  labelsWithinPanel?: boolean;
  /** Distance of the y label from the frame, px. */
  yLabelOffset?: number;
}

const TICK_LENGTH = 4;

/** Grid, frame, ticks, tick labels and axis labels of one panel. */
export function renderPanelAxes(panel: Panel, style: PanelAxesStyle = {}): string {
  const bottom = panel.top + panel.height;
  const right = panel.left + panel.width;
  let out = '';
  if (style.grid ?? true) {
    for (const v of panel.x.ticks.values) {
      const px = panel.x.map(v);
      out += svgLine(px, panel.top, px, bottom, { stroke: GRID_GREY, 'stroke-width': 1 });
    }
    for (const v of panel.y.ticks.values) {
      const py = panel.y.map(v);
      out += svgLine(panel.left, py, right, py, { stroke: GRID_GREY, 'stroke-width': 1 });
    }
  }
  out += svgRect(panel.left, panel.top, panel.width, panel.height, { fill: 'none', stroke: INK, 'stroke-width': 1 });
  for (const v of panel.x.ticks.values) {
    const px = panel.x.map(v);
    out += svgLine(px, bottom, px, bottom + TICK_LENGTH, { stroke: INK });
    const label = panel.x.tickLabel(v);
    const halfWidth = (richTextWidthEm(label) * FONT_SIZE) / 2;
    const fits = !style.labelsWithinPanel || (px - halfWidth >= panel.left - 3 && px + halfWidth <= right + 3);
    if ((style.xTickLabels ?? true) && fits) out += svgText(px, bottom + TICK_LENGTH + 12, label, { 'text-anchor': 'middle' });
  }
  for (const v of style.yTickMarks ?? true ? panel.y.ticks.values : []) {
    const py = panel.y.map(v);
    out += svgLine(panel.left - TICK_LENGTH, py, panel.left, py, { stroke: INK });
    const fits = !style.labelsWithinPanel || (py >= panel.top + 2 && py <= bottom - 2);
    if ((style.yTickLabels ?? true) && fits) out += svgText(panel.left - TICK_LENGTH - 3, py + 4, panel.y.tickLabel(v), { 'text-anchor': 'end' });
  }
  if (style.xLabel !== undefined) {
    out += svgText(panel.left + panel.width / 2, bottom + 34, style.xLabel, { 'text-anchor': 'middle' });
  }
  if (style.yLabel !== undefined) {
    const x = panel.left - (style.yLabelOffset ?? 48);
    const y = panel.top + panel.height / 2;
    out += svgText(x, y, style.yLabel, { 'text-anchor': 'middle', transform: rotationAbout(-90, x, y) });
  }
  return out;
}
