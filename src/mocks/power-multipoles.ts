import { shellCentre, type ShellGrid } from '../bispectrum/triangle-bins.js';
import { legendre } from '../numerics/legendre.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import { checkMesh, meshVolume, type Mesh } from './mesh.js';
import { shellModesOf, type ShellModes } from './shell-modes.js';

/** Measured power-spectrum multipoles of a periodic box, one entry per k shell. */
export interface MeasuredPowerMultipoles {
  readonly centres: Float64Array;
  /** Mean |k| over the modes of each shell, h/Mpc. */
  readonly meanK: Float64Array;
  /** Number of modes (k and -k both counted). */
  readonly modes: Float64Array;
  /** P_0, P_2, P_4 in (Mpc/h)^3; P_0 has `shotNoise` subtracted. */
  readonly p0: Float64Array;
  readonly p2: Float64Array;
  readonly p4: Float64Array;
  readonly shotNoise: number;
}

/**
 * FFT estimator of P_l (docs/conventions.md, "Mocks"): for the discrete
 * transform F of the field,
 *   P_l(shell) = (2l + 1) / N_k sum_{k in shell} (V / n^6) |F(k)|^2 L_l(mu_k),
 * with the line of sight along z. `shotNoise` (for example 1/nbar) is
 * subtracted from P_0 only.
 */
export function measurePowerMultipoles(
  spectrum: Float64Array,
  mesh: Mesh,
  shells: ShellGrid,
  options: { shotNoise?: number; modes?: readonly ShellModes[] } = {},
): MeasuredPowerMultipoles {
  checkMesh(mesh);
  const modes = options.modes ?? shellModesOf(mesh, shells);
  const shotNoise = options.shotNoise ?? 0;
  const kf = fundamentalFrequency(mesh.boxSize);
  const norm = meshVolume(mesh) / mesh.n ** 6;
  const count = shells.count;
  const out = {
    centres: new Float64Array(count),
    meanK: new Float64Array(count),
    modes: new Float64Array(count),
    p0: new Float64Array(count),
    p2: new Float64Array(count),
    p4: new Float64Array(count),
    shotNoise,
  };
  for (let s = 0; s < count; s++) {
    const m = modes[s];
    let s0 = 0;
    let s2 = 0;
    let s4 = 0;
    let sk = 0;
    for (let e = 0; e < m.index.length; e++) {
      const c = 2 * m.index[e];
      const w = m.weight[e] * (spectrum[c] * spectrum[c] + spectrum[c + 1] * spectrum[c + 1]);
      s0 += w;
      s2 += w * legendre(2, m.mu[e]);
      s4 += w * legendre(4, m.mu[e]);
      sk += m.weight[e] * m.norm[e];
    }
    out.centres[s] = shellCentre(shells, s);
    out.modes[s] = m.count;
    out.meanK[s] = m.count > 0 ? (kf * sk) / m.count : Number.NaN;
    out.p0[s] = m.count > 0 ? (norm * s0) / m.count - shotNoise : Number.NaN;
    out.p2[s] = m.count > 0 ? (5 * norm * s2) / m.count : Number.NaN;
    out.p4[s] = m.count > 0 ? (9 * norm * s4) / m.count : Number.NaN;
  }
  return out;
}
