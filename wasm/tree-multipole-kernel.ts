// AssemblyScript source of the compiled orientation loops of
// TreeMultipoleEvaluator (src/bispectrum/tree-multipole-evaluator.ts): B_l
// (`multipoles` here, method `undistorted` there) and the averaged templates
// (`templates`, tree-template-loop.ts; method `undistortedTemplates`), the
// same terms, with the two lanes of an f64x2 vector carrying two mu nodes of
// the orientation rule. One module, so both share the geometry. Built by
// `npm run build:wasm` into src/bispectrum/tree-multipole-kernel-wasm.ts;
// tests/bispectrum/wasm-kernel.test.ts checks that the committed bytes come
// from this file and that both loops agree.

export { reserve } from './reserve';
export { setExpTable } from './simd-f64x2';
export { templates } from './tree-template-loop';

import { add, expNegative2, mul, S, sub } from './simd-f64x2';

/**
 * One orientation point (both lanes): 2 B_det + A_P b1/nbar (Z1_2 P_2 + Z1_3 P_3),
 * the part of the host loop's per-point sum that changes with phi. `sc` is
 * sqrt(1 - mu1^2) cos(phi); the rest is fixed per node and mu pair.
 */
@inline function phiPoint(
  sc: v128, A2: v128, vbs2: v128, nu1: v128, uu1: v128, vik2: v128, vik3: v128, vb1: v128, vf: v128,
  nw2: v128, w2: v128, nw3: v128, w3: v128, vaIR: v128, vcIR: v128, c12: v128, g12: v128, c31: v128, g31: v128,
  cg23: v128, hu1: v128, hv1: v128, hz1: v128, zP1: v128, fog: bool, vhs: v128, vStochP: v128,
): v128 {
  // LOS components u_i = k_i mu_i of the three sides; u1 + u2 + u3 = 0.
  const u2 = sub(A2, mul(vbs2, sc));
  const u3 = sub(nu1, u2);
  const v2 = mul(u2, vik2);
  const v3 = mul(u3, vik3);
  const uu2 = mul(u2, u2);
  const uu3 = mul(u3, u3);
  const q2 = mul(u2, v2);
  const q3 = mul(u3, v3);
  const z2 = add(vb1, mul(vf, q2));
  const z3 = add(vb1, mul(vf, q3));
  const zP2 = mul(z2, add(nw2, mul(w2, expNegative2(mul(uu2, add(vaIR, mul(vcIR, q2)))))));
  const zP3 = mul(z3, add(nw3, mul(w3, expNegative2(mul(uu3, add(vaIR, mul(vcIR, q3)))))));
  // Z2 of each pair (Scoccimarro, Couchman & Frieman 1999, eq. 13), as in the host loop.
  const zz12 = sub(add(c12, mul(g12, q3)), mul(u3, add(mul(hv1, z2), mul(v2, hz1))));
  const zz23 = sub(cg23, mul(hu1, add(mul(v2, z3), mul(v3, z2))));
  const zz31 = sub(add(c31, mul(g31, q2)), mul(u2, add(mul(v3, hz1), mul(hv1, z3))));
  let d = add(mul(zP2, add(mul(zP1, zz12), mul(zP3, zz23))), mul(mul(zP3, zP1), zz31));
  if (fog) d = mul(d, expNegative2(mul(vhs, add(add(uu1, uu2), uu3))));
  return add(add(d, d), mul(vStochP, add(zP2, zP3)));
}

/**
 * B_l [multipole][bin] into `out`. Per node i: sides K1, K2, K3, cos and sin of
 * the angle between sides 1 and 2 (C12, S12), volume weight W, pair kernels PK
 * (9 per node: F2, G2, sigma^2 of pairs 12, 23, 31), side-power indices IX (3 per
 * node, int32) into NW (P_nw) and WG (wiggle damped at mu = 0). Orientation rule
 * in mu pairs: MU2 [pair][lane], SC2 [pair][phi][lane] = sqrt(1 - mu1^2) cos(phi),
 * WMU2 [pair][multipole][lane] (zero weight in a padding lane). Constants C:
 * b1, bG2, f, b2/2, f/2, stochastic constant per mu node, stochastic P factor,
 * the IR damping coefficients a and c, sigma_v^2 / 2. ACC: scratch of nm f64.
 */
