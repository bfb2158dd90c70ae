import { renderLinePlotSvg } from '../../report/plots/line-plot.js';
import type { ScaleCutScan } from './scale-cut-scan.js';

/**
 * A scale-cut scan as text (assumptions, one row per k_max: data points,
 * chi2/dof, p-value, shift of each parameter in sigma, the two shape classes
 * with the largest chi2 share, and why a cut is flagged) and as an SVG plot
 * of the shifts against k_max with the threshold drawn as reference lines.
 */
const fmt = (v: number, digits = 3) => (Number.isFinite(v) ? Number(v.toPrecision(digits)).toString() : '—');

export function renderScanTable(scan: ScaleCutScan): string {
  const names = scan.parameters;
  const lines = ['Assumptions:', ...scan.assumptions.map((a) => `  - ${a}`), ''];
  lines.push(`| k_max | N | chi2/dof | p-value | ${names.map((n) => `shift ${n}`).join(' | ')} | largest chi2 shares | flag |`, `| ${['---', '---', '---', '---', ...names.map(() => '---'), '---', '---'].join(' | ')} |`);
  for (const s of scan.steps) {
    const shares = Object.entries(s.chi2ByClass)
      .sort(([, a], [, b]) => (b ?? 0) - (a ?? 0))
      .slice(0, 2)
      .map(([c, v]) => `${c} ${fmt(v ?? 0)}`)
      .join(', ');
    lines.push(`| ${s.kMax} | ${s.dataPoints} | ${fmt(s.chi2)}/${s.dof} | ${fmt(s.pValue)} | ${names.map((n) => fmt(s.shift[n])).join(' | ')} | ${shares} | ${s.reasons.join('; ') || 'ok'} |`);
  }
  lines.push('', scan.firstFlagged === undefined ? `No cut flagged (|shift| <= ${scan.shiftThreshold} sigma, p >= ${scan.pValueLimit}).` : `First flagged k_max: ${scan.firstFlagged} h/Mpc.`);
  if (scan.warnings.length) lines.push('', 'Warnings:', ...scan.warnings.map((w) => `  - ${w}`));
  return `${lines.join('\n')}\n`;
}

export function renderScanShiftPlotSvg(scan: ScaleCutScan): string {
  const x = scan.steps.map((s) => s.kMax);
  return renderLinePlotSvg({
    series: scan.parameters.map((n) => ({ label: n, x, y: scan.steps.map((s) => s.shift[n]), style: 'points' as const })),
    xLabel: `k_max of ${scan.statistic} [h/Mpc]`,
    yLabel: `shift from the ${scan.reference} [sigma]`,
    referenceY: [-scan.shiftThreshold, 0, scan.shiftThreshold],
    title: 'Scale-cut scan: parameter shifts',
  });
}
