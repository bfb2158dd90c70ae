import { InputError } from '../../contracts/input-error.js';

/**
 * A 2-D sample density on a regular grid: value per cell is the smoothed
 * probability mass in that cell (all cells sum to 1). Cell (ix, iy) is centred
 * at (x0 + (ix + 0.5) dx, y0 + (iy + 0.5) dy); values are row-major in iy.
 */
export interface DensityGrid {
  nx: number;
  ny: number;
  x0: number;
  y0: number;
  dx: number;
  dy: number;
  values: Float64Array;
}

export interface DensityGridOptions {
  xDomain: readonly [number, number];
  yDomain: readonly [number, number];
  /** Cells across each domain. */
  bins: number;
  /** Gaussian smoothing width in cells (0: none). */
  smoothingCells: number;
}

/**
 * Histogram the pairs (x_i, y_i) on the domain, then smooth with a separable
 * Gaussian. The grid is padded beyond the domain by the kernel reach so that
 * no smoothed mass is lost and contours of it close.
 */
export function smoothedDensityGrid(x: ArrayLike<number>, y: ArrayLike<number>, options: DensityGridOptions): DensityGrid {
  const { bins, smoothingCells } = options;
  if (x.length !== y.length) throw new InputError(`density grid: x has ${x.length} samples but y has ${y.length}`);
  const pad = Math.ceil(3 * smoothingCells) + 1;
  const n = bins + 2 * pad;
  const dx = (options.xDomain[1] - options.xDomain[0]) / bins;
  const dy = (options.yDomain[1] - options.yDomain[0]) / bins;
  const x0 = options.xDomain[0] - pad * dx;
  const y0 = options.yDomain[0] - pad * dy;
  let grid: Float64Array = new Float64Array(n * n);
  let total = 0;
  for (let i = 0; i < x.length; i++) {
    const [xa, xb] = options.xDomain;
    const [ya, yb] = options.yDomain;
    if (!(x[i] >= xa && x[i] <= xb && y[i] >= ya && y[i] <= yb)) continue;
    const ix = pad + Math.min(bins - 1, Math.floor((x[i] - xa) / dx));
    const iy = pad + Math.min(bins - 1, Math.floor((y[i] - ya) / dy));
    grid[iy * n + ix] += 1;
    total += 1;
  }
  if (total === 0) throw new InputError('density grid: no samples inside the plotted range');
  if (smoothingCells > 0) {
    const kernel = gaussianKernel(smoothingCells, pad);
    grid = convolveAxis(convolveAxis(grid, n, kernel, 1), n, kernel, n);
  }
  for (let i = 0; i < grid.length; i++) grid[i] /= total;
  return { nx: n, ny: n, x0, y0, dx, dy, values: grid };
}

function gaussianKernel(width: number, reach: number): Float64Array {
  const k = new Float64Array(2 * reach + 1);
  let sum = 0;
  for (let i = -reach; i <= reach; i++) {
    k[i + reach] = Math.exp((-0.5 * i * i) / (width * width));
    sum += k[i + reach];
  }
  return k.map((v) => v / sum);
}

/** Convolve an n×n grid along one axis (stride 1: x, stride n: y); beyond the edge counts as zero. */
function convolveAxis(grid: Float64Array, n: number, kernel: Float64Array, stride: number): Float64Array {
  const reach = (kernel.length - 1) / 2;
  const out = new Float64Array(grid.length);
  const other = stride === 1 ? n : 1;
  for (let line = 0; line < n; line++) {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = -reach; k <= reach; k++) {
        const j = i + k;
        if (j >= 0 && j < n) s += kernel[k + reach] * grid[line * other + j * stride];
      }
      out[line * other + i * stride] = s;
    }
  }
  return out;
}
