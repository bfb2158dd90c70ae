export * from './triangle-bins.js';
export type * from './triangle-integrand.js';