export function multipoles(
  binCount: i32,
  start: usize,
  K1: usize,
  K2: usize,
  K3: usize,
  C12: usize,
  S12: usize,
  W: usize,
  PK: usize,
  IX: usize,
  NW: usize,
  WG: usize,
  muPairs: i32,
  phiCount: i32,
  MU2: usize,
  SC2: usize,
  WMU2: usize,
  nm: i32,
  C: usize,
  ACC: usize,
  out: usize,
): void {
  const b1 = load<f64>(C);
  const bG2 = load<f64>(C, 8);
  const f = load<f64>(C, 16);
  const hb2 = load<f64>(C, 24);
  const hf = load<f64>(C, 32);
  const vb1 = S(b1);
  const vf = S(f);
  const vhf = S(hf);
  const vStochC = S(load<f64>(C, 40));
  const vStochP = S(load<f64>(C, 48));
  const vaIR = S(load<f64>(C, 56));
  const vcIR = S(load<f64>(C, 64));
  const halfSv2 = load<f64>(C, 72);
  const vhs = S(halfSv2);
  const fog = halfSv2 > 0;
  const vPhi = S(<f64>phiCount);
  for (let bin = 0; bin < binCount; bin++) {
    for (let m = 0; m < nm; m++) store<f64>(ACC + (<usize>m << 3), 0);
    const iEnd = load<i32>(start + (<usize>(bin + 1) << 2));
    for (let i = load<i32>(start + (<usize>bin << 2)); i < iEnd; i++) {
      const o8 = <usize>i << 3;
      const k1 = load<f64>(K1 + o8);
      const k2 = load<f64>(K2 + o8);
      const k3 = load<f64>(K3 + o8);
      const vk1 = S(k1);
      const vik1 = S(1 / (k1 * k1));
      const vik2 = S(1 / (k2 * k2));
      const vik3 = S(1 / (k3 * k3));
      const va2 = S(k2 * load<f64>(C12 + o8));
      const vbs2 = S(k2 * load<f64>(S12 + o8));
      const pk = PK + <usize>i * 72;
      // Orientation-independent parts of Z2 per pair: b1 F2 + b2/2 + bG2 sigma^2, and f G2.
      const c12 = S(b1 * load<f64>(pk) + hb2 + bG2 * load<f64>(pk, 16));
      const c23 = S(b1 * load<f64>(pk, 24) + hb2 + bG2 * load<f64>(pk, 40));
      const c31 = S(b1 * load<f64>(pk, 48) + hb2 + bG2 * load<f64>(pk, 64));
      const g12 = S(f * load<f64>(pk, 8));
      const g23 = S(f * load<f64>(pk, 32));
      const g31 = S(f * load<f64>(pk, 56));
      const ix = IX + <usize>i * 12;
      const s1 = <usize>load<i32>(ix) << 3;
      const s2 = <usize>load<i32>(ix, 4) << 3;
      const s3 = <usize>load<i32>(ix, 8) << 3;
      const nw1 = S(load<f64>(NW + s1));
      const nw2 = S(load<f64>(NW + s2));
      const nw3 = S(load<f64>(NW + s3));
      const w1 = S(load<f64>(WG + s1));
      const w2 = S(load<f64>(WG + s2));
      const w3 = S(load<f64>(WG + s3));
      const wn = S(load<f64>(W + o8));
      for (let jj = 0; jj < muPairs; jj++) {
        const m1 = v128.load(MU2 + (<usize>jj << 4));
        const u1 = mul(vk1, m1);
        const uu1 = mul(u1, u1);
        const q1 = mul(m1, m1);
        const z1 = add(vb1, mul(vf, q1));
        const zP1 = mul(z1, add(nw1, mul(w1, expNegative2(mul(uu1, add(vaIR, mul(vcIR, q1)))))));
        // Per mu node: (f/2) mu1/k1, (f/2) Z1(k1), (f/2) u1 and the mu1-only part of Z2(k2, k3).
        const hv1 = mul(mul(vhf, u1), vik1);
        const hz1 = mul(vhf, z1);
        const hu1 = mul(vhf, u1);
        const cg23 = add(c23, mul(g23, q1));
        const A2 = mul(va2, m1);
        const nu1 = f64x2.neg(u1);
        const sc = SC2 + <usize>(jj * phiCount) * 16;
        // Two phi points per trip, summed apart: two independent chains for the out-of-order core.
        let e0 = S(0);
        let e1 = S(0);
        let p = 0;
        for (; p + 1 < phiCount; p += 2) {
          const s0 = v128.load(sc + (<usize>p << 4));
          const s1 = v128.load(sc + (<usize>(p + 1) << 4));
          e0 = add(e0, phiPoint(s0, A2, vbs2, nu1, uu1, vik2, vik3, vb1, vf, nw2, w2, nw3, w3, vaIR, vcIR, c12, g12, c31, g31, cg23, hu1, hv1, hz1, zP1, fog, vhs, vStochP));
          e1 = add(e1, phiPoint(s1, A2, vbs2, nu1, uu1, vik2, vik3, vb1, vf, nw2, w2, nw3, w3, vaIR, vcIR, c12, g12, c31, g31, cg23, hu1, hv1, hz1, zP1, fog, vhs, vStochP));
        }
        if (p < phiCount) {
          const s0 = v128.load(sc + (<usize>p << 4));
          e0 = add(e0, phiPoint(s0, A2, vbs2, nu1, uu1, vik2, vik3, vb1, vf, nw2, w2, nw3, w3, vaIR, vcIR, c12, g12, c31, g31, cg23, hu1, hv1, hz1, zP1, fog, vhs, vStochP));
        }
        const sum = mul(wn, add(add(add(e0, e1), mul(vStochP, mul(vPhi, zP1))), vStochC));
        const wm = WMU2 + <usize>(jj * nm) * 16;
        for (let m = 0; m < nm; m++) {
          const t = mul(sum, v128.load(wm + (<usize>m << 4)));
          const a = ACC + (<usize>m << 3);
          store<f64>(a, load<f64>(a) + f64x2.extract_lane(t, 0) + f64x2.extract_lane(t, 1));
        }
      }
    }
    for (let m = 0; m < nm; m++) store<f64>(out + (<usize>(m * binCount + bin) << 3), load<f64>(ACC + (<usize>m << 3)));
  }
}
