/**
 * Colours. Series colours are taken from the colour-blind-safe set of
 * Okabe & Ito (2008, "Color Universal Design"; hex values from memory), ordered so that neighbours
 * differ in lightness too; ink and grid greys are neutral.
 */
const SERIES_COLOURS: readonly string[] = [
  '#0072B2', // blue
  '#D55E00', // vermillion
  '#009E73', // bluish green
  '#CC79A7', // reddish purple
  '#E69F00', // orange
  '#56B4E9', // sky blue
  '#000000', // black
];

export const INK = '#222222';
export const MUTED_INK = '#666666';
export const GRID_GREY = '#e4e4e4';
export const BAND_GREY = '#d8d8d8';

export function seriesColour(index: number): string {
  return SERIES_COLOURS[((index % SERIES_COLOURS.length) + SERIES_COLOURS.length) % SERIES_COLOURS.length];
}
