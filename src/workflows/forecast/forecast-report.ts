import { InputError } from '../../contracts/input-error.js';
import { renderFisherEllipsePlotSvg } from '../../report/plots/fisher-ellipse-plot.js';
import type { ForecastResult, StatisticSet } from './run-forecast.js';

/**
 * A forecast as text: the assumptions, a table of marginalised errors for
 * P, B and P + B, the conditional P + B error and the improvement factors,
 * any singular set with its degenerate direction, and every derivative
 * warning. Plus the ellipse plot of two parameters.
 */
const SET_LABELS: Record<StatisticSet, string> = { power: 'P', bispectrum: 'B', joint: 'P+B' };

const fmt = (v: number | undefined) => (v === undefined || !Number.isFinite(v) ? '—' : Number(v.toPrecision(3)).toString());

function sigmaOf(r: ForecastResult, set: StatisticSet, name: string, kind: 'marginalised' | 'conditional' = 'marginalised'): number | undefined {
  const e = r.sets[set]?.errors;
  const i = e?.names.indexOf(name) ?? -1;
  return e && i >= 0 ? e[kind][i] : undefined;
}

export function renderForecastTable(r: ForecastResult): string {
  const lines = ['Assumptions:', ...r.assumptions.map((a) => `  - ${a}`), ''];
  r.bins.forEach((b, i) => lines.push(`bin ${i + 1}: z = ${b.zMin}-${b.zMax} (z_eff ${b.zEff}), V = ${fmt(b.volume)} (Mpc/h)^3, nbar = ${b.nbar} (h/Mpc)^3, b1 = ${fmt(b.bias.b1)}, b2 = ${fmt(b.bias.b2)}, bG2 = ${fmt(b.bias.bG2)}; ${r.dataPoints[i].power} P and ${r.dataPoints[i].bispectrum} B data points`));
  lines.push('', '| parameter | fiducial | sigma P | sigma B | sigma P+B | conditional P+B | P / P+B | B / P+B |', '| --- | --- | --- | --- | --- | --- | --- | --- |');
  for (const [name, value] of Object.entries(r.fiducial)) {
    const g = r.improvement[name];
    lines.push(`| ${name} | ${fmt(value)} | ${fmt(sigmaOf(r, 'power', name))} | ${fmt(sigmaOf(r, 'bispectrum', name))} | ${fmt(sigmaOf(r, 'joint', name))} | ${fmt(sigmaOf(r, 'joint', name, 'conditional'))} | ${fmt(g?.overPower)} | ${fmt(g?.overBispectrum)} |`);
  }
  for (const [set, s] of Object.entries(r.sets)) if (s?.singular) lines.push('', `${SET_LABELS[set as StatisticSet]}: ${s.singular}`);
  if (r.warnings.length) lines.push('', 'Warnings:', ...r.warnings.map((w) => `  - ${w}`));
  return `${lines.join('\n')}\n`;
}

/** 68% and 95% ellipses of two parameters for every statistic set with errors. */
export function renderForecastEllipsesSvg(r: ForecastResult, x: string, y: string): string {
  const forecasts = (Object.keys(SET_LABELS) as StatisticSet[]).flatMap((set) => {
    const e = r.sets[set]?.errors;
    if (!e) return [];
    const a = e.names.indexOf(x);
    const b = e.names.indexOf(y);
    if (a < 0 || b < 0) return [];
    const n = e.names.length;
    const c = (i: number, j: number) => e.covariance[i * n + j];
    return [{ label: SET_LABELS[set], covariance: [[c(a, a), c(a, b)], [c(b, a), c(b, b)]] }];
  });
  if (!forecasts.length) throw new InputError(`ellipse plot: no statistic set constrains both "${x}" and "${y}"`, { where: 'ellipse' });
  return renderFisherEllipsePlotSvg({ xLabel: x, yLabel: y, fiducial: [r.fiducial[x], r.fiducial[y]], forecasts, title: `Fisher forecast: ${x} vs ${y}` });
}
