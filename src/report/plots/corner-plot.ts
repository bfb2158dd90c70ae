import { InputError } from '../../contracts/input-error.js';
import { requireFiniteValues, requireLength, requireNonEmptyList } from '../plot-input-checks.js';
import { credibleContours } from '../stats/credible-contours.js';
import { defaultBinCount, densityHistogram } from '../stats/density-histogram.js';
import { sampleDisplayRange } from '../stats/display-range.js';
import { renderLegend } from '../svg/legend.js';
import { INK, seriesColour } from '../svg/palette.js';
import { makePanel, type Panel, type PanelBox } from '../svg/panel.js';
import { renderPanelAxes, type PanelAxesStyle } from '../svg/panel-axes.js';
import { svgDocument } from '../svg/svg-document.js';
import { pathData, svgCircle, svgLine, svgPath, svgText } from '../svg/svg-elements.js';
import { renderFigureTitle, titleSpace } from './figure-title.js';

export interface CornerParameter {
  /** Axis label in rich-text markup, e.g. "b_1" or "σ_8". */
  label: string;
  truth?: number;
}

/** Posterior draws of one analysis: samples[p] holds the draws of parameter p (all the same length). */
export interface CornerSampleSet {
  label: string;
  samples: readonly ArrayLike<number>[];
}

export interface CornerPlotInput {
  parameters: readonly CornerParameter[];
  /** One or more analyses overlaid (e.g. P alone and P + B). */
  sets: readonly CornerSampleSet[];
  title?: string;
  /** Side of one panel, px. */
  cellSize?: number;
  /** Histogram and contour-grid bins across each axis. */
  bins?: number;
}

/** Credible fractions of the 2-D contours. */
export const CORNER_CONTOUR_FRACTIONS = [0.68, 0.95] as const;

const GAP = 8;
const LEFT = 70;
const BOTTOM = 56;
const RIGHT = 14;

/**
 * A triangle of panels: on the diagonal the 1-D marginal density of each
 * parameter as a histogram normalised to unit area; below it, for each pair,
 * the 68% and 95% highest-density regions of the smoothed 2-D sample density.
 * Truth values are dashed lines and a ring.
 */
export function renderCornerPlotSvg(input: CornerPlotInput): string {
  const np = input.parameters.length;
  requireNonEmptyList('corner parameters', input.parameters);
  requireNonEmptyList('corner sample sets', input.sets);
  input.sets.forEach((set, s) => {
    requireLength(`sets[${s}].samples`, set.samples, np, 'parameters');
    set.samples.forEach((v, p) => {
      requireFiniteValues(`sets[${s}].samples[${p}] (${input.parameters[p].label})`, v);
      requireLength(`sets[${s}].samples[${p}]`, v, set.samples[0].length, `sets[${s}].samples[0]`);
    });
    if (set.samples[0].length < 2) throw new InputError(`sets[${s}] has fewer than 2 draws`);
  });
  input.parameters.forEach((p, i) => {
    if (p.truth !== undefined && !Number.isFinite(p.truth)) throw new InputError(`parameters[${i}].truth is ${p.truth}`);
  });

  const cell = input.cellSize ?? (np <= 3 ? 170 : np <= 5 ? 130 : 100);
  const top = titleSpace(input.title) + 8;
  const width = LEFT + np * cell + (np - 1) * GAP + RIGHT;
  const height = top + np * cell + (np - 1) * GAP + BOTTOM;
  const ranges = input.parameters.map((p, i) =>
    mergeRanges(input.sets.map((set) => sampleDisplayRange(set.samples[i], p.truth === undefined ? [] : [p.truth]))),
  );
  const box = (row: number, col: number): PanelBox => ({ left: LEFT + col * (cell + GAP), top: top + row * (cell + GAP), width: cell, height: cell });

  let body = '';
  for (let row = 0; row < np; row++) {
    for (let col = 0; col <= row; col++) {
      const style = {
        xLabel: row === np - 1 ? input.parameters[col].label : undefined,
        yLabel: col === 0 && row > 0 ? input.parameters[row].label : undefined,
        xTickLabels: row === np - 1,
        yTickLabels: col === 0 && row > 0,
        labelsWithinPanel: true,
        yLabelOffset: 52,
      };
      if (row === col) body += diagonalPanel(input, row, box(row, col), ranges[row], style);
      else body += pairPanel(input, row, col, box(row, col), ranges[col], ranges[row], style, input.bins ?? 40);
    }
  }
  if (input.sets.length > 1) {
    body += renderLegend(
      input.sets.map((set, s) => ({ label: set.label, colour: seriesColour(s), swatch: 'band' as const })),
      width - RIGHT,
      top,
    );
  }
  body += renderFigureTitle(width, input.title);
  return svgDocument(width, height, input.title ?? 'Posterior corner plot', body);
}

