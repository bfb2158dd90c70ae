import { InputError } from '../../contracts/input-error.js';
import { selectVector } from '../../data/scale-cuts.js';
import { defaultFisherStep, twoStepDerivative } from '../../inference/fisher/fisher-matrix.js';
import { renderTriangleShapeMapSvg } from '../../report/plots/triangle-shape-map.js';
import { dataEntryShapeClass } from '../scale-cuts/shape-class-chi2.js';
import { binForecastSetup, type BinForecastInputs } from './bin-forecast-setup.js';

/**
 * Sensitivity of the bispectrum monopole to each parameter across triangle
 * shapes: per triangle bin, dB_0/dtheta (numerical, the two-step Richardson
 * derivative of the Fisher code; exact for the linear amplitudes) and the
 * same in units of the bin's Gaussian error, (dB_0/dtheta) / sigma(B_0) —
 * the per-triangle share of the Fisher information on theta is its square.
 * Map value (SVG): that error-weighted derivative, on the plane
 * x = k2/k1, y = k3/k1 of renderTriangleShapeMapSvg.
 */
export const SENSITIVITY_DEFAULT_PARAMETERS = ['mNu', 'b1', 'b2', 'bG2'] as const;

export interface SensitivityMap {
  readonly name: string;
  readonly derivative: Float64Array;
  readonly perSigma: Float64Array;
  /** Share of the B_0 Fisher information F_aa carried by each shape class. */
  readonly informationByClass: Readonly<Record<string, number>>;
}

export interface BispectrumSensitivity {
  /** Triangle sides k1 >= k2 >= k3 per bin. */
  readonly k1: Float64Array;
  readonly k2: Float64Array;
  readonly k3: Float64Array;
  readonly maps: readonly SensitivityMap[];
}

export function bispectrumSensitivity(inp: Omit<BinForecastInputs, 'power'>): BispectrumSensitivity {
  if (!inp.bispectrum) throw new InputError('sensitivity: bispectrum bins are required', { where: 'bispectrum' });
  if (!inp.bispectrum.multipoles.includes(0)) throw new InputError('sensitivity: the bispectrum bins must include the monopole (multipoles [0, ...])', { where: 'bispectrum.multipoles' });
  const setup = binForecastSetup({ ...inp, power: undefined });
  const entries = setup.bundle.dataVector.entries;
  const full = entries.length;
  const indices = Int32Array.from(entries.flatMap((e, i) => (e.block === 'B0' ? [i] : [])));
  const side = (s: number) => Float64Array.from(indices, (i) => entries[i].k[s]);
  const sigma = Float64Array.from(indices, (i) => Math.sqrt(setup.covariance.matrix[i * full + i]));
  const linear = new Set(setup.vector.linearNames(setup.fiducial));
  const columns = setup.vector.linearColumns(setup.fiducial, inp.names.filter((n) => linear.has(n)));
  const maps = inp.names.map((name) => {
    let derivative: Float64Array;
    const exact = columns[name];
    if (exact) derivative = selectVector(exact, indices);
    else {
      const h = inp.steps?.[name] ?? defaultFisherStep(setup.fiducial[name]);
      const model = (p: Readonly<Record<string, number>>) => selectVector(setup.vector.evaluate(p), indices);
      derivative = twoStepDerivative(model, setup.fiducial, name, h).derivative;
    }
    const perSigma = Float64Array.from(derivative, (d, i) => d / sigma[i]);
    const informationByClass: Record<string, number> = {};
    let total = 0;
    perSigma.forEach((v, a) => {
      const c = dataEntryShapeClass(entries[indices[a]], inp.bispectrum?.dk ?? 0);
      informationByClass[c] = (informationByClass[c] ?? 0) + v * v;
      total += v * v;
    });
    for (const c of Object.keys(informationByClass)) informationByClass[c] /= total;
    return { name, derivative, perSigma, informationByClass };
  });
  return { k1: side(0), k2: side(1), k3: side(2), maps };
}

/** One SVG shape map per parameter. */
export function renderSensitivityMapsSvg(s: BispectrumSensitivity, title = 'B0 sensitivity'): Record<string, string> {
  return Object.fromEntries(
    s.maps.map((m) => {
      let limit = 0;
      for (const v of m.perSigma) limit = Math.max(limit, Math.abs(v));
      return [m.name, renderTriangleShapeMapSvg({ k1: s.k1, k2: s.k2, k3: s.k3, value: m.perSigma, limit: limit > 0 ? limit : 1, colourLabel: `dB0/d${m.name} / sigma(B0)`, title: `${title}: ${m.name}` })];
    }),
  );
}
