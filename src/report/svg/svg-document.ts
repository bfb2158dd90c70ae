import { escapeMarkup } from './escape-markup.js';
import { formatCoordinate } from './format-coordinate.js';
import { INK } from './palette.js';

/** One font stack and size for every plot, so figures look alike side by side. */
export const FONT_FAMILY = 'DejaVu Sans, Helvetica, Arial, sans-serif';
export const FONT_SIZE = 12;

/**
 * A complete standalone SVG (also valid inline in HTML): white background,
 * accessible title, the shared font settings on the root.
 */
export function svgDocument(width: number, height: number, title: string, body: string): string {
  const w = formatCoordinate(width);
  const h = formatCoordinate(height);
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}"` +
    ` role="img" font-family="${FONT_FAMILY}" font-size="${FONT_SIZE}" fill="${INK}">` +
    `<title>${escapeMarkup(title)}</title>` +
    `<rect x="0" y="0" width="${w}" height="${h}" fill="#ffffff"/>` +
    body +
    '</svg>\n'
  );
}
