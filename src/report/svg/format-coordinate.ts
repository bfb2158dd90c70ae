/**
 * Pixel coordinates and lengths written into SVG: rounded to 0.01 px so that
 * the same input gives byte-identical output, with no "-0" and no exponent.
 */
export function formatCoordinate(value: number): string {
  if (!Number.isFinite(value)) throw new Error(`internal: non-finite SVG coordinate ${value}`);
  const rounded = Math.round(value * 100) / 100;
  return (rounded === 0 ? 0 : rounded).toFixed(2).replace(/\.?0+$/, '');
}
