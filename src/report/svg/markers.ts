import { formatCoordinate as f } from './format-coordinate.js';
import { svgCircle, svgPath, svgRect, type SvgAttributes } from './svg-elements.js';

/** Point marker shapes; plots pair them with colours so classes survive grey-scale printing. */
export type MarkerKind = 'circle' | 'square' | 'triangle' | 'diamond' | 'cross';

export const MARKER_KINDS: readonly MarkerKind[] = ['circle', 'triangle', 'square', 'diamond', 'cross'];

/** A marker centred on (x, y) with half-size r px; `colour` fills it (strokes the cross). */
export function svgMarker(kind: MarkerKind, x: number, y: number, r: number, colour: string, extra: SvgAttributes = {}): string {
  const filled = { fill: colour, stroke: '#ffffff', 'stroke-width': 0.6, ...extra };
  switch (kind) {
    case 'circle':
      return svgCircle(x, y, r, filled);
    case 'square':
      return svgRect(x - r * 0.9, y - r * 0.9, r * 1.8, r * 1.8, filled);
    case 'triangle':
      return svgPath(`M${f(x)} ${f(y - r * 1.15)}L${f(x + r)} ${f(y + r * 0.6)}L${f(x - r)} ${f(y + r * 0.6)}Z`, filled);
    case 'diamond':
      return svgPath(`M${f(x)} ${f(y - r * 1.2)}L${f(x + r)} ${f(y)}L${f(x)} ${f(y + r * 1.2)}L${f(x - r)} ${f(y)}Z`, filled);
    case 'cross':
      return svgPath(`M${f(x - r)} ${f(y - r)}L${f(x + r)} ${f(y + r)}M${f(x - r)} ${f(y + r)}L${f(x + r)} ${f(y - r)}`, {
        fill: 'none',
        stroke: colour,
        'stroke-width': 1.6,
        ...extra,
      });
  }
}
