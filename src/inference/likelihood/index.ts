export * from './block-cholesky.js';
export * from './chi-square-tail.js';
export * from './linear-marginalisation.js';
export * from './composite-model.js';
export * from './model-source.js';
export * from './joint-likelihood.js';
