export * from './gauss-legendre.js';
export * from './legendre.js';
export * from './random.js';
export * from './cubic-spline.js';
export * from './lattice-shell.js';
export * from './fft-3d.js';
export * from './spherical-bessel-low-order.js';
export * from './fast-exp.js';
