import type { ParameterValues } from '../../contracts/statistic-model.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { CompositeModel } from '../../inference/likelihood/composite-model.js';
import type { JointLikelihood } from '../../inference/likelihood/joint-likelihood.js';

/**
 * The full model vector (every data-vector entry, cuts ignored) at named
 * parameter values, the analytically marginalised ones included.
 */
export function modelVectorAt(likelihood: JointLikelihood, bundle: MeasurementBundle, values: ParameterValues): Float64Array {
  const prepared = likelihood.source.prepare(values);
  const model = new CompositeModel(prepared.models, bundle.dataVector.entries, { P: bundle.power?.dk, B: bundle.bispectrum?.dk });
  return model.evaluate({ ...values, ...prepared.modelValues });
}
