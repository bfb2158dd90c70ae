import type { LinearSpectrum } from '../contracts/linear-spectrum.js';
import { InputError } from '../contracts/input-error.js';
import type { Background } from './background.js';
import type { GrowthHistory } from './growth-history.js';
import { linearPowerFromCosmology, type CosmologyLinearPower, type LinearPowerOptions } from './linear-power-from-cosmology.js';
import type { LinearTheoryConfig } from './linear-theory-config.js';
import { readPowerTable } from './power-table.js';
import { linearSpectrumFromTable, type TableSpectrumOptions } from './table-linear-spectrum.js';

/** The spectrum a config asks for: its power table if it names one, else the EH98/EH99 spectrum of its cosmology. */
export function linearSpectrumOfConfig(
  config: LinearTheoryConfig,
  options: { power?: LinearPowerOptions; table?: TableSpectrumOptions } = {},
): LinearSpectrum {
  if (config.powerTablePath === undefined) return linearPowerFromCosmology(config.cosmology, config.redshift, options.power);
  return linearSpectrumFromTable(readPowerTable(config.powerTablePath), config.cosmology, config.redshift, options.table);
}

/** n log-spaced wavenumbers from kMin to kMax (h/Mpc). */
export function logSpacedWavenumbers(kMin: number, kMax: number, n: number): Float64Array {
  if (!(kMin > 0) || !(kMax > kMin)) throw new InputError(`k range must satisfy 0 < kmin < kmax, got ${kMin} and ${kMax}`);
  if (!Number.isInteger(n) || n < 2) throw new InputError(`number of k points must be an integer >= 2, got ${n}`);
  return Float64Array.from({ length: n }, (_, i) => kMin * (kMax / kMin) ** (i / (n - 1)));
}

const fmt = (v: number) => Number(v.toPrecision(10)).toString();

/**
 * Spectrum CSV: k [h/Mpc], P_lin and P_nw of the traced (cold) field [(Mpc/h)^3],
 * f(k), and P_m of the total matter when the spectrum has it.
 */
export function linearSpectrumCsv(spectrum: LinearSpectrum, k: ArrayLike<number>): string {
  const matter = (spectrum as Partial<CosmologyLinearPower>).powerMatter?.bind(spectrum);
  const lines = [matter ? 'k,P_lin,P_nw,f,P_m' : 'k,P_lin,P_nw,f'];
  for (let i = 0; i < k.length; i++) {
    const cells = [k[i], spectrum.power(k[i]), spectrum.powerNoWiggle(k[i]), spectrum.growthRate(k[i])];
    if (matter) cells.push(matter(k[i]));
    lines.push(cells.map(fmt).join(','));
  }
  return `${lines.join('\n')}\n`;
}

/** Background CSV: z, H [km/s/Mpc], D_M and D_A [Mpc/h], D and f (large scales). */
export function backgroundCsv(background: Background, growth: GrowthHistory, redshifts: ArrayLike<number>): string {
  const lines = ['z,H,D_M,D_A,D,f'];
  for (let i = 0; i < redshifts.length; i++) {
    const z = redshifts[i];
    lines.push(
      [z, background.hubble(z), background.transverseDistance(z), background.angularDiameterDistance(z), growth.factor(z), growth.rate(z)]
        .map(fmt)
        .join(','),
    );
  }
  return `${lines.join('\n')}\n`;
}
