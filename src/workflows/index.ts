export * from './scale-cuts/theory-error-covariance.js';
