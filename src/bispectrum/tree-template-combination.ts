import { InputError } from '../contracts/input-error.js';
import { TREE_TEMPLATE_SIZE, treeTemplateCoefficients, type TreeBispectrumParameters } from './tree-template-terms.js';

/**
 * B_l per bin from averaged templates in the layout [bin][multipole][value]
 * (value = term of tree-template-terms.ts): a dot product of TREE_TEMPLATE_SIZE
 * numbers per bin and multipole. Output layout [multipole][bin]:
 * out[m * nBins + bin], the data-vector order B_l0 bins, then B_l1 bins, ...
 */
// combineTreeTemplates writes the dot product out term by term.
if (TREE_TEMPLATE_SIZE !== 17) throw new Error(`combineTreeTemplates is written for 17 template terms, the term list has ${TREE_TEMPLATE_SIZE}`);

/** Bins in a template array [bin][multipole][value]; refuses a length that does not fit. */
export function templateBinCount(templates: Float64Array, nMultipoles: number): number {
  const stride = nMultipoles * TREE_TEMPLATE_SIZE;
  if (templates.length % stride !== 0) {
    throw new InputError(`bispectrum templates: length ${templates.length} is not a multiple of ${nMultipoles} multipoles x ${TREE_TEMPLATE_SIZE} terms`);
  }
  return templates.length / stride;
}

export function combineTreeTemplates(
  templates: Float64Array,
  nMultipoles: number,
  params: TreeBispectrumParameters,
  out?: Float64Array,
): Float64Array {
  const nBins = templateBinCount(templates, nMultipoles);
  const res = out ?? new Float64Array(nBins * nMultipoles);
  const c = treeTemplateCoefficients(params);
  // The 17 coefficients as locals and the dot product written out: about three times faster
  // than the inner loop over terms (bench/bispectrum.bench.ts, template re-evaluation).
  const [c0, c1, c2, c3, c4, c5, c6, c7, c8, c9, c10, c11, c12, c13, c14, c15, c16] = c;
  const t = templates;
  for (let bin = 0; bin < nBins; bin++) {
    for (let m = 0; m < nMultipoles; m++) {
      const b = (bin * nMultipoles + m) * TREE_TEMPLATE_SIZE;
      res[m * nBins + bin] =
        c0 * t[b] + c1 * t[b + 1] + c2 * t[b + 2] + c3 * t[b + 3] + c4 * t[b + 4] + c5 * t[b + 5] + c6 * t[b + 6] + c7 * t[b + 7] +
        c8 * t[b + 8] + c9 * t[b + 9] + c10 * t[b + 10] + c11 * t[b + 11] + c12 * t[b + 12] + c13 * t[b + 13] + c14 * t[b + 14] +
        c15 * t[b + 15] + c16 * t[b + 16];
    }
  }
  return res;
}
