export * from './fisher-matrix.js';
export * from './fisher-algebra.js';
export * from './source-model-vector.js';
export * from './selection-fisher.js';
