export * from './mesh.js';
export * from './shell-modes.js';
export * from './shell-filtered-field.js';
export * from './triangle-sums.js';
export * from './power-multipoles.js';
export * from './bispectrum-multipoles.js';
