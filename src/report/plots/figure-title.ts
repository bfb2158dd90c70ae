import { svgText } from '../svg/svg-elements.js';

/** Height reserved above the panels for a figure title. */
export function titleSpace(title: string | undefined): number {
  return title === undefined ? 12 : 34;
}

/** The figure title, centred at the top, or nothing. */
export function renderFigureTitle(width: number, title: string | undefined): string {
  return title === undefined ? '' : svgText(width / 2, 22, title, { 'text-anchor': 'middle', 'font-size': 14, 'font-weight': 'bold' });
}
