import { InputError } from '../../contracts/input-error.js';
import { requireFiniteValues, requireLength, requireNonEmptyList } from '../plot-input-checks.js';
import type { AxisKind } from '../svg/axis-scale.js';
import { axisDomain } from '../svg/axis-domain.js';
import { svgErrorBar } from '../svg/error-bar.js';
import { LEGEND_ROW_HEIGHT, renderLegendRow, type LegendEntry } from '../svg/legend.js';
import { MARKER_KINDS, svgMarker } from '../svg/markers.js';
import { MUTED_INK, seriesColour } from '../svg/palette.js';
import { makePanel } from '../svg/panel.js';
import { renderPanelAxes } from '../svg/panel-axes.js';
import { svgDocument } from '../svg/svg-document.js';
import { pathData, svgLine, svgPath } from '../svg/svg-elements.js';
import { renderFigureTitle, titleSpace } from './figure-title.js';

export interface LineSeries {
  label: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  /** Optional band (lines) or error bars (points) from lower to upper. */
  lower?: ArrayLike<number>;
  upper?: ArrayLike<number>;
  /** 'line' (default), 'dashed', or 'points' with error bars. */
  style?: 'line' | 'dashed' | 'points';
}

export interface LinePlotInput {
  series: readonly LineSeries[];
  xLabel: string;
  yLabel: string;
  xScale?: AxisKind;
  yScale?: AxisKind;
  /** Horizontal reference lines, e.g. 0 for a shift or ±1 for a sigma. */
  referenceY?: readonly number[];
  title?: string;
  width?: number;
  height?: number;
}

/**
 * Several series against a common x, each a line (with an optional shaded
 * band) or points with error bars; for parameter shifts against k_max,
 * likelihood profiles, and the like.
 */
export function renderLinePlotSvg(input: LinePlotInput): string {
  requireNonEmptyList('line plot series', input.series);
  input.series.forEach((s, i) => {
    const name = `series[${i}] (${s.label})`;
    requireFiniteValues(`${name}.x`, s.x);
    requireLength(`${name}.y`, s.y, s.x.length, `${name}.x`);
    requireFiniteValues(`${name}.y`, s.y);
    if ((s.lower === undefined) !== (s.upper === undefined)) throw new InputError(`${name} needs both lower and upper, or neither`);
    if (s.lower !== undefined && s.upper !== undefined) {
      requireLength(`${name}.lower`, s.lower, s.x.length, `${name}.x`);
      requireLength(`${name}.upper`, s.upper, s.x.length, `${name}.x`);
      requireFiniteValues(`${name}.lower`, s.lower);
      requireFiniteValues(`${name}.upper`, s.upper);
    }
  });
  const width = input.width ?? 640;
  const height = input.height ?? 420;
  const top = titleSpace(input.title) + LEGEND_ROW_HEIGHT + 4;
  const xKind = input.xScale ?? 'linear';
  const yKind = input.yScale ?? 'linear';
  const ys = input.series.flatMap((s) => [...Array.from(s.y), ...Array.from(s.lower ?? []), ...Array.from(s.upper ?? [])]);
  const panel = makePanel(
    { left: 76, top, width: width - 76 - 16, height: height - top - 52 },
    {
      xKind,
      yKind,
      xDomain: axisDomain(input.series.flatMap((s) => Array.from(s.x)), xKind, 0.04),
      yDomain: axisDomain([...ys, ...(input.referenceY ?? [])], yKind, 0.06),
    },
  );
  let body = renderPanelAxes(panel, { xLabel: input.xLabel, yLabel: input.yLabel });
  for (const y of input.referenceY ?? []) {
    const py = panel.y.map(y);
    body += svgLine(panel.left, py, panel.left + panel.width, py, { stroke: MUTED_INK, 'stroke-width': 1, 'stroke-dasharray': '2 3' });
  }
  const legend: LegendEntry[] = [];
  input.series.forEach((s, n) => {
    const colour = seriesColour(n);
    const px = (i: number): number => panel.x.map(s.x[i]);
    const indices = Array.from({ length: s.x.length }, (_, i) => i);
    if (s.style === 'points') {
      const marker = MARKER_KINDS[n % MARKER_KINDS.length];
      for (const i of indices) {
        if (s.lower !== undefined && s.upper !== undefined) body += svgErrorBar(px(i), panel.y.map(s.lower[i]), panel.y.map(s.upper[i]), colour);
        body += svgMarker(marker, px(i), panel.y.map(s.y[i]), 3.2, colour);
      }
      legend.push({ label: s.label, colour, swatch: 'marker', marker });
      return;
    }
    if (s.lower !== undefined && s.upper !== undefined) {
      const { lower, upper } = s;
      const outline = [
        ...indices.map((i): [number, number] => [px(i), panel.y.map(upper[i])]),
        ...[...indices].reverse().map((i): [number, number] => [px(i), panel.y.map(lower[i])]),
      ];
      body += svgPath(pathData(outline, true), { fill: colour, 'fill-opacity': 0.2, stroke: 'none' });
    }
    body += svgPath(pathData(Array.from({ length: s.x.length }, (_, i): [number, number] => [px(i), panel.y.map(s.y[i])])), {
      fill: 'none',
      stroke: colour,
      'stroke-width': 1.6,
      'stroke-dasharray': s.style === 'dashed' ? '6 3' : undefined,
    });
    legend.push({ label: s.label, colour, swatch: s.style === 'dashed' ? 'dashed' : 'line' });
  });
  body += renderLegendRow(legend, panel.left + panel.width, top - LEGEND_ROW_HEIGHT / 2 - 2);
  body += renderFigureTitle(width, input.title);
  return svgDocument(width, height, input.title ?? `${input.yLabel} against ${input.xLabel}`, body);
}
