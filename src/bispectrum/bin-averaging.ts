import { continuousBinNodes } from './continuous-bin-nodes.js';
import { averageOverTriangleNodes } from './orientation-average.js';
import { orientationRule, type OrientationRule } from './orientation-rule.js';
import type { TriangleBins } from './triangle-bins.js';
import type { TriangleIntegrand } from './triangle-integrand.js';
import { singleNodePerBin, type TriangleNodeSet } from './triangle-node-set.js';

/**
 * The three bin-averaging methods that need no box (the discrete average over a
 * periodic box lives in ./lattice). Each returns [bin][multipole][value]
 * (triangle-integrand.ts) and takes the orientation quadrature and, for the
 * continuous average, the Gauss–Legendre order per smooth piece.
 */
export interface BinAverageOptions {
  /** Even multipoles l; default [0, 2]. */
  readonly multipoles?: readonly number[];
  readonly orientation?: OrientationRule;
  /** Gauss–Legendre nodes per piece and dimension of the bin volume; default DEFAULT_VOLUME_ORDER. */
  readonly volumeOrder?: number;
}

/** Defaults that reach 1e-6 relative for the tree-level model with damping (tests/bispectrum/convergence). */
export const DEFAULT_VOLUME_ORDER = 4;
export const DEFAULT_ORIENTATION_NODES = { mu: 4, phi: 6 } as const;

function pick(opts: BinAverageOptions): { multipoles: readonly number[]; rule: OrientationRule } {
  return {
    multipoles: opts.multipoles ?? [0, 2],
    rule: opts.orientation ?? orientationRule(DEFAULT_ORIENTATION_NODES.mu, DEFAULT_ORIENTATION_NODES.phi),
  };
}

/**
 * Bin centres (c1, c2, c3). A bin whose centres do not close (c1 > c2 + c3,
 * kept because part of its volume closes) is evaluated at the flattened
 * triangle (c2 + c3, c2, c3).
 */
export function centreTriangleNodes(bins: TriangleBins): TriangleNodeSet {
  const n = bins.size;
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  for (let b = 0; b < n; b++) {
    k2[b] = bins.centres[3 * b + 1];
    k3[b] = bins.centres[3 * b + 2];
    k1[b] = Math.min(bins.centres[3 * b], k2[b] + k3[b]);
  }
  return singleNodePerBin(k1, k2, k3);
}

/** Effective wavenumbers: the k1 k2 k3-weighted means of each side over the closing bin volume. */
export function effectiveTriangleNodes(bins: TriangleBins, volumeOrder = DEFAULT_VOLUME_ORDER): TriangleNodeSet {
  const v = continuousBinNodes(bins, volumeOrder);
  const n = bins.size;
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  for (let b = 0; b < n; b++) {
    for (let i = v.start[b]; i < v.start[b + 1]; i++) {
      k1[b] += v.weight[i] * v.k1[i];
      k2[b] += v.weight[i] * v.k2[i];
      k3[b] += v.weight[i] * v.k3[i];
    }
  }
  return singleNodePerBin(k1, k2, k3);
}

export function averageAtBinCentres(bins: TriangleBins, integrand: TriangleIntegrand, opts: BinAverageOptions = {}): Float64Array {
  const { multipoles, rule } = pick(opts);
  return averageOverTriangleNodes(centreTriangleNodes(bins), integrand, multipoles, rule);
}

export function averageAtEffectiveWavenumbers(bins: TriangleBins, integrand: TriangleIntegrand, opts: BinAverageOptions = {}): Float64Array {
  const { multipoles, rule } = pick(opts);
  return averageOverTriangleNodes(effectiveTriangleNodes(bins, opts.volumeOrder), integrand, multipoles, rule);
}

export function averageOverBinVolume(bins: TriangleBins, integrand: TriangleIntegrand, opts: BinAverageOptions = {}): Float64Array {
  const { multipoles, rule } = pick(opts);
  return averageOverTriangleNodes(continuousBinNodes(bins, opts.volumeOrder ?? DEFAULT_VOLUME_ORDER), integrand, multipoles, rule);
}
