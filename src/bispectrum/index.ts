// Tree-level bispectrum integrand for every bin-averaging method (lattice included):
// `TreeTemplateIntegrand` (template pieces, size TREE_TEMPLATE_SIZE, terms listed in
// TREE_TEMPLATE_TERMS) and `combineTreeTemplates(templates, nMultipoles, params)`
// turning averaged templates [bin][multipole][value] into B_l, out[m * nBins + bin].
// `TreeDirectIntegrand` is the same model for fixed parameters (size 1).
export * from './triangle-bins.js';
export type * from './triangle-integrand.js';
export * from './tree-settings.js';
export * from './triangle-physics.js';
export * from './tree-template-terms.js';
export * from './tree-template-integrand.js';
export * from './tree-template-combination.js';
export * from './compiled-template-combination.js';
export * from './tree-direct-integrand.js';
export * from './orientation-rule.js';
export * from './triangle-node-set.js';
export * from './continuous-bin-nodes.js';
export * from './orientation-average.js';
export * from './bin-averaging.js';
export * from './lattice/index.js';
export * from './user-triangles.js';
export * from './shape-classes.js';
export * from './tree-bispectrum-model.js';
export * from './tabulated-spectrum.js';
export * from './tree-multipole-evaluator.js';
export * from './bispectrum-csv.js';
