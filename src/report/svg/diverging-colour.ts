/**
 * A diverging colour scale for signed quantities such as residuals in units
 * of sigma: blue for negative, a warm off-white at zero, orange-red for
 * positive (blue against orange stays distinct for the common colour-vision
 * deficiencies). Linear interpolation in sRGB between the stops.
 */
const NEGATIVE: readonly number[] = [0x21, 0x5f, 0xa8];
const MIDDLE: readonly number[] = [0xf5, 0xf2, 0xeb];
const POSITIVE: readonly number[] = [0xc2, 0x4a, 0x12];

/** Colour for t in [-1, 1] (values outside are clipped; NaN is an error). */
export function divergingColour(t: number): string {
  if (Number.isNaN(t)) throw new Error('internal: NaN colour value');
  const s = Math.max(-1, Math.min(1, t));
  const end = s < 0 ? NEGATIVE : POSITIVE;
  const w = Math.abs(s);
  return `#${MIDDLE.map((m, i) => Math.round(m + (end[i] - m) * w).toString(16).padStart(2, '0')).join('')}`;
}
