export * from './priors.js';
export * from './safe-expression.js';
export * from './parameter-space.js';
