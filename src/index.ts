/**
 * treble — library entry. Each folder re-exports its public pieces from its own
 * index.ts; the CLI (src/cli) is built only on what is exported here.
 */
export * from './contracts/index.js';
export * from './numerics/index.js';
export * from './io/index.js';
export * from './cosmology/index.js';
export * from './perturbation/index.js';
export * from './power/index.js';
export * from './bispectrum/index.js';
export * from './data/index.js';
export * from './inference/index.js';
export * from './workflows/index.js';
export * from './report/index.js';
export * from './mocks/index.js';
