import { InputError } from '../../contracts/input-error.js';
import { MARKER_KINDS, type MarkerKind } from '../svg/markers.js';
import { seriesColour } from '../svg/palette.js';

/** The triangle shape classes the plots know, in legend order. */
export const TRIANGLE_SHAPE_CLASSES = ['equilateral', 'isosceles', 'squeezed', 'flattened', 'general'] as const;
export type TriangleShapeClass = (typeof TRIANGLE_SHAPE_CLASSES)[number];

export interface ShapeClassStyle {
  colour: string;
  marker: MarkerKind;
}

/** Colour and marker of a shape class; an unknown class name is an input error naming the entry. */
export function shapeClassStyle(shapeClass: string, where: string): ShapeClassStyle {
  const index = (TRIANGLE_SHAPE_CLASSES as readonly string[]).indexOf(shapeClass);
  if (index < 0) {
    throw new InputError(`${where} is "${shapeClass}", expected one of ${TRIANGLE_SHAPE_CLASSES.join(', ')}`);
  }
  return { colour: seriesColour(index), marker: MARKER_KINDS[index] };
}
