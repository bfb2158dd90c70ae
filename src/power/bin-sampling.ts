import { InputError } from '../contracts/input-error.js';
import { gaussLegendreOn } from '../numerics/gauss-legendre.js';
import { legendre } from '../numerics/legendre.js';
import { continuumMeanK, powerBinCentre, powerBinEdges, validatePowerKBins, type PowerKBins } from './k-bins.js';
import { latticeBinModes } from './lattice-bin-modes.js';

/**
 * How the model is averaged over a k bin:
 *   centre    — at the bin centre;
 *   mean-k    — at the mode-weighted mean k (continuous shell, or the discrete
 *               modes of a box when boxSize is given);
 *   lattice   — the mean over the discrete wavevectors of a periodic box of side
 *               boxSize (Mpc/h), line of sight = z axis, exactly what a
 *               fixed-line-of-sight FFT estimator averages.
 */
export type PowerBinAveraging =
  | { readonly kind: 'centre' }
  | { readonly kind: 'mean-k'; readonly boxSize?: number }
  | { readonly kind: 'lattice'; readonly boxSize: number };

/** The multipole orders the power model provides. */
export const POWER_MULTIPOLE_ORDERS: readonly number[] = [0, 2, 4];

/**
 * Every bin-multipole value is a weighted sum over observed (k, mu) points:
 * P_l(bin i) = sum_{j in [start[i], start[i+1])} weights[m][j] P(k[j], mu[j]).
 * With quadrature the weights are (2l + 1) w_j L_l(mu_j) on mu in [0, 1]
 * (P is even in mu); on a lattice they are (2l + 1) L_l(mu_j) n_j / N.
 */
export interface PowerBinSampling {
  readonly binCount: number;
  readonly multipoles: readonly number[];
  /** Wavenumber reported for each bin (centre, or the mean k of its modes). */
  readonly effectiveK: Float64Array;
  readonly start: Int32Array;
  readonly k: Float64Array;
  readonly mu: Float64Array;
  readonly weights: readonly Float64Array[];
}

export function validateMultipoles(multipoles: readonly number[]): void {
  if (multipoles.length === 0) throw new InputError('multipoles: give at least one of 0, 2, 4');
  const seen = new Set<number>();
  for (const l of multipoles) {
    if (!POWER_MULTIPOLE_ORDERS.includes(l)) {
      throw new InputError(`multipoles: unknown multipole order ${l} (the power model has ${POWER_MULTIPOLE_ORDERS.join(', ')})`);
    }
    if (seen.has(l)) throw new InputError(`multipoles: order ${l} is listed twice`);
    seen.add(l);
  }
}

export function buildPowerBinSampling(
  bins: PowerKBins,
  multipoles: readonly number[],
  averaging: PowerBinAveraging,
  muNodes: number,
): PowerBinSampling {
  validatePowerKBins(bins);
  validateMultipoles(multipoles);
  if (averaging.kind === 'lattice') return latticeSampling(bins, multipoles, averaging.boxSize);
  if (!Number.isInteger(muNodes) || muNodes < 2 || muNodes > 256) {
    throw new InputError(`muNodes must be an integer from 2 to 256, got ${muNodes}`);
  }
  const effectiveK = new Float64Array(bins.count);
  if (averaging.kind === 'centre') {
    for (let i = 0; i < bins.count; i++) effectiveK[i] = powerBinCentre(bins, i);
  } else if (averaging.kind === 'mean-k') {
    if (averaging.boxSize === undefined) {
      for (let i = 0; i < bins.count; i++) effectiveK[i] = continuumMeanK(...powerBinEdges(bins, i));
    } else {
      latticeBinModes(averaging.boxSize, bins).forEach((b, i) => (effectiveK[i] = b.meanK));
    }
  } else {
    throw new InputError(`averaging.kind must be centre, mean-k or lattice, got ${(averaging as { kind: unknown }).kind}`);
  }
  const rule = gaussLegendreOn(muNodes, 0, 1);
  const n = bins.count * muNodes;
  const k = new Float64Array(n);
  const mu = new Float64Array(n);
  const weights = multipoles.map(() => new Float64Array(n));
  const start = new Int32Array(bins.count + 1);
  for (let i = 0; i < bins.count; i++) {
    start[i + 1] = (i + 1) * muNodes;
    for (let j = 0; j < muNodes; j++) {
      const p = i * muNodes + j;
      k[p] = effectiveK[i];
      mu[p] = rule.nodes[j];
      multipoles.forEach((l, m) => (weights[m][p] = (2 * l + 1) * rule.weights[j] * legendre(l, rule.nodes[j])));
    }
  }
  return { binCount: bins.count, multipoles: [...multipoles], effectiveK, start, k, mu, weights };
}

function latticeSampling(bins: PowerKBins, multipoles: readonly number[], boxSize: number): PowerBinSampling {
  const modes = latticeBinModes(boxSize, bins);
  const start = new Int32Array(bins.count + 1);
  modes.forEach((b, i) => (start[i + 1] = start[i] + b.k.length));
  const n = start[bins.count];
  const k = new Float64Array(n);
  const mu = new Float64Array(n);
  const weights = multipoles.map(() => new Float64Array(n));
  const effectiveK = new Float64Array(bins.count);
  modes.forEach((b, i) => {
    effectiveK[i] = b.meanK;
    k.set(b.k, start[i]);
    mu.set(b.mu, start[i]);
    for (let g = 0; g < b.k.length; g++) {
      const share = b.multiplicity[g] / b.modeCount;
      multipoles.forEach((l, m) => (weights[m][start[i] + g] = (2 * l + 1) * share * legendre(l, b.mu[g])));
    }
  });
  return { binCount: bins.count, multipoles: [...multipoles], effectiveK, start, k, mu, weights };
}

/** out[m * binCount + i] = P_l(bin i) from values at the sampling points (multipole-major order). */
export function reduceToMultipoles(sampling: PowerBinSampling, pointValues: Float64Array, out: Float64Array): Float64Array {
  const { binCount, start, weights } = sampling;
  for (let m = 0; m < weights.length; m++) {
    const w = weights[m];
    for (let i = 0; i < binCount; i++) {
      let s = 0;
      for (let j = start[i]; j < start[i + 1]; j++) s += w[j] * pointValues[j];
      out[m * binCount + i] = s;
    }
  }
  return out;
}
