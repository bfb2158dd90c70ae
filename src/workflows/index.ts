export * from './scale-cuts/theory-error-covariance.js';
export * from './forecast/survey.js';
export * from './synthetic/synthetic-bundle.js';
export * from './forecast/binning-bundle.js';
export * from './forecast/bin-fisher-set.js';
export * from './forecast/forecast-spec.js';
export * from './forecast/run-forecast.js';