function diagonalPanel(input: CornerPlotInput, p: number, box: PanelBox, range: [number, number], style: PanelAxesStyle): string {
  const histograms = input.sets.map((set) => densityHistogram(set.samples[p], range[0], range[1], input.bins ?? defaultBinCount(set.samples[p].length)));
  const peak = Math.max(...histograms.map((h) => Math.max(...h.density)));
  const panel = makePanel(box, { xDomain: range, yDomain: [0, peak * 1.1] });
  let out = renderPanelAxes(panel, { ...style, yTickLabels: false, yTickMarks: false, yLabel: undefined, grid: false });
  histograms.forEach((h, s) => {
    const colour = seriesColour(s);
    const step: Array<[number, number]> = [[panel.x.map(h.edges[0]), panel.y.map(0)]];
    h.density.forEach((d, i) => step.push([panel.x.map(h.edges[i]), panel.y.map(d)], [panel.x.map(h.edges[i + 1]), panel.y.map(d)]));
    step.push([panel.x.map(h.edges[h.edges.length - 1]), panel.y.map(0)]);
    out += svgPath(pathData(step), { fill: colour, 'fill-opacity': 0.18, stroke: colour, 'stroke-width': 1.3 });
  });
  const truth = input.parameters[p].truth;
  if (truth !== undefined) out += truthLine(panel, truth, 'x');
  if (style.xLabel === undefined) {
    out += svgText(box.left + box.width / 2, box.top - 5, input.parameters[p].label, { 'text-anchor': 'middle' });
  }
  return out;
}

function pairPanel(
  input: CornerPlotInput,
  row: number,
  col: number,
  box: PanelBox,
  xRange: [number, number],
  yRange: [number, number],
  style: PanelAxesStyle,
  bins: number,
): string {
  const panel = makePanel(box, { xDomain: xRange, yDomain: yRange });
  let out = renderPanelAxes(panel, { ...style, grid: false });
  const toPixels = (loop: ReadonlyArray<readonly [number, number]>): Array<[number, number]> =>
    loop.map(([x, y]): [number, number] => [panel.x.map(x), panel.y.map(y)]);
  input.sets.forEach((set, s) => {
    const colour = seriesColour(s);
    const contours = credibleContours(set.samples[col], set.samples[row], CORNER_CONTOUR_FRACTIONS, {
      xDomain: xRange,
      yDomain: yRange,
      bins,
      smoothingCells: 1,
    });
    // Widest region first so the 68% region is painted over the 95% one.
    for (const c of [...contours].sort((a, b) => b.fraction - a.fraction)) {
      const d = c.loops.map((loop) => pathData(toPixels(loop), true)).join('');
      if (d === '') continue;
      out += svgPath(d, {
        fill: colour,
        'fill-opacity': c.fraction > 0.9 ? 0.2 : 0.45,
        'fill-rule': 'evenodd',
        stroke: colour,
        'stroke-width': c.fraction > 0.9 ? 0.9 : 1.3,
      });
    }
  });
  const tx = input.parameters[col].truth;
  const ty = input.parameters[row].truth;
  if (tx !== undefined) out += truthLine(panel, tx, 'x');
  if (ty !== undefined) out += truthLine(panel, ty, 'y');
  if (tx !== undefined && ty !== undefined) {
    out += svgCircle(panel.x.map(tx), panel.y.map(ty), 3.5, { fill: 'none', stroke: INK, 'stroke-width': 1.2 });
  }
  return out;
}

function truthLine(panel: Panel, value: number, axis: 'x' | 'y'): string {
  const attrs = { stroke: INK, 'stroke-width': 1, 'stroke-dasharray': '4 3' };
  if (axis === 'x') {
    const x = panel.x.map(value);
    return svgLine(x, panel.top, x, panel.top + panel.height, attrs);
  }
  const y = panel.y.map(value);
  return svgLine(panel.left, y, panel.left + panel.width, y, attrs);
}

function mergeRanges(ranges: ReadonlyArray<[number, number]>): [number, number] {
  return [Math.min(...ranges.map((r) => r[0])), Math.max(...ranges.map((r) => r[1]))];
}
