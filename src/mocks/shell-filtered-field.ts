import { legendre } from '../numerics/legendre.js';
import type { RealFourier3d } from '../numerics/fft-3d.js';
import type { ShellModes } from './shell-modes.js';

/** What multiplies each mode of a shell-filtered field: 1, L_2(mu_k) or |k| / k_f. */
export type ShellWeighting = 'unit' | 'legendre2' | 'norm';

/**
 * Real-space field of the modes of one k shell:
 *   X(x) = n^-3 sum_{k in shell} w(k) S(k) exp(i k.(x + h))
 * with S the half-complex `source` spectrum (or S = 1 when `source` is null,
 * which gives the shell indicator used for counting triangles), w = 1,
 * L_2(mu_k) or |k|/k_f, and h = 0 or the body-centre offset of a cell (a half cell along
 * each axis) when `shifted` (see docs/conventions.md, "Mocks": the shifted copy
 * cancels wrap-around triangles of the FFT sums).
 */
export function shellFilteredField(
  fourier: RealFourier3d,
  modes: ShellModes,
  source: Float64Array | null,
  weighting: ShellWeighting,
  shifted: boolean,
  work: { spectrum: Float64Array; scratch: Float64Array },
  out: Float64Array = fourier.createField(),
): Float64Array {
  const { spectrum, scratch } = work;
  spectrum.fill(0);
  const phaseStep = Math.PI / fourier.n;
  for (let e = 0; e < modes.index.length; e++) {
    const c = 2 * modes.index[e];
    const w = weighting === 'unit' ? 1 : weighting === 'norm' ? modes.norm[e] : legendre(2, modes.mu[e]);
    let re = source === null ? w : w * source[c];
    let im = source === null ? 0 : w * source[c + 1];
    if (shifted) {
      const theta = phaseStep * (modes.vector[3 * e] + modes.vector[3 * e + 1] + modes.vector[3 * e + 2]);
      const cs = Math.cos(theta);
      const sn = Math.sin(theta);
      const r = re * cs - im * sn;
      im = re * sn + im * cs;
      re = r;
    }
    spectrum[c] = re;
    spectrum[c + 1] = im;
  }
  return fourier.inverse(spectrum, out, scratch);
}
