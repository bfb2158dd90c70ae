import { richTextToHtml } from '../svg/rich-text.js';
import type { ReportFitQuality } from './report-input.js';
import { formatPValue } from './report-number-format.js';

/** Chi-square, degrees of freedom, reduced chi-square and p-value per data combination. */
export function renderFitQualityHtml(rows: readonly ReportFitQuality[]): string {
  if (rows.length === 0) return '<p>No goodness-of-fit numbers were given.</p>';
  const body = rows
    .map(
      (r) =>
        `<tr><td>${richTextToHtml(r.label)}</td><td>${r.chiSquare.toFixed(1)}</td><td>${r.dof}</td>` +
        `<td>${(r.chiSquare / r.dof).toFixed(2)}</td><td>${formatPValue(r.pValue)}</td></tr>`,
    )
    .join('\n');
  return (
    '<table class="fit-quality">\n<thead><tr><th>data</th><th>χ²</th><th>dof</th><th>χ²/dof</th><th>p-value</th></tr></thead>\n' +
    `<tbody>\n${body}\n</tbody>\n</table>`
  );
}
