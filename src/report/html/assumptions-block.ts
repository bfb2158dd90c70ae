import { escapeMarkup } from '../svg/escape-markup.js';
import type { ReportAssumption } from './report-input.js';

/** The printed assumptions as a definition list, in the order given. */
export function renderAssumptionsHtml(assumptions: readonly ReportAssumption[]): string {
  if (assumptions.length === 0) return '<p>No assumptions were recorded for this run.</p>';
  const rows = assumptions.map((a) => `<dt>${escapeMarkup(a.key)}</dt><dd>${escapeMarkup(a.value)}</dd>`).join('\n');
  return `<dl class="assumptions">\n${rows}\n</dl>`;
}
