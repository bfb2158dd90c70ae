import { InputError } from '../../contracts/input-error.js';
import { requireFiniteValues, requireLength, requireMatchingSeries } from '../plot-input-checks.js';
import type { AxisKind } from '../svg/axis-scale.js';
import { axisDomain } from '../svg/axis-domain.js';
import { svgErrorBar } from '../svg/error-bar.js';
import { renderLegendRow, type LegendEntry } from '../svg/legend.js';
import { svgMarker } from '../svg/markers.js';
import { INK } from '../svg/palette.js';
import { makePanel } from '../svg/panel.js';
import { renderPanelAxes } from '../svg/panel-axes.js';
import { svgDocument } from '../svg/svg-document.js';
import { pathData, svgPath } from '../svg/svg-elements.js';
import { renderFigureTitle } from './figure-title.js';
import { mainAndResidualBoxes, renderResidualBands, residualDomain, residualsInSigma } from './residual-panel.js';
import { shapeClassStyle, TRIANGLE_SHAPE_CLASSES } from './shape-classes.js';

export interface BispectrumPlotInput {
  /** Multipole order of the bispectrum shown (0 for B_0, 2 for B_2). */
  ell: number;
  /** Measured B_ell per triangle bin, (Mpc/h)^6, in triangle-list order. */
  data: ArrayLike<number>;
  sigma: ArrayLike<number>;
  model: ArrayLike<number>;
  /** Shape class of each triangle: equilateral, isosceles, squeezed, flattened or general. */
  shapeClass: readonly string[];
  /** x positions (default 0, 1, 2, ...: the triangle index). */
  index?: ArrayLike<number>;
  /** Default: log when data - sigma and the model are all positive, else linear. */
  yScale?: AxisKind;
  yLabel?: string;
  title?: string;
  width?: number;
  height?: number;
}

/**
 * A bispectrum multipole against triangle index, data with 1-sigma error
 * bars coloured (and shaped) by triangle class and the model as a line,
 * above the residuals (data - model) / sigma.
 */
export function renderBispectrumPlotSvg(input: BispectrumPlotInput): string {
  const n = input.data.length;
  if (!Number.isInteger(input.ell) || input.ell < 0) throw new InputError(`bispectrum ell must be a whole number >= 0, got ${input.ell}`);
  requireFiniteValues('bispectrum data', input.data);
  requireLength('bispectrum shapeClass', input.shapeClass, n, 'bispectrum data');
  const index = input.index ?? Float64Array.from({ length: n }, (_, i) => i);
  requireMatchingSeries('bispectrum data', n, [
    ['bispectrum sigma', input.sigma, 'positive'],
    ['bispectrum model', input.model, 'finite'],
    ['bispectrum index', index, 'finite'],
  ]);
  const styles = input.shapeClass.map((c, i) => shapeClassStyle(c, `bispectrum shapeClass[${i}]`));

  const width = input.width ?? 720;
  const height = input.height ?? 520;
  const boxes = mainAndResidualBoxes(width, height, input.title);
  const lows = Array.from(input.data, (d, i) => d - input.sigma[i]);
  const highs = Array.from(input.data, (d, i) => d + input.sigma[i]);
  const allPositive = lows.every((v) => v > 0) && Array.from(input.model).every((v) => v > 0);
  const yKind = input.yScale ?? (allPositive ? 'log' : 'linear');
  const yValues = [...lows, ...highs, ...Array.from(input.model)].filter((v) => yKind === 'linear' || v > 0);
  const xDomain = axisDomain(index, 'linear', 0.02);
  const main = makePanel(boxes.main, { xDomain, yDomain: axisDomain(yValues, yKind, 0.05), yKind });
  const residuals = residualsInSigma(input.data, input.model, input.sigma);
  const resid = makePanel(boxes.residual, { xDomain, yDomain: residualDomain(residuals), yTicks: 3 });
  // On a log axis an error bar reaching zero or below is drawn to the bottom of the panel.
  const yPixel = (v: number): number => (yKind === 'log' && v <= 0 ? main.top + main.height : main.y.map(v));

  let body = renderPanelAxes(main, { yLabel: input.yLabel ?? `B_${input.ell}  [(Mpc/h)^6]`, xTickLabels: false, yLabelOffset: 58 });
  body += renderResidualBands(resid);
  body += renderPanelAxes(resid, { xLabel: 'triangle index', yLabel: 'Δ/σ', grid: false, yLabelOffset: 58 });
  const modelLine = Array.from(index, (x, i): [number, number] => [main.x.map(x), main.y.map(input.model[i])]);
  body += svgPath(pathData(modelLine), { fill: 'none', stroke: INK, 'stroke-width': 1, 'stroke-opacity': 0.8 });
  const radius = n > 300 ? 1.8 : n > 100 ? 2.4 : 3.2;
  for (let i = 0; i < n; i++) {
    const x = main.x.map(index[i]);
    const { colour, marker } = styles[i];
    body += svgErrorBar(x, yPixel(lows[i]), yPixel(highs[i]), colour, 0);
    body += svgMarker(marker, x, main.y.map(input.data[i]), radius, colour);
    body += svgMarker(marker, x, resid.y.map(residuals[i]), radius * 0.9, colour);
  }
  const present = TRIANGLE_SHAPE_CLASSES.filter((c) => input.shapeClass.includes(c));
  const legend: LegendEntry[] = present.map((c) => ({ label: c, swatch: 'marker', ...shapeClassStyle(c, 'legend') }));
  legend.push({ label: 'model', colour: INK, swatch: 'line' });
  body += renderLegendRow(legend, main.left + main.width, boxes.legendY);
  body += renderFigureTitle(width, input.title);
  return svgDocument(width, height, input.title ?? `Bispectrum multipole B_${input.ell}: data and model`, body);
}
