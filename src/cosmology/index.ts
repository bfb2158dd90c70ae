/**
 * Linear theory: cosmological parameters, background, growth, Eisenstein–Hu
 * linear power, user tables, wiggle split and BAO damping scales.
 *
 * Entry points:
 *   validateCosmology(raw, origin)            -> CosmologyParameters (throws InputErrors)
 *   linearPowerFromCosmology(params, z, opts) -> CosmologyLinearPower (a LinearSpectrum: P_cb, P_nw,
 *                                                f(k), Sigma^2; plus P_m, D, sigma_R)
 *   readPowerTable(path) / parsePowerTable(text, source) -> PowerTable
 *   linearSpectrumFromTable(table, params, z, opts)      -> TableLinearSpectrum (a LinearSpectrum)
 *   backgroundOf(params) -> Background (E, H, distances); new GrowthHistory(background) -> D(z), f(z)
 */
export * from './physical-constants.js';
export * from './cosmology-parameters.js';
export * from './background.js';
export * from './growth-history.js';
export * from './eisenstein-hu-1998.js';
export * from './eisenstein-hu-1999.js';
export * from './top-hat-variance.js';
export * from './bao-damping-scales.js';
export * from './linear-power-from-cosmology.js';
export * from './power-table.js';
export * from './wiggle-split.js';
export * from './table-linear-spectrum.js';
export * from './linear-theory-config.js';
export * from './linear-theory-summary.js';
export * from './linear-theory-csv.js';
