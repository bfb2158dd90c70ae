export * from './gauss-legendre.js';
export * from './legendre.js';
export * from './random.js';
export * from './cubic-spline.js';
export * from './lattice-shell.js';
