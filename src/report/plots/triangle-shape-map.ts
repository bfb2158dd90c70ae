import { InputError } from '../../contracts/input-error.js';
import { requireFiniteValues, requireMatchingSeries } from '../plot-input-checks.js';
import { renderDivergingColourBar } from '../svg/colour-bar.js';
import { divergingColour } from '../svg/diverging-colour.js';
import { MUTED_INK } from '../svg/palette.js';
import { makePanel } from '../svg/panel.js';
import { renderPanelAxes } from '../svg/panel-axes.js';
import { svgDocument } from '../svg/svg-document.js';
import { pathData, svgCircle, svgPath, svgText } from '../svg/svg-elements.js';
import { renderFigureTitle, titleSpace } from './figure-title.js';

export interface TriangleShapeMapInput {
  /** Triangle sides per bin (any order; sorted so that k1 >= k2 >= k3 here). */
  k1: ArrayLike<number>;
  k2: ArrayLike<number>;
  k3: ArrayLike<number>;
  /** One value per triangle, typically (data - model) / sigma. */
  value: ArrayLike<number>;
  /** Colour scale runs over [-limit, +limit] (default: the largest |value| rounded up, at least 2). */
  limit?: number;
  colourLabel?: string;
  title?: string;
  width?: number;
}

/**
 * Residuals in the plane of triangle shapes, x = k2/k1 and y = k3/k1 with
 * k1 >= k2 >= k3: equilateral at (1, 1), squeezed at (1, 0), flattened along
 * x + y = 1. Each triangle is a disc coloured on a diverging scale; larger
 * |values| are drawn last so they are not hidden by overlapping shapes.
 */
export function renderTriangleShapeMapSvg(input: TriangleShapeMapInput): string {
  const n = input.value.length;
  requireFiniteValues('shape map value', input.value);
  requireMatchingSeries('shape map value', n, [
    ['shape map k1', input.k1, 'positive'],
    ['shape map k2', input.k2, 'positive'],
    ['shape map k3', input.k3, 'positive'],
  ]);
  const shapes = Array.from({ length: n }, (_, i) => {
    const [a, b, c] = [input.k1[i], input.k2[i], input.k3[i]].sort((p, q) => q - p);
    return { x: b / a, y: c / a, value: input.value[i] };
  });
  let maxAbs = 0;
  for (const s of shapes) maxAbs = Math.max(maxAbs, Math.abs(s.value));
  const limit = input.limit ?? Math.max(2, Math.ceil(maxAbs));
  if (!(limit > 0) || !Number.isFinite(limit)) throw new InputError(`shape map limit must be a positive number, got ${limit}`);

  const side = (input.width ?? 560) - 70 - 110;
  const top = titleSpace(input.title);
  const width = 70 + side + 110;
  const height = top + side + 52;
  const xMin = Math.min(0.5, ...shapes.map((s) => s.x)) - 0.03;
  const panel = makePanel({ left: 70, top, width: side, height: side }, { xDomain: [xMin, 1.03], yDomain: [-0.03, 1.03] });
  let body = renderPanelAxes(panel, { xLabel: 'k_2 / k_1', yLabel: 'k_3 / k_1', yLabelOffset: 44 });
  // Edges of the region of closed triangles with ordered sides: y = x, x = 1 and the flattened line x + y = 1.
  const edge: Array<[number, number]> = [
    [0.5, 0.5],
    [1, 1],
    [1, 0],
    [0.5, 0.5],
  ];
  body += svgPath(pathData(edge.map(([x, y]): [number, number] => [panel.x.map(x), panel.y.map(y)])), {
    fill: 'none',
    stroke: MUTED_INK,
    'stroke-width': 1,
    'stroke-dasharray': '4 3',
  });
  const note = (x: number, y: number, text: string, anchor: string): string =>
    svgText(panel.x.map(x), panel.y.map(y), text, { 'text-anchor': anchor, fill: MUTED_INK, 'font-size': 10 });
  body += note(0.985, 1.0, 'equilateral', 'end') + note(0.985, 0.02, 'squeezed', 'end') + note(0.7, 0.26, 'flattened', 'end');
  const radius = n > 300 ? 3.5 : 5;
  for (const s of [...shapes].sort((p, q) => Math.abs(p.value) - Math.abs(q.value))) {
    body += svgCircle(panel.x.map(s.x), panel.y.map(s.y), radius, {
      fill: divergingColour(s.value / limit),
      stroke: '#555555',
      'stroke-width': 0.5,
    });
  }
  body += renderDivergingColourBar(70 + side + 18, top, 14, side, limit, input.colourLabel ?? '(data − model) / σ');
  body += renderFigureTitle(width, input.title);
  return svgDocument(width, height, input.title ?? 'Bispectrum residuals by triangle shape', body);
}
