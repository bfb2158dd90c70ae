import { smoothedDensityGrid, type DensityGridOptions } from './density-grid.js';
import { isoLoops } from './iso-loops.js';
import { massLevels } from './mass-levels.js';

/** The boundary of one highest-density credible region, as closed loops in data coordinates. */
export interface CredibleContour {
  fraction: number;
  /** Threshold on the cell mass of the smoothed grid. */
  level: number;
  loops: Array<Array<[number, number]>>;
}

/**
 * Contours of a 2-D sample that enclose the given fractions of its smoothed
 * density: the threshold is found from the sorted cell masses (highest
 * density first), then traced by marching squares through the cell centres.
 * Regions with holes or several islands come out as several loops (fill them
 * with the even-odd rule).
 */
export function credibleContours(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  fractions: readonly number[],
  options: DensityGridOptions,
): CredibleContour[] {
  const grid = smoothedDensityGrid(x, y, options);
  const levels = massLevels(grid.values, fractions);
  return fractions.map((fraction, i) => ({
    fraction,
    level: levels[i],
    loops: isoLoops(grid.values, grid.nx, grid.ny, levels[i]).map((loop) =>
      loop.map(([gi, gj]): [number, number] => [grid.x0 + (gi + 0.5) * grid.dx, grid.y0 + (gj + 0.5) * grid.dy]),
    ),
  }));
}
