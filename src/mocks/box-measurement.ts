import { InputError } from '../contracts/input-error.js';
import { enumerateTriangleBins, shellGrid, type TriangleBins } from '../bispectrum/triangle-bins.js';
import type { BundleToWrite, StatisticColumns } from '../data/write-measurement-bundle.js';
import { measureBispectrumMultipoles, triangleGeometryByFft, type MeasuredBispectrum, type TriangleGeometry } from './bispectrum-multipoles.js';
import type { Mesh } from './mesh.js';
import { measurePowerMultipoles, type MeasuredPowerMultipoles } from './power-multipoles.js';

/** Shell grid of a statistic: centres kMin, kMin + dk, ... up to kMax (h/Mpc). */
export interface ShellRange {
  readonly kMin: number;
  readonly kMax: number;
  readonly dk: number;
}

/** What to measure on a periodic box. */
export interface BoxMeasurementPlan {
  readonly mesh: Mesh;
  readonly power: ShellRange;
  /** Omit to measure P_l only. */
  readonly bispectrum?: ShellRange;
  /** Subtracted from P_0 (for example 1/nbar of a Poisson-sampled field); default 0. */
  readonly shotNoise?: number;
}

export interface BoxMeasurement {
  readonly plan: BoxMeasurementPlan;
  readonly power: MeasuredPowerMultipoles;
  readonly bispectrum: MeasuredBispectrum | undefined;
}

/** Triangle bins of a plan (undefined when it measures no bispectrum). */
export function planTriangleBins(plan: BoxMeasurementPlan): TriangleBins | undefined {
  const b = plan.bispectrum;
  return b === undefined ? undefined : enumerateTriangleBins(shellGrid(b.kMin, b.kMax, b.dk));
}

/**
 * Geometry (triangle counts, mean sides) of a plan's bispectrum bins: it
 * depends only on the mesh and the bins, so compute it once for many fields.
 */
export function planGeometry(plan: BoxMeasurementPlan): TriangleGeometry | undefined {
  const bins = planTriangleBins(plan);
  return bins === undefined ? undefined : triangleGeometryByFft(plan.mesh, bins);
}

/** P_0, P_2, P_4 and, when planned, B_0 and B_2 of a half-complex spectrum. */
export function measureBox(spectrum: Float64Array, plan: BoxMeasurementPlan, geometry?: TriangleGeometry): BoxMeasurement {
  const { kMin, kMax, dk } = plan.power;
  const power = measurePowerMultipoles(spectrum, plan.mesh, shellGrid(kMin, kMax, dk), { shotNoise: plan.shotNoise ?? 0 });
  const bins = planTriangleBins(plan);
  const bispectrum = bins === undefined ? undefined : measureBispectrumMultipoles(spectrum, plan.mesh, bins, { geometry: geometry ?? triangleGeometryByFft(plan.mesh, bins) });
  return { plan, power, bispectrum };
}

/** Rows with at least one mode / triangle (the bundle reader requires positive counts). */
function keptRows(counts: Float64Array): number[] {
  const rows: number[] = [];
  counts.forEach((c, r) => {
    if (c > 0) rows.push(r);
  });
  return rows;
}

/** The power table of a measurement in the bundle's column layout. */
export function powerColumns(m: BoxMeasurement): StatisticColumns {
  const p = m.power;
  const rows = keptRows(p.modes);
  const pick = (a: Float64Array) => rows.map((r) => a[r]);
  return { centres: pick(p.centres), effective: pick(p.meanK), counts: pick(p.modes), dk: m.plan.power.dk, multipoles: [0, 2, 4], values: [pick(p.p0), pick(p.p2), pick(p.p4)] };
}

/** The bispectrum table of a measurement in the bundle's column layout (bins without triangles dropped). */
export function bispectrumColumns(m: BoxMeasurement): StatisticColumns | undefined {
  const b = m.bispectrum;
  if (b === undefined || m.plan.bispectrum === undefined) return undefined;
  const rows = keptRows(b.counts);
  const three = (a: Float64Array) => rows.flatMap((r) => [a[3 * r], a[3 * r + 1], a[3 * r + 2]]);
  return {
    centres: three(b.bins.centres),
    effective: three(b.effective),
    counts: rows.map((r) => b.counts[r]),
    dk: m.plan.bispectrum.dk,
    multipoles: [0, 2],
    values: [rows.map((r) => b.b0[r]), rows.map((r) => b.b2[r])],
  };
}

/** Everything writeMeasurementBundle needs for a box measured along the z axis. */
export function boxBundle(
  m: BoxMeasurement,
  about: { redshift: number; numberDensity: number; fiducialCosmology: Readonly<Record<string, number>>; description?: string },
): BundleToWrite {
  if (!(about.numberDensity > 0)) throw new InputError(`measurement bundle: numberDensity must be positive, got ${about.numberDensity}`);
  return {
    description: about.description,
    redshift: about.redshift,
    numberDensity: about.numberDensity,
    lineOfSight: 'z-axis',
    boxSize: m.plan.mesh.boxSize,
    fiducialCosmology: about.fiducialCosmology,
    power: powerColumns(m),
    bispectrum: bispectrumColumns(m),
  };
}
