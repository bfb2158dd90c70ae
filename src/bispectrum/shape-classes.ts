import { InputError } from '../contracts/input-error.js';
import type { TriangleBins } from './triangle-bins.js';

/**
 * Shape classes of triangle bins, from the shell indices i >= j >= l and the
 * centres c1 >= c2 >= c3, tested in this order (first match wins):
 *   equilateral  i = j = l;
 *   squeezed     c3 <= SQUEEZED_RATIO * c1 (one side much shorter than the others);
 *   flattened    c2 + c3 - c1 <= FLATTENED_GAP_IN_DK * dk (nearly collinear,
 *                including bins whose centres do not close);
 *   isosceles    i = j or j = l;
 *   general      everything else.
 */
export const SHAPE_CLASSES = ['equilateral', 'squeezed', 'flattened', 'isosceles', 'general'] as const;
export type ShapeClass = (typeof SHAPE_CLASSES)[number];

export const SQUEEZED_RATIO = 0.25;
export const FLATTENED_GAP_IN_DK = 1;

export function shapeClassOf(i: number, j: number, l: number, c1: number, c2: number, c3: number, dk: number): ShapeClass {
  if (i === j && j === l) return 'equilateral';
  if (c3 <= SQUEEZED_RATIO * c1) return 'squeezed';
  if (c2 + c3 - c1 <= FLATTENED_GAP_IN_DK * dk * (1 + 1e-9)) return 'flattened';
  if (i === j || j === l) return 'isosceles';
  return 'general';
}

/** Shape class of every bin, in bin order. */
export function triangleShapeClasses(bins: TriangleBins): ShapeClass[] {
  const out: ShapeClass[] = [];
  for (let b = 0; b < bins.size; b++) {
    const x = bins.indices;
    const c = bins.centres;
    out.push(shapeClassOf(x[3 * b], x[3 * b + 1], x[3 * b + 2], c[3 * b], c[3 * b + 1], c[3 * b + 2], bins.shells.dk));
  }
  return out;
}

/** Validate a shape name from user input. */
export function parseShapeClass(name: string, where = 'shape'): ShapeClass {
  const hit = SHAPE_CLASSES.find((s) => s === name);
  if (!hit) throw new InputError(`${where}: unknown shape class "${name}" (known: ${SHAPE_CLASSES.join(', ')})`);
  return hit;
}

/** Indices of the bins whose class is one of `names` (validated). */
export function binsOfShapes(bins: TriangleBins, names: readonly string[], where = 'shapes'): number[] {
  const wanted = new Set(names.map((n) => parseShapeClass(n, where)));
  return triangleShapeClasses(bins).flatMap((s, b) => (wanted.has(s) ? [b] : []));
}
