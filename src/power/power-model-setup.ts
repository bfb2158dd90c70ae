import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { InputError } from '../contracts/input-error.js';
import { mapObservedToTrue } from './alcock-paczynski.js';
import { buildPowerBinSampling, type PowerBinAveraging, type PowerBinSampling } from './bin-sampling.js';
import type { PowerKBins } from './k-bins.js';

/** What a power multipole model fixes when it is built. */
export interface PowerModelOptions {
  readonly spectrum: LinearSpectrum;
  readonly bins: PowerKBins;
  /** Mean number density as measured in the fiducial (observed) coordinates, (h/Mpc)^3. */
  readonly nbar: number;
  /** Subset of 0, 2, 4 in the order wanted; default all three. */
  readonly multipoles?: readonly number[];
  /** Default: at the bin centre. */
  readonly averaging?: PowerBinAveraging;
  /** Gauss–Legendre nodes on mu in [0, 1] (quadrature averagings); default 12. */
  readonly muNodes?: number;
  /** Growth rate in the IR damping Sigma_tot^2(mu); default the spectrum's large-scale f. */
  readonly dampingGrowthRate?: number;
}

export interface PowerModelSetup {
  readonly spectrum: LinearSpectrum;
  readonly nbar: number;
  readonly dampingGrowthRate: number;
  readonly sampling: PowerBinSampling;
}

export const DEFAULT_MU_NODES = 12;

export function buildPowerModelSetup(options: PowerModelOptions): PowerModelSetup {
  const { spectrum, nbar } = options;
  if (!Number.isFinite(nbar) || nbar <= 0) throw new InputError(`nbar must be a positive number density in (h/Mpc)^3, got ${nbar}`);
  const dampingGrowthRate = options.dampingGrowthRate ?? spectrum.growthRateLargeScale;
  if (!Number.isFinite(dampingGrowthRate) || dampingGrowthRate < 0) {
    throw new InputError(`dampingGrowthRate must be a non-negative number, got ${dampingGrowthRate}`);
  }
  if (!(spectrum.growthRateLargeScale > 0)) {
    throw new InputError(`spectrum.growthRateLargeScale must be positive, got ${spectrum.growthRateLargeScale}`);
  }
  const sampling = buildPowerBinSampling(
    options.bins,
    options.multipoles ?? [0, 2, 4],
    options.averaging ?? { kind: 'centre' },
    options.muNodes ?? DEFAULT_MU_NODES,
  );
  const setup = { spectrum, nbar, dampingGrowthRate, sampling };
  trueCoordinates(setup, 1, 1); // refuse bins outside the linear table at build time
  return setup;
}

/**
 * True (q, nu) of every sampling point for the given dilations; throws when a q
 * falls outside the range the linear spectrum is trusted on.
 */
export function trueCoordinates(setup: PowerModelSetup, alphaPar: number, alphaPerp: number): { q: Float64Array; nu: Float64Array } {
  const { k, mu } = setup.sampling;
  const q = new Float64Array(k.length);
  const nu = new Float64Array(k.length);
  mapObservedToTrue(k, mu, alphaPar, alphaPerp, q, nu);
  const { kMin, kMax } = setup.spectrum;
  for (let j = 0; j < q.length; j++) {
    if (q[j] < kMin || q[j] > kMax) {
      const ap = alphaPar === 1 && alphaPerp === 1 ? '' : ` (true wavenumber at alphaPar=${alphaPar}, alphaPerp=${alphaPerp})`;
      throw new InputError(`bins: k = ${q[j]} h/Mpc${ap} lies outside the linear spectrum's range [${kMin}, ${kMax}] h/Mpc`, {
        hint: 'narrow the k bins or extend the linear power table',
      });
    }
  }
  return { q, nu };
}
