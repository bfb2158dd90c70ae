export * from './nelder-mead.js';
export * from './restarted-nelder-mead.js';
export * from './quasi-newton.js';
export * from './climb-from-start.js';
export * from './find-posterior-mode.js';
