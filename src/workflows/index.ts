export * from './scale-cuts/theory-error-covariance.js';
export * from './forecast/survey.js';
export * from './synthetic/synthetic-bundle.js';
