export {};
export * from './fisher/index.js';
export * from './parameters/index.js';
export * from './likelihood/index.js';
