/**
 * The part of a second-order mock's mean bispectrum that the tree-level model
 * lacks: the second-order field is delta = delta1 + delta2, with delta1 the
 * (dealiased) linear redshift-space galaxy field Z1 delta_L and delta2 the
 * quadratic part; <delta2 delta2 delta2> is one-loop in size
 * (docs/conventions.md, "Mocks"). Measuring the bispectrum of delta2 alone in
 * a realisation gives that realisation's estimate of it, to be subtracted
 * before averaging. Shared by scripts/mocks-second-order.ts and
 * scripts/mocks-treble-fit.ts.
 */
import { measureBox, type BoxMeasurement, type BoxMeasurementPlan } from '../src/mocks/box-measurement.js';
import { linearGalaxySpectrum } from '../src/mocks/linear-galaxy-field.js';
import { dealiasSpectrum } from '../src/mocks/second-order-field.js';

type Geometry = Parameters<typeof measureBox>[2];

/**
 * Box measurement of the quadratic part delta2 = second - Z1 delta_L of one
 * realisation (no noise): `lin` is the realisation's linear density spectrum,
 * `second` its second-order galaxy spectrum built from `lin` with bias b1 and
 * growth rate f. Its bispectrum is B[delta2, delta2, delta2].
 */
export function measureQuadraticPart(
  lin: Float64Array,
  second: Float64Array,
  bias: { b1: number; f: number },
  plan: BoxMeasurementPlan,
  geometry?: Geometry,
): BoxMeasurement {
  const { mesh } = plan;
  const linear = dealiasSpectrum(linearGalaxySpectrum(lin, mesh, bias.b1, bias.f), mesh.n);
  const quadratic = new Float64Array(second.length);
  for (let i = 0; i < second.length; i++) quadratic[i] = second[i] - linear[i];
  return measureBox(quadratic, plan, geometry);
}
