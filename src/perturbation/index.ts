export * from './kernels.js';
export * from './ir-resummed-power.js';
