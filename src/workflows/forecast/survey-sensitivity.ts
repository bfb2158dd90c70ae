import { backgroundOf } from '../../cosmology/background.js';
import { validateCosmology } from '../../cosmology/cosmology-parameters.js';
import { bispectrumSensitivity, SENSITIVITY_DEFAULT_PARAMETERS, type BispectrumSensitivity } from './bispectrum-sensitivity.js';
import { validateForecastSpec } from './forecast-spec.js';
import { resolveSurvey } from './survey.js';

/**
 * Sensitivity maps of every redshift bin of a forecast config (same JSON as
 * runForecast; its bispectrum bins, cosmology, nuisance values and steps),
 * for the parameters `names` (default SENSITIVITY_DEFAULT_PARAMETERS).
 */
export function surveySensitivity(raw: unknown, names: readonly string[] = SENSITIVITY_DEFAULT_PARAMETERS): BispectrumSensitivity[] {
  const spec = validateForecastSpec(raw);
  const bins = resolveSurvey(spec.survey, backgroundOf(validateCosmology(spec.cosmology, { path: 'cosmology' })));
  return bins.map((bin, i) =>
    bispectrumSensitivity({ bin, cosmology: spec.cosmology, names, nuisance: spec.nuisance, bispectrum: spec.bispectrum, steps: spec.steps, linearPower: spec.linearPower, models: spec.models, label: `survey.bins[${i}]` }),
  );
}
