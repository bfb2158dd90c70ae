import { InputError } from '../contracts/input-error.js';
import { TREE_TEMPLATE_SIZE, treeTemplateCoefficients, type TreeBispectrumParameters } from './tree-template-terms.js';

/**
 * B_l per bin from averaged templates in the layout [bin][multipole][value]
 * (value = term of tree-template-terms.ts): a dot product of TREE_TEMPLATE_SIZE
 * numbers per bin and multipole. Output layout [multipole][bin]:
 * out[m * nBins + bin], the data-vector order B_l0 bins, then B_l1 bins, ...
 */
export function combineTreeTemplates(
  templates: Float64Array,
  nMultipoles: number,
  params: TreeBispectrumParameters,
  out?: Float64Array,
): Float64Array {
  const stride = nMultipoles * TREE_TEMPLATE_SIZE;
  if (templates.length % stride !== 0) {
    throw new InputError(`bispectrum templates: length ${templates.length} is not a multiple of ${nMultipoles} multipoles x ${TREE_TEMPLATE_SIZE} terms`);
  }
  const nBins = templates.length / stride;
  const res = out ?? new Float64Array(nBins * nMultipoles);
  const c = treeTemplateCoefficients(params);
  for (let bin = 0; bin < nBins; bin++) {
    for (let m = 0; m < nMultipoles; m++) {
      const base = (bin * nMultipoles + m) * TREE_TEMPLATE_SIZE;
      let sum = 0;
      for (let t = 0; t < TREE_TEMPLATE_SIZE; t++) sum += c[t] * templates[base + t];
      res[m * nBins + bin] = sum;
    }
  }
  return res;
}
