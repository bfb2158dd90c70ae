import { InputError } from '../../contracts/input-error.js';
import { requireFiniteValues, requireMatchingSeries, requireNonEmptyList } from '../plot-input-checks.js';
import { axisDomain } from '../svg/axis-domain.js';
import { svgErrorBar } from '../svg/error-bar.js';
import { renderLegendRow, type LegendEntry } from '../svg/legend.js';
import { MARKER_KINDS, svgMarker } from '../svg/markers.js';
import { seriesColour } from '../svg/palette.js';
import { makePanel } from '../svg/panel.js';
import { renderPanelAxes } from '../svg/panel-axes.js';
import { svgDocument } from '../svg/svg-document.js';
import { pathData, svgPath } from '../svg/svg-elements.js';
import { renderFigureTitle } from './figure-title.js';
import { mainAndResidualBoxes, renderResidualBands, residualDomain, residualsInSigma } from './residual-panel.js';

/** One measured power-spectrum multipole with its model at the same k. */
export interface MultipoleSeries {
  /** Legendre order: 0, 2, 4, ... */
  ell: number;
  /** Bin wavenumbers, h/Mpc. */
  k: ArrayLike<number>;
  /** Measured P_ell(k), (Mpc/h)^3. */
  data: ArrayLike<number>;
  /** Standard deviation of data (square root of the covariance diagonal). */
  sigma: ArrayLike<number>;
  /** Model P_ell(k) at the same k. */
  model: ArrayLike<number>;
}

export interface MultipolePlotInput {
  multipoles: readonly MultipoleSeries[];
  title?: string;
  width?: number;
  height?: number;
}

/**
 * Data against model for the power-spectrum multipoles, plotted as k P_ell(k)
 * with 1-sigma error bars (points) and the model (line of the same colour),
 * and below it the residuals (data - model) / sigma with the ±1 and ±2 sigma
 * bands.
 */
export function renderMultipolePlotSvg(input: MultipolePlotInput): string {
  requireNonEmptyList('multipoles', input.multipoles);
  const series = input.multipoles.map((m, i) => checkedSeries(m, `multipoles[${i}]`));
  const width = input.width ?? 640;
  const height = input.height ?? 520;
  const boxes = mainAndResidualBoxes(width, height, input.title);

  const kAll = series.flatMap((s) => Array.from(s.k));
  const xDomain = axisDomain(kAll, 'linear', 0.04);
  const scaled = series.flatMap((s) => Array.from(s.k, (k, i) => [k * (s.data[i] - s.sigma[i]), k * (s.data[i] + s.sigma[i]), k * s.model[i]]).flat());
  const main = makePanel(boxes.main, { xDomain, yDomain: axisDomain(scaled, 'linear', 0.06) });
  const residuals = series.map((s) => residualsInSigma(s.data, s.model, s.sigma));
  const resid = makePanel(boxes.residual, { xDomain, yDomain: residualDomain(residuals.flatMap((r) => Array.from(r))), yTicks: 3 });

  let body = renderPanelAxes(main, { yLabel: 'k P_ℓ(k)  [(Mpc/h)^2]', xTickLabels: false });
  body += renderResidualBands(resid);
  body += renderPanelAxes(resid, { xLabel: 'k  [h/Mpc]', yLabel: 'Δ/σ', grid: false });
  const legend: LegendEntry[] = [];
  series.forEach((s, n) => {
    const colour = seriesColour(n);
    const marker = MARKER_KINDS[n % MARKER_KINDS.length];
    const modelPoints = Array.from(s.k, (k, i): [number, number] => [main.x.map(k), main.y.map(k * s.model[i])]);
    body += svgPath(pathData(modelPoints), { fill: 'none', stroke: colour, 'stroke-width': 1.6 });
    for (let i = 0; i < s.k.length; i++) {
      const k = s.k[i];
      const x = main.x.map(k);
      body += svgErrorBar(x, main.y.map(k * (s.data[i] - s.sigma[i])), main.y.map(k * (s.data[i] + s.sigma[i])), colour, 0);
      body += svgMarker(marker, x, main.y.map(k * s.data[i]), 3.2, colour);
      body += svgMarker(marker, x, resid.y.map(residuals[n][i]), 2.8, colour);
    }
    legend.push({ label: `P_${s.ell}`, colour, swatch: 'marker-line', marker });
  });
  body += renderLegendRow(legend, main.left + main.width, boxes.legendY);
  body += renderFigureTitle(width, input.title);
  return svgDocument(width, height, input.title ?? 'Power-spectrum multipoles: data and model', body);
}

function checkedSeries(m: MultipoleSeries, name: string): MultipoleSeries {
  if (!Number.isInteger(m.ell) || m.ell < 0) throw new InputError(`${name}.ell must be a whole number >= 0, got ${m.ell}`);
  requireFiniteValues(`${name}.k`, m.k);
  requireMatchingSeries(`${name}.k`, m.k.length, [
    [`${name}.data`, m.data, 'finite'],
    [`${name}.sigma`, m.sigma, 'positive'],
    [`${name}.model`, m.model, 'finite'],
  ]);
  return m;
}
