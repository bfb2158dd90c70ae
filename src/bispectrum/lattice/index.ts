export * from './lattice-bin-average.js';
export * from './discrete-box-average.js';
export { latticeCacheFolder } from './lattice-cache.js';
export { integrandFingerprint } from './integrand-fingerprint.js';
export { latticeMemoisedSpectrum } from './memoised-spectrum.js';
