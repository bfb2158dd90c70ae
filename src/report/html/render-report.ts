import { escapeMarkup } from '../svg/escape-markup.js';
import { renderAssumptionsHtml } from './assumptions-block.js';
import { renderFitQualityHtml } from './fit-quality-table.js';
import { checkReportInput } from './report-input-checks.js';
import type { ReportFigure, ReportInput } from './report-input.js';
import { REPORT_CSS } from './report-style.js';
import { renderSummaryTableHtml } from './summary-table.js';

/**
 * The run report as one self-contained HTML file: inline CSS and SVG, no
 * scripts, no external resources (the empty data: icon stops browsers asking
 * for a favicon). The same input gives the same bytes.
 */
export function renderReportHtml(input: ReportInput): string {
  checkReportInput(input);
  const sections = [
    `<h1>${escapeMarkup(input.title)}</h1>`,
    input.subtitle === undefined ? '' : `<p class="subtitle">${escapeMarkup(input.subtitle)}</p>`,
    '<h2>Assumptions</h2>',
    renderAssumptionsHtml(input.assumptions),
    '<h2>Posterior summary</h2>',
    renderSummaryTableHtml(input.parameters),
    '<h2>Goodness of fit</h2>',
    renderFitQualityHtml(input.fitQuality),
    '<h2>Figures</h2>',
    input.figures.length === 0 ? '<p>No figures.</p>' : input.figures.map(renderFigure).join('\n'),
    ...(input.notes === undefined || input.notes.length === 0
      ? []
      : ['<h2>Notes</h2>', ...input.notes.map((n) => `<p>${escapeMarkup(n)}</p>`)]),
  ].filter((s) => s !== '');
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    '<link rel="icon" href="data:,">',
    `<title>${escapeMarkup(input.title)}</title>`,
    `<style>${REPORT_CSS}</style>`,
    '</head>',
    '<body>',
    '<main>',
    ...sections,
    '</main>',
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

function renderFigure(figure: ReportFigure, index: number): string {
  return (
    `<figure id="figure-${index + 1}">\n${figure.svg.trim()}\n` +
    `<figcaption><strong>Figure ${index + 1}. ${escapeMarkup(figure.title.replace(/\.$/, ''))}.</strong> ${escapeMarkup(figure.caption)}</figcaption>\n</figure>`
  );
}
