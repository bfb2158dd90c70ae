export {};
export * from './fisher/index.js';
export * from './parameters/index.js';
export * from './likelihood/index.js';
export * from './sampling/index.js';
export * from './optimize/index.js';
export * from './diagnostics/index.js';
