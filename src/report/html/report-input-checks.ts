import { InputError } from '../../contracts/input-error.js';
import type { ReportFigure, ReportFitQuality, ReportInput, ReportParameterRow } from './report-input.js';

/** Refuses report input that would print NaN, broken intervals or foreign markup; messages name the field. */
export function checkReportInput(input: ReportInput): void {
  if (input.title.trim() === '') throw new InputError('report title is empty');
  input.parameters.forEach((row, i) => checkParameterRow(row, `report parameters[${i}] (${row.label})`));
  input.fitQuality.forEach((row, i) => checkFitQuality(row, `report fitQuality[${i}] (${row.label})`));
  input.figures.forEach((figure, i) => checkFigure(figure, `report figures[${i}] (${figure.title})`));
}

function requireFinite(where: string, value: number | undefined): void {
  if (value !== undefined && !Number.isFinite(value)) throw new InputError(`${where} is ${value}, expected a finite number`);
}

function checkParameterRow(row: ReportParameterRow, where: string): void {
  requireFinite(`${where}.mean`, row.mean);
  requireFinite(`${where}.sd`, row.sd);
  if (row.sd < 0) throw new InputError(`${where}.sd is negative (${row.sd})`);
  for (const key of ['interval68', 'interval95'] as const) {
    const [lo, hi] = row[key];
    requireFinite(`${where}.${key}[0]`, lo);
    requireFinite(`${where}.${key}[1]`, hi);
    if (lo > hi) throw new InputError(`${where}.${key} has lower ${lo} above upper ${hi}`);
  }
  requireFinite(`${where}.bestFit`, row.bestFit);
  requireFinite(`${where}.truth`, row.truth);
  requireFinite(`${where}.rHat`, row.rHat);
  requireFinite(`${where}.ess`, row.ess);
}

function checkFitQuality(row: ReportFitQuality, where: string): void {
  requireFinite(`${where}.chiSquare`, row.chiSquare);
  if (!Number.isInteger(row.dof) || row.dof < 1) throw new InputError(`${where}.dof must be a whole number >= 1, got ${row.dof}`);
  if (!(row.pValue >= 0 && row.pValue <= 1)) throw new InputError(`${where}.pValue must lie in [0, 1], got ${row.pValue}`);
}

function checkFigure(figure: ReportFigure, where: string): void {
  const svg = figure.svg.trim();
  if (!svg.startsWith('<svg') || !svg.endsWith('</svg>')) throw new InputError(`${where}.svg is not a single <svg> element`);
  if (/<script|<foreignObject|<[^>]*\s(?:[a-z:]*href|on[a-z]+)\s*=/i.test(svg)) {
    throw new InputError(`${where}.svg holds scripts, links or embedded content; the report takes plots drawn by treble only`);
  }
}
