import { InputError } from '../contracts/input-error.js';
import { RealFourier3d } from '../numerics/fft-3d.js';
import { checkMesh, type Mesh } from './mesh.js';
import { forEachMode } from './mode-loop.js';

/**
 * Cloud-in-cell counts of particles (positions in Mpc/h, 3 per particle,
 * periodic in [0, L)) on the mesh points x_i = i L / n, optionally with every
 * particle moved by `offset` cells along each axis.
 */
function cloudInCell(positions: Float64Array, mesh: Mesh, offset: number): Float64Array {
  const { n, boxSize } = mesh;
  const grid = new Float64Array(n ** 3);
  const scale = n / boxSize;
  for (let p = 0; p < positions.length; p += 3) {
    const idx: number[] = [];
    const frac: number[] = [];
    for (let a = 0; a < 3; a++) {
      const u = positions[p + a] * scale + offset;
      const i = Math.floor(u);
      frac.push(u - i);
      idx.push(((i % n) + n) % n);
    }
    for (let dx = 0; dx < 2; dx++) {
      const wx = dx ? frac[0] : 1 - frac[0];
      const ix = (idx[0] + dx) % n;
      for (let dy = 0; dy < 2; dy++) {
        const wxy = wx * (dy ? frac[1] : 1 - frac[1]);
        const row = (ix * n + ((idx[1] + dy) % n)) * n;
        grid[row + idx[2]] += wxy * (1 - frac[2]);
        grid[row + ((idx[2] + 1) % n)] += wxy * frac[2];
      }
    }
  }
  return grid;
}

/**
 * Overdensity of a particle set as a half-complex spectrum (docs/conventions.md,
 * "Mocks"): cloud-in-cell assignment (Hockney & Eastwood 1988, from memory) on
 * the mesh and on a copy shifted by half a cell along every axis, combined as
 * F = [F_0 + exp(i pi (nx + ny + nz) / n) F_1] / 2 (interlacing, which cancels
 * the odd aliased images; Sefusatti et al. 2016, MNRAS 460, 3624, from memory),
 * then divided by the CIC window prod_a sinc^2(pi n_a / n).
 */
export function particleOverdensitySpectrum(positions: Float64Array, mesh: Mesh): Float64Array {
  checkMesh(mesh);
  const count = positions.length / 3;
  if (!Number.isInteger(count) || count === 0) throw new InputError(`particles: need 3 coordinates per particle and at least one particle, got ${positions.length} numbers`);
  for (let i = 0; i < positions.length; i++) {
    const x = positions[i];
    if (!(x >= 0 && x < mesh.boxSize)) {
      throw new InputError(`particles: coordinate ${i % 3 === 0 ? 'x' : i % 3 === 1 ? 'y' : 'z'} of particle ${Math.floor(i / 3)} is ${x}, outside [0, ${mesh.boxSize}) Mpc/h`);
    }
  }
  const fourier = new RealFourier3d(mesh.n);
  const perCell = count / mesh.n ** 3;
  const toContrast = (g: Float64Array) => g.map((v) => v / perCell - 1);
  const f0 = fourier.forward(toContrast(cloudInCell(positions, mesh, 0)));
  const f1 = fourier.forward(toContrast(cloudInCell(positions, mesh, 0.5)));
  const n = mesh.n;
  const sinc = (x: number) => (x === 0 ? 1 : Math.sin(x) / x);
  forEachMode(n, (c, nx, ny, nz, n2) => {
    if (n2 === 0) {
      f0[2 * c] = 0;
      f0[2 * c + 1] = 0;
      return;
    }
    const theta = (Math.PI * (nx + ny + nz)) / n;
    const cs = Math.cos(theta);
    const sn = Math.sin(theta);
    const w = (sinc((Math.PI * nx) / n) * sinc((Math.PI * ny) / n) * sinc((Math.PI * nz) / n)) ** 2;
    const re = 0.5 * (f0[2 * c] + cs * f1[2 * c] - sn * f1[2 * c + 1]);
    const im = 0.5 * (f0[2 * c + 1] + sn * f1[2 * c] + cs * f1[2 * c + 1]);
    f0[2 * c] = re / w;
    f0[2 * c + 1] = im / w;
  });
  return f0;
}
