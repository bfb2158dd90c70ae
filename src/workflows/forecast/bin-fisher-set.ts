import type { ParameterValues } from '../../contracts/statistic-model.js';
import { COSMOLOGY_FIELDS } from '../../cosmology/cosmology-parameters.js';
import { selectMatrix } from '../../data/scale-cuts.js';
import type { FisherMatrix } from '../../inference/fisher/fisher-matrix.js';
import { selectionFisher } from '../../inference/fisher/selection-fisher.js';
import { binForecastSetup, type BinForecastInputs } from './bin-forecast-setup.js';

/**
 * Fisher matrices of one redshift bin of a survey for P alone, B alone and
 * P + B, from one set of model evaluations (bin-forecast-setup.ts: bins,
 * models, fiducial point, Gaussian covariance). Each statistic's matrix lists
 * only the parameters it reads (and every cosmology parameter).
 */
export interface BinFisherSet {
  readonly fiducial: ParameterValues;
  readonly power: FisherMatrix | undefined;
  readonly bispectrum: FisherMatrix | undefined;
  readonly joint: FisherMatrix;
  readonly dataPoints: { readonly power: number; readonly bispectrum: number };
}

export function binFisherSet(inp: BinForecastInputs): BinFisherSet {
  const { bundle, vector, fiducial, readByPower, readByBispectrum, covariance, powerKMax } = binForecastSetup(inp);
  const label = inp.label ?? 'survey bin';
  const b = inp.bispectrum;
  const full = bundle.dataVector.entries.length;
  const fisherOf = (statistics: readonly ('P' | 'B')[], names: readonly string[]) => {
    const used = (e: (typeof bundle.dataVector.entries)[number]) => statistics.includes(e.statistic) && (e.statistic === 'B' || e.k[0] <= powerKMax);
    const indices = Int32Array.from(bundle.dataVector.entries.flatMap((e, i) => (used(e) ? [i] : [])));
    return selectionFisher({ vector, names, fiducial, indices, covariance: selectMatrix(covariance.matrix, full, indices), steps: inp.steps, label: `${label} covariance` });
  };
  const namesFor = (read: ReadonlySet<string>) => inp.names.filter((n) => n in COSMOLOGY_FIELDS || read.has(n));
  const statistics = [...(inp.power ? ['P' as const] : []), ...(b ? ['B' as const] : [])];
  return {
    fiducial,
    power: inp.power ? fisherOf(['P'], namesFor(readByPower)) : undefined,
    bispectrum: bundle.bispectrum ? fisherOf(['B'], namesFor(readByBispectrum)) : undefined,
    joint: fisherOf(statistics, inp.names),
    dataPoints: {
      power: bundle.dataVector.entries.filter((e) => e.statistic === 'P' && e.k[0] <= powerKMax).length,
      bispectrum: bundle.dataVector.entries.filter((e) => e.statistic === 'B').length,
    },
  };
}
