import { LEGEND_ROW_HEIGHT } from '../svg/legend.js';
import { BAND_GREY, INK } from '../svg/palette.js';
import type { Panel, PanelBox } from '../svg/panel.js';
import { svgLine, svgRect } from '../svg/svg-elements.js';
import { titleSpace } from './figure-title.js';

export interface MainAndResidualBoxes {
  main: PanelBox;
  residual: PanelBox;
  /** Baseline height of the one-line legend above the main panel. */
  legendY: number;
}

/**
 * A data panel above a residual panel sharing its x axis (the residual panel
 * takes ~30% of the height), with a legend line above the data panel.
 */
export function mainAndResidualBoxes(width: number, height: number, title: string | undefined): MainAndResidualBoxes {
  const left = 76;
  const right = 16;
  const top = titleSpace(title) + LEGEND_ROW_HEIGHT + 4;
  const bottom = 48;
  const gap = 8;
  const usable = height - top - bottom - gap;
  const residualHeight = Math.round(usable * 0.3);
  const panelWidth = width - left - right;
  return {
    main: { left, top, width: panelWidth, height: usable - residualHeight },
    residual: { left, top: top + usable - residualHeight + gap, width: panelWidth, height: residualHeight },
    legendY: top - LEGEND_ROW_HEIGHT / 2 - 2,
  };
}

/** Symmetric residual range: at least ±3 sigma, wide enough for every finite residual. */
export function residualDomain(residuals: ArrayLike<number>): [number, number] {
  let max = 3;
  for (let i = 0; i < residuals.length; i++) if (Math.abs(residuals[i]) > max) max = Math.abs(residuals[i]);
  const limit = max > 3 ? Math.ceil(max) + 0.5 : 3.5;
  return [-limit, limit];
}

/** Shaded ±2 and ±1 sigma bands and the zero line, drawn under the residual points. */
export function renderResidualBands(panel: Panel): string {
  const band = (s: number, opacity: number): string => {
    const yTop = panel.y.map(s);
    return svgRect(panel.left, yTop, panel.width, panel.y.map(-s) - yTop, { fill: BAND_GREY, 'fill-opacity': opacity });
  };
  const y0 = panel.y.map(0);
  return band(2, 0.45) + band(1, 0.7) + svgLine(panel.left, y0, panel.left + panel.width, y0, { stroke: INK, 'stroke-width': 0.8 });
}

/** (data - model) / sigma, checked by the caller for equal lengths and positive sigma. */
export function residualsInSigma(data: ArrayLike<number>, model: ArrayLike<number>, sigma: ArrayLike<number>): Float64Array {
  const out = new Float64Array(data.length);
  for (let i = 0; i < data.length; i++) out[i] = (data[i] - model[i]) / sigma[i];
  return out;
}
