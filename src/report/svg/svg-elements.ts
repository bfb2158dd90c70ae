import { escapeMarkup } from './escape-markup.js';
import { formatCoordinate } from './format-coordinate.js';
import { richTextToSvg } from './rich-text.js';

/**
 * SVG element builders returning strings. Numeric attributes are rounded by
 * formatCoordinate, string attributes escaped; attribute order is the order
 * given, so output is deterministic.
 */
export type SvgAttributes = Readonly<Record<string, string | number | undefined>>;

function attributes(attrs: SvgAttributes): string {
  let out = '';
  for (const [name, value] of Object.entries(attrs)) {
    if (value === undefined) continue;
    out += ` ${name}="${typeof value === 'number' ? formatCoordinate(value) : escapeMarkup(value)}"`;
  }
  return out;
}

export function element(name: string, attrs: SvgAttributes, content?: string): string {
  return content === undefined ? `<${name}${attributes(attrs)}/>` : `<${name}${attributes(attrs)}>${content}</${name}>`;
}

export function svgLine(x1: number, y1: number, x2: number, y2: number, attrs: SvgAttributes = {}): string {
  return element('line', { x1, y1, x2, y2, ...attrs });
}

export function svgRect(x: number, y: number, width: number, height: number, attrs: SvgAttributes = {}): string {
  return element('rect', { x, y, width, height, ...attrs });
}

export function svgCircle(cx: number, cy: number, r: number, attrs: SvgAttributes = {}): string {
  return element('circle', { cx, cy, r, ...attrs });
}

/** Text from rich-text markup (escaped inside). */
export function svgText(x: number, y: number, markup: string, attrs: SvgAttributes = {}): string {
  return element('text', { x, y, ...attrs }, richTextToSvg(markup));
}

/**
 * Path data through pixel points; a non-finite point breaks the line into a
 * new sub-path. `close` closes every sub-path (for filled outlines).
 */
export function pathData(points: ReadonlyArray<readonly [number, number]>, close = false): string {
  let d = '';
  let open = false;
  for (const [x, y] of points) {
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      if (open && close) d += 'Z';
      open = false;
      continue;
    }
    d += `${open ? 'L' : 'M'}${formatCoordinate(x)} ${formatCoordinate(y)}`;
    open = true;
  }
  if (open && close) d += 'Z';
  return d;
}

export function svgPath(d: string, attrs: SvgAttributes = {}): string {
  return element('path', { d, ...attrs });
}

/** A transform attribute value rotating by `degrees` about (x, y). */
export function rotationAbout(degrees: number, x: number, y: number): string {
  return `rotate(${degrees} ${formatCoordinate(x)} ${formatCoordinate(y)})`;
}
