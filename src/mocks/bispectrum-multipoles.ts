import { InputError } from '../contracts/input-error.js';
import type { TriangleBins } from '../bispectrum/triangle-bins.js';
import { RealFourier3d } from '../numerics/fft-3d.js';
import { fundamentalFrequency } from '../numerics/lattice-shell.js';
import { checkMesh, meshVolume, type Mesh } from './mesh.js';
import { shellFilteredField, type ShellWeighting } from './shell-filtered-field.js';
import { shellModesOf, type ShellModes } from './shell-modes.js';
import { accumulateTriangleSums, binsNeedingShift, shellsUsed } from './triangle-sums.js';

/** Measured bispectrum multipoles, one entry per triangle bin (order of `bins`). */
export interface MeasuredBispectrum {
  readonly bins: TriangleBins;
  /** Closed triangles k1 + k2 + k3 = 0 with k1, k2, k3 in shells i, j, l (ordered triples). */
  readonly counts: Float64Array;
  /** Mean |k1|, |k2|, |k3| over those triangles, 3 per bin. */
  readonly effective: Float64Array;
  /** B_0 and B_2 (Legendre weight on k1, the side from shell i) in (Mpc/h)^6; NaN where counts = 0. */
  readonly b0: Float64Array;
  readonly b2: Float64Array;
}

interface Prepared {
  readonly fourier: RealFourier3d;
  readonly modes: ShellModes[];
  readonly shifted: Uint8Array;
  readonly shiftedShells: Uint8Array;
  readonly all: Uint8Array;
  readonly work: { spectrum: Float64Array; scratch: Float64Array };
}

function prepare(mesh: Mesh, bins: TriangleBins): Prepared {
  checkMesh(mesh);
  const fourier = new RealFourier3d(mesh.n);
  const shifted = binsNeedingShift(mesh, bins);
  return {
    fourier,
    modes: shellModesOf(mesh, bins.shells),
    shifted,
    shiftedShells: shellsUsed(bins, shifted),
    all: new Uint8Array(bins.shells.count).fill(1),
    work: { spectrum: fourier.createSpectrum(), scratch: fourier.createSpectrum() },
  };
}

const EMPTY = new Float64Array(0);

function shellFields(p: Prepared, source: Float64Array | null, weighting: ShellWeighting, shifted: boolean): Float64Array[] {
  const wanted = shifted ? p.shiftedShells : p.all;
  return p.modes.map((m, s) => (wanted[s] ? shellFilteredField(p.fourier, m, source, weighting, shifted, p.work) : EMPTY));
}

/**
 * Per-shell fields of one triangle sum: kinds of first-side fields, and the
 * second and third sides; `include` limits it to some bins (the rest get 0).
 */
interface SumJob {
  readonly first: Float64Array[][];
  readonly second: Float64Array[];
  readonly third: Float64Array[];
  readonly include?: Uint8Array;
}

/**
 * sum_x A_i B_j C_l per bin for every job and kind (in that order), plain for
 * every bin and, for the bins that need it, the mean with the shifted sums
 * (binsNeedingShift). `jobs(shifted)` builds the per-shell fields of a pass.
 */
function exactTriangleSums(p: Prepared, bins: TriangleBins, jobs: (shifted: boolean) => SumJob[]): Float64Array[] {
  let plain: Float64Array[] = [];
  let shifted: Float64Array[] = [];
  for (const pass of [false, true]) {
    if (pass && !p.shifted.some((v) => v === 1)) continue;
    const out: Float64Array[] = [];
    for (const job of jobs(pass)) {
      const sums = job.first.map(() => new Float64Array(bins.size));
      const own = job.include;
      const include = pass ? (own ? p.shifted.map((v, b) => v & own[b]) : p.shifted) : own;
      accumulateTriangleSums(bins, job.first, job.second, job.third, sums, include);
      out.push(...sums);
    }
    if (pass) shifted = out;
    else plain = out;
  }
  return plain.map((sums, t) => sums.map((v, b) => (p.shifted[b] ? 0.5 * (v + shifted[t][b]) : v)));
}

/** Triangle counts of the bins and the mean |k| of each side over the triangles. */
export interface TriangleGeometry {
  /** Closed ordered triples k1 + k2 + k3 = 0 with k1, k2, k3 in shells i, j, l. */
  readonly counts: Float64Array;
  /** Mean |k1|, |k2|, |k3| over those triangles, 3 per bin (NaN without triangles), h/Mpc. */
  readonly effective: Float64Array;
}

