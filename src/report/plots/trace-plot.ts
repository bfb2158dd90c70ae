import { InputError } from '../../contracts/input-error.js';
import { requireFiniteValues, requireLength, requireNonEmptyList } from '../plot-input-checks.js';
import { axisDomain } from '../svg/axis-domain.js';
import { BAND_GREY, INK, seriesColour } from '../svg/palette.js';
import { makePanel } from '../svg/panel.js';
import { renderPanelAxes } from '../svg/panel-axes.js';
import { svgDocument } from '../svg/svg-document.js';
import { pathData, svgLine, svgPath, svgRect } from '../svg/svg-elements.js';
import { renderFigureTitle, titleSpace } from './figure-title.js';

export interface TraceParameter {
  label: string;
  /** One series per chain (or walker), all of the same length, in step order. */
  chains: readonly ArrayLike<number>[];
  truth?: number;
}

export interface TracePlotInput {
  parameters: readonly TraceParameter[];
  /** Steps discarded as burn-in, shaded (default 0). */
  burnIn?: number;
  /** Each chain is thinned to at most this many drawn points (default 800, fewer with many chains: ~24000 per panel, at least 100 each). */
  maxPointsPerChain?: number;
  title?: string;
  width?: number;
  rowHeight?: number;
}

/** One panel per parameter with every chain's value against step number. */
export function renderTracePlotSvg(input: TracePlotInput): string {
  requireNonEmptyList('trace parameters', input.parameters);
  const steps = input.parameters[0].chains[0]?.length ?? 0;
  input.parameters.forEach((p, i) => {
    requireNonEmptyList(`trace parameters[${i}].chains (${p.label})`, p.chains);
    requireLength(`trace parameters[${i}].chains`, p.chains, input.parameters[0].chains.length, 'trace parameters[0].chains');
    p.chains.forEach((c, j) => {
      requireFiniteValues(`trace parameters[${i}].chains[${j}] (${p.label})`, c);
      requireLength(`trace parameters[${i}].chains[${j}]`, c, steps, 'trace parameters[0].chains[0]');
    });
  });
  const burnIn = input.burnIn ?? 0;
  if (!Number.isInteger(burnIn) || burnIn < 0 || burnIn >= steps) {
    throw new InputError(`trace burnIn must be a whole number in [0, ${steps}), got ${burnIn}`);
  }
  const chainCount = input.parameters[0].chains.length;
  const perChain = input.maxPointsPerChain ?? Math.max(100, Math.min(800, Math.floor(24000 / chainCount)));
  const stride = Math.max(1, Math.ceil(steps / perChain));
  const width = input.width ?? 720;
  const rowHeight = input.rowHeight ?? 110;
  const top = titleSpace(input.title);
  const gap = 10;
  const np = input.parameters.length;
  const height = top + np * rowHeight + (np - 1) * gap + 48;
  const xDomain: [number, number] = [0, Math.max(1, steps - 1)];
  const many = chainCount > 8;

  let body = '';
  input.parameters.forEach((p, row) => {
    const last = row === np - 1;
    const values = p.chains.flatMap((c) => Array.from(c));
    const panel = makePanel(
      { left: 76, top: top + row * (rowHeight + gap), width: width - 76 - 16, height: rowHeight },
      { xDomain, yDomain: axisDomain(p.truth === undefined ? values : [...values, p.truth], 'linear', 0.05), yTicks: 3 },
    );
    if (burnIn > 0) {
      body += svgRect(panel.left, panel.top, panel.x.map(burnIn) - panel.left, panel.height, { fill: BAND_GREY, 'fill-opacity': 0.5 });
    }
    body += renderPanelAxes(panel, { yLabel: p.label, xLabel: last ? 'step' : undefined, xTickLabels: last, yLabelOffset: 52 });
    p.chains.forEach((c, j) => {
      const pts: Array<[number, number]> = [];
      for (let s = 0; s < steps; s += stride) pts.push([panel.x.map(s), panel.y.map(c[s])]);
      if ((steps - 1) % stride !== 0) pts.push([panel.x.map(steps - 1), panel.y.map(c[steps - 1])]);
      body += svgPath(pathData(pts), {
        fill: 'none',
        stroke: seriesColour(j),
        'stroke-width': many ? 0.6 : 0.9,
        'stroke-opacity': many ? 0.55 : 0.85,
      });
    });
    if (p.truth !== undefined) {
      const y = panel.y.map(p.truth);
      body += svgLine(panel.left, y, panel.left + panel.width, y, { stroke: INK, 'stroke-width': 1.2, 'stroke-dasharray': '5 3' });
    }
  });
  body += renderFigureTitle(width, input.title);
  return svgDocument(width, height, input.title ?? 'Chain traces', body);
}
