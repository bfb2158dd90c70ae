// AssemblyScript source of the compiled template combination
// (src/bispectrum/tree-template-combination.ts): B_l = sum_t c_t T_t per bin
// and multipole, the 17 terms as eight f64x2 products and one scalar. Built by
// `npm run build:wasm` into src/bispectrum/tree-template-dot-wasm.ts.
export { reserve } from './reserve';

/**
 * out[m * nBins + bin] = sum_t C[t] T[(bin * nm + m) * 17 + t]; C holds the 17
 * coefficients of tree-template-terms.ts (16-byte aligned), T the templates.
 */
export function combine(nBins: i32, nm: i32, T: usize, C: usize, out: usize): void {
  const c0 = v128.load(C);
  const c1 = v128.load(C, 16);
  const c2 = v128.load(C, 32);
  const c3 = v128.load(C, 48);
  const c4 = v128.load(C, 64);
  const c5 = v128.load(C, 80);
  const c6 = v128.load(C, 96);
  const c7 = v128.load(C, 112);
  const c16 = load<f64>(C, 128);
  let row = T;
  for (let bin = 0; bin < nBins; bin++) {
    for (let m = 0; m < nm; m++) {
      // Two partial sums of four products each, then the 17th term.
      let a = f64x2.mul(c0, v128.load(row));
      a = f64x2.add(a, f64x2.mul(c1, v128.load(row, 16)));
      a = f64x2.add(a, f64x2.mul(c2, v128.load(row, 32)));
      a = f64x2.add(a, f64x2.mul(c3, v128.load(row, 48)));
      let b = f64x2.mul(c4, v128.load(row, 64));
      b = f64x2.add(b, f64x2.mul(c5, v128.load(row, 80)));
      b = f64x2.add(b, f64x2.mul(c6, v128.load(row, 96)));
      b = f64x2.add(b, f64x2.mul(c7, v128.load(row, 112)));
      a = f64x2.add(a, b);
      store<f64>(out + (<usize>(m * nBins + bin) << 3), f64x2.extract_lane(a, 0) + f64x2.extract_lane(a, 1) + c16 * load<f64>(row, 128));
      row += 136;
    }
  }
}