/**
 * Triangle counts and effective wavenumbers from FFTs of the shell indicators
 * I and of the |k|-weighted shells K: N_123 = n^6 sum_x I_i I_j I_l and
 * <|k1|> = n^6 sum_x K_i I_j I_l / N_123, likewise for k2, k3
 * (docs/conventions.md, "Mocks").
 */
export function triangleGeometryByFft(mesh: Mesh, bins: TriangleBins): TriangleGeometry {
  const p = prepare(mesh, bins);
  // Equal shells give equal mean sides: k2 = k1 when i = j, k3 = k2 when j = l (not summed twice).
  const secondDiffers = new Uint8Array(bins.size);
  const thirdDiffers = new Uint8Array(bins.size);
  for (let b = 0; b < bins.size; b++) {
    secondDiffers[b] = bins.indices[3 * b] !== bins.indices[3 * b + 1] ? 1 : 0;
    thirdDiffers[b] = bins.indices[3 * b + 1] !== bins.indices[3 * b + 2] ? 1 : 0;
  }
  const [sums, k1, k2, k3] = exactTriangleSums(p, bins, (shifted) => {
    const unit = shellFields(p, null, 'unit', shifted);
    const norm = shellFields(p, null, 'norm', shifted);
    return [
      { first: [unit, norm], second: unit, third: unit },
      { first: [unit], second: norm, third: unit, include: secondDiffers },
      { first: [unit], second: unit, third: norm, include: thirdDiffers },
    ];
  });
  for (let b = 0; b < bins.size; b++) {
    if (!secondDiffers[b]) k2[b] = k1[b];
    if (!thirdDiffers[b]) k3[b] = k2[b];
  }
  const scale = mesh.n ** 6;
  const counts = sums.map((v) => Math.round(v * scale));
  const effective = new Float64Array(3 * bins.size);
  const kf = fundamentalFrequency(mesh.boxSize);
  [k1, k2, k3].forEach((ks, a) => {
    for (let b = 0; b < bins.size; b++) effective[3 * b + a] = counts[b] > 0 ? (kf * ks[b] * scale) / counts[b] : Number.NaN;
  });
  return { counts, effective };
}

/**
 * FFT bispectrum estimator with shell-filtered fields (Scoccimarro's method,
 * PRD 70 (2004) 083007 and PRD 92 (2015) 083532, from memory):
 *   B_L(bin) = (2L + 1) (V^2 / n^3) sum_x D^(L)_i(x) D_j(x) D_l(x) / N_123,
 * with D the shell-filtered fields of the discrete transform F of the field
 * and D^(2) carrying L_2(mu) on the first side. `geometry` (from
 * triangleGeometryByFft for the same mesh and bins) skips the counting FFTs.
 */
export function measureBispectrumMultipoles(
  spectrum: Float64Array,
  mesh: Mesh,
  bins: TriangleBins,
  options: { geometry?: TriangleGeometry } = {},
): MeasuredBispectrum {
  const { counts, effective } = options.geometry ?? triangleGeometryByFft(mesh, bins);
  if (counts.length !== bins.size) {
    throw new InputError(`bispectrum: ${counts.length} triangle counts given for ${bins.size} triangle bins`);
  }
  const p = prepare(mesh, bins);
  if (spectrum.length !== p.fourier.spectrumLength) {
    throw new InputError(`bispectrum: the spectrum has ${spectrum.length} values, a ${mesh.n}^3 mesh needs ${p.fourier.spectrumLength}`);
  }
  const [s0, s2] = exactTriangleSums(p, bins, (shifted) => {
    const unit = shellFields(p, spectrum, 'unit', shifted);
    return [{ first: [unit, shellFields(p, spectrum, 'legendre2', shifted)], second: unit, third: unit }];
  });
  const scale = meshVolume(mesh) ** 2 / mesh.n ** 3;
  const b0 = new Float64Array(bins.size);
  const b2 = new Float64Array(bins.size);
  for (let b = 0; b < bins.size; b++) {
    b0[b] = counts[b] > 0 ? (scale * s0[b]) / counts[b] : Number.NaN;
    b2[b] = counts[b] > 0 ? (5 * scale * s2[b]) / counts[b] : Number.NaN;
  }
  return { bins, counts, effective, b0, b2 };
}
