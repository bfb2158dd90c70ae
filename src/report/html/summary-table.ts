import { richTextToHtml } from '../svg/rich-text.js';
import type { ReportParameterRow } from './report-input.js';
import { decimalsForUncertainty, formatReportNumber } from './report-number-format.js';

/**
 * Convergence thresholds flagged in the table: R-hat above 1.01 and an
 * effective sample size below 400 (Vehtari et al. 2021, Bayesian Analysis
 * 16, 667, section 4; from memory).
 */
export const RHAT_LIMIT = 1.01;
export const ESS_MINIMUM = 400;

/** The posterior summary: one row per parameter, flagged cells marked. */
export function renderSummaryTableHtml(rows: readonly ReportParameterRow[]): string {
  if (rows.length === 0) return '<p>No sampled parameters.</p>';
  const head =
    '<tr><th>parameter</th><th>mean</th><th>sd</th><th>68% interval</th><th>95% interval</th>' +
    '<th>best fit</th><th>truth</th><th>R-hat</th><th>ESS</th></tr>';
  const body = rows.map(renderRow).join('\n');
  return (
    `<table class="summary">\n<thead>${head}</thead>\n<tbody>\n${body}\n</tbody>\n</table>\n` +
    `<p class="legend-note">Flagged in colour: R-hat &gt; ${RHAT_LIMIT}, ESS &lt; ${ESS_MINIMUM}, or a truth outside the 95% interval.</p>`
  );
}

function renderRow(row: ReportParameterRow): string {
  const d = decimalsForUncertainty(row.sd);
  const n = (v: number): string => formatReportNumber(v, d);
  const optional = (v: number | undefined, text: (v: number) => string, flagged: boolean): string =>
    v === undefined ? '<td>–</td>' : `<td${flagged ? ' class="flag"' : ''}>${text(v)}</td>`;
  const truthOutside = row.truth !== undefined && (row.truth < row.interval95[0] || row.truth > row.interval95[1]);
  return (
    `<tr><td>${richTextToHtml(row.label)}</td><td>${n(row.mean)}</td><td>${formatReportNumber(row.sd, d)}</td>` +
    `<td>[${n(row.interval68[0])}, ${n(row.interval68[1])}]</td><td>[${n(row.interval95[0])}, ${n(row.interval95[1])}]</td>` +
    optional(row.bestFit, n, false) +
    optional(row.truth, n, truthOutside) +
    optional(row.rHat, (v) => v.toFixed(3), row.rHat !== undefined && row.rHat > RHAT_LIMIT) +
    optional(row.ess, (v) => v.toFixed(0), row.ess !== undefined && row.ess < ESS_MINIMUM) +
    '</tr>'
  );
}
