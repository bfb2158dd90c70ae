import { InputError } from '../../contracts/input-error.js';
import { requireNonEmptyList } from '../plot-input-checks.js';
import { covarianceEllipse, deltaChiSquareTwoDof, ONE_SIGMA_MASS, TWO_SIGMA_MASS } from '../stats/covariance-ellipse.js';
import { axisDomain } from '../svg/axis-domain.js';
import { renderLegend } from '../svg/legend.js';
import { svgMarker } from '../svg/markers.js';
import { INK, seriesColour } from '../svg/palette.js';
import { makePanel } from '../svg/panel.js';
import { renderPanelAxes } from '../svg/panel-axes.js';
import { svgDocument } from '../svg/svg-document.js';
import { pathData, svgPath } from '../svg/svg-elements.js';
import { renderFigureTitle, titleSpace } from './figure-title.js';

export interface FisherForecastEllipse {
  label: string;
  /** Marginal 2x2 covariance of the two parameters (the inverse Fisher matrix restricted to them). */
  covariance: readonly (readonly number[])[];
}

export interface FisherEllipsePlotInput {
  xLabel: string;
  yLabel: string;
  /** Fiducial values: the centre of every ellipse. */
  fiducial: readonly [number, number];
  forecasts: readonly FisherForecastEllipse[];
  title?: string;
  width?: number;
  height?: number;
}

/**
 * Forecast confidence ellipses of two parameters, several forecasts
 * overlaid: solid for the region holding 68.27% of a 2-D Gaussian
 * (Delta chi^2 = 2.30), dashed for 95.45% (Delta chi^2 = 6.18).
 */
export function renderFisherEllipsePlotSvg(input: FisherEllipsePlotInput): string {
  requireNonEmptyList('Fisher forecasts', input.forecasts);
  if (!input.fiducial.every(Number.isFinite)) throw new InputError(`Fisher fiducial must be two finite numbers, got [${input.fiducial.join(', ')}]`);
  const ellipses = input.forecasts.map((f, i) => {
    const name = `forecasts[${i}].covariance (${f.label})`;
    return {
      inner: covarianceEllipse(input.fiducial, f.covariance, deltaChiSquareTwoDof(ONE_SIGMA_MASS), 120, name),
      outer: covarianceEllipse(input.fiducial, f.covariance, deltaChiSquareTwoDof(TWO_SIGMA_MASS), 120, name),
    };
  });
  const width = input.width ?? 520;
  const height = input.height ?? 460;
  const top = titleSpace(input.title);
  const outerPoints = ellipses.flatMap((e) => e.outer);
  const panel = makePanel(
    { left: 80, top, width: width - 80 - 16, height: height - top - 52 },
    { xDomain: axisDomain(outerPoints.map((p) => p[0]), 'linear', 0.06), yDomain: axisDomain(outerPoints.map((p) => p[1]), 'linear', 0.06) },
  );
  let body = renderPanelAxes(panel, { xLabel: input.xLabel, yLabel: input.yLabel, yLabelOffset: 56 });
  const toPixels = (pts: ReadonlyArray<readonly [number, number]>): Array<[number, number]> =>
    pts.map(([x, y]): [number, number] => [panel.x.map(x), panel.y.map(y)]);
  ellipses.forEach((e, i) => {
    const colour = seriesColour(i);
    body += svgPath(pathData(toPixels(e.outer), true), { fill: colour, 'fill-opacity': 0.08, stroke: colour, 'stroke-width': 1.2, 'stroke-dasharray': '5 3' });
    body += svgPath(pathData(toPixels(e.inner), true), { fill: colour, 'fill-opacity': 0.2, stroke: colour, 'stroke-width': 1.6 });
  });
  body += svgMarker('cross', panel.x.map(input.fiducial[0]), panel.y.map(input.fiducial[1]), 4, INK);
  body += renderLegend(
    input.forecasts.map((f, i) => ({ label: f.label, colour: seriesColour(i), swatch: 'band' as const })),
    panel.left + panel.width - 6,
    panel.top + 6,
  );
  body += renderFigureTitle(width, input.title);
  return svgDocument(width, height, input.title ?? `Forecast ellipses: ${input.yLabel} against ${input.xLabel}`, body);
}
