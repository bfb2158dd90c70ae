export * from './fisher-matrix.js';
export * from './fisher-algebra.js';
