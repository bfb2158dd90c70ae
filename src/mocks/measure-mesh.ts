import { RealFourier3d } from '../numerics/fft-3d.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import { measureBox, type BoxMeasurement, type BoxMeasurementPlan } from './box-measurement.js';
import { particleOverdensitySpectrum } from './mass-assignment.js';
import { meshNyquist, type Mesh } from './mesh.js';

/** Binning of a box measurement in units of the fundamental frequency k_f = 2 pi / L. */
export interface BinsInFundamentalUnits {
  /** Shell width and first centre, in k_f. */
  readonly dk: number;
  /**
   * Highest centre of P_l and of B_l, h/Mpc; powerKMax undefined takes every
   * shell below the Nyquist wavenumber; bispectrumKMax 0 measures no bispectrum.
   */
  readonly powerKMax: number | undefined;
  readonly bispectrumKMax: number;
  readonly shotNoise: number;
}

export function planOf(mesh: Mesh, bins: BinsInFundamentalUnits): BoxMeasurementPlan {
  const dk = bins.dk * fundamentalFrequency(mesh.boxSize);
  return {
    mesh,
    power: { kMin: dk, kMax: bins.powerKMax ?? meshNyquist(mesh) - dk / 2, dk },
    bispectrum: bins.bispectrumKMax > 0 ? { kMin: dk, kMax: bins.bispectrumKMax, dk } : undefined,
    shotNoise: bins.shotNoise,
  };
}

/** Measure a real overdensity on a mesh (layout of src/numerics/fft-3d.ts). */
export function measureMeshValues(values: Float64Array, plan: BoxMeasurementPlan): BoxMeasurement {
  return measureBox(new RealFourier3d(plan.mesh.n).forward(values), plan);
}

/** Measure particles (3 coordinates each, Mpc/h) assigned to the plan's mesh. */
export function measureParticles(positions: Float64Array, plan: BoxMeasurementPlan): BoxMeasurement {
  return measureBox(particleOverdensitySpectrum(positions, plan.mesh), plan);
}
