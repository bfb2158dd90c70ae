import { axisScale, type AxisKind, type AxisScale } from './axis-scale.js';
import { richTextWidthEm } from './rich-text.js';
import { FONT_SIZE } from './svg-document.js';

/** A rectangle of the figure in pixels and the two axis maps into it. */
export interface Panel {
  left: number;
  top: number;
  width: number;
  height: number;
  x: AxisScale;
  y: AxisScale;
}

export interface PanelBox {
  left: number;
  top: number;
  width: number;
  height: number;
}

export interface PanelAxes {
  xKind?: AxisKind;
  yKind?: AxisKind;
  xDomain: readonly [number, number];
  yDomain: readonly [number, number];
  xTicks?: number;
  yTicks?: number;
}

export function makePanel(box: PanelBox, axes: PanelAxes): Panel {
  const small = (pixels: number): number => Math.max(3, Math.min(6, Math.round(pixels / 60)));
  return {
    ...box,
    x: readableXScale(axes.xKind ?? 'linear', axes.xDomain, [box.left, box.left + box.width], axes.xTicks ?? small(box.width)),
    y: axisScale(axes.yKind ?? 'linear', axes.yDomain, [box.top + box.height, box.top], axes.yTicks ?? small(box.height)),
  };
}

/** An x scale with fewer ticks when neighbouring labels would touch (the spacing of the first two ticks decides). */
function readableXScale(kind: AxisKind, domain: readonly [number, number], range: readonly [number, number], target: number): AxisScale {
  let scale = axisScale(kind, domain, range, target);
  for (let t = target - 1; t >= 2 && !labelsFit(scale); t--) scale = axisScale(kind, domain, range, t);
  return scale;
}

function labelsFit(scale: AxisScale): boolean {
  const values = scale.ticks.values;
  const widest = Math.max(0, ...values.map((v) => richTextWidthEm(scale.tickLabel(v)) * FONT_SIZE));
  return values.length < 2 || Math.abs(scale.map(values[1]) - scale.map(values[0])) >= widest + 4;
}
