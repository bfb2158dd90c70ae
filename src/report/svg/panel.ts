import { axisScale, type AxisKind, type AxisScale } from './axis-scale.js';

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
    x: axisScale(axes.xKind ?? 'linear', axes.xDomain, [box.left, box.left + box.width], axes.xTicks ?? small(box.width)),
    y: axisScale(axes.yKind ?? 'linear', axes.yDomain, [box.top + box.height, box.top], axes.yTicks ?? small(box.height)),
  };
}
