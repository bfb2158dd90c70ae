export * from './input-error.js';
export type * from './linear-spectrum.js';
export type * from './statistic-model.js';
export * from './interrupted-error.js';
