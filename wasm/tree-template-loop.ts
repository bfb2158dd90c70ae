// The averaged-template loop of TreeMultipoleEvaluator.undistortedTemplates
// (src/bispectrum/tree-multipole-evaluator.ts) in f64x2 lanes of two mu nodes:
// per orientation point the three side powers, the fingers-of-god factor, the
// monomial split of 2 Z1 Z1 Z2 P P of each pair (addPairTemplates in
// src/bispectrum/tree-template-integrand.ts) and the stochastic pieces.
// Compiled into the module of tree-multipole-kernel.ts.

import { add, expNegative2, mul, S, sub } from './simd-f64x2';

const T: i32 = 17;

/**
 * Templates [bin][multipole][17] into `out`. Inputs as `multipoles` in
 * tree-multipole-kernel.ts; constants C: the IR damping coefficients a and c,
 * sigma_v^2 / 2, 1/nbar. ACC: scratch of nm * 17 v128 (16-byte aligned).
 */
export function templates(
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
  const vaIR = S(load<f64>(C));
  const vcIR = S(load<f64>(C, 8));
  const halfSv2 = load<f64>(C, 16);
  const n1 = load<f64>(C, 24);
  const vhs = S(halfSv2);
  const fog = halfSv2 > 0;
  const half = S(0.5);
  const two = S(2);
  const vn1 = S(n1);
  const vn1n1 = S(<f64>phiCount * n1 * n1);
  const accBytes = <usize>(nm * T) << 4;
  for (let bin = 0; bin < binCount; bin++) {
    memory.fill(ACC, 0, accBytes);
    const iEnd = load<i32>(start + (<usize>(bin + 1) << 2));
    for (let i = load<i32>(start + (<usize>bin << 2)); i < iEnd; i++) {
      const o8 = <usize>i << 3;
      const k1 = load<f64>(K1 + o8);
      const k2 = load<f64>(K2 + o8);
      const vk1 = S(k1);
      const i1 = S(1 / k1);
      const i2 = S(1 / k2);
      const i3 = S(1 / load<f64>(K3 + o8));
      const va2 = S(k2 * load<f64>(C12 + o8));
      const vb2 = S(k2 * load<f64>(S12 + o8));
      const pk = PK + <usize>i * 72;
      const F12 = S(load<f64>(pk));
      const G12 = S(load<f64>(pk, 8));
      const T12 = S(load<f64>(pk, 16));
      const F23 = S(load<f64>(pk, 24));
      const G23 = S(load<f64>(pk, 32));
      const T23 = S(load<f64>(pk, 40));
      const F31 = S(load<f64>(pk, 48));
      const G31 = S(load<f64>(pk, 56));
      const T31 = S(load<f64>(pk, 64));
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
        const q1 = mul(m1, m1);
        const P1 = add(nw1, mul(w1, expNegative2(mul(mul(u1, u1), add(vaIR, mul(vcIR, q1))))));
        const A2 = mul(va2, m1);
        const sc = SC2 + <usize>(jj * phiCount) * 16;
        let t0 = S(0), t1 = S(0), t2 = S(0), t3 = S(0), t4 = S(0), t5 = S(0), t6 = S(0);
        let t7 = S(0), t8 = S(0), t9 = S(0), t10 = S(0), t11 = S(0), t12 = S(0), t13 = S(0);
        let sP = S(0), sQP = S(0);
        for (let p = 0; p < phiCount; p++) {
          // LOS components u_i = k_i mu_i of the three sides; u1 + u2 + u3 = 0.
          const u2 = sub(A2, mul(vb2, v128.load(sc + (<usize>p << 4))));
          const u3 = sub(f64x2.neg(u1), u2);
          const m2 = mul(u2, i2);
          const m3 = mul(u3, i3);
          const q2 = mul(m2, m2);
          const q3 = mul(m3, m3);
          const P2 = add(nw2, mul(w2, expNegative2(mul(mul(u2, u2), add(vaIR, mul(vcIR, q2))))));
          const P3 = add(nw3, mul(w3, expNegative2(mul(mul(u3, u3), add(vaIR, mul(vcIR, q3))))));
          let d2 = two;
          if (fog) d2 = mul(two, expNegative2(mul(vhs, add(add(mul(u1, u1), mul(u2, u2)), mul(u3, u3)))));
          // Per pair (a, b; c the third side): weights u0 = w, u1 = w (nu_a^2 + nu_b^2), u2 = w nu_a^2 nu_b^2
          // with w = 2 D P_a P_b, and the mu-dependent Z2 pieces zB (b1 f), zF (f: nu_c^2 G2), zF2 (f^2),
          // mu k = -u_c (addPairTemplates in src/bispectrum/tree-template-integrand.ts).
          // Pair 12 (c = 3).
          const hA = mul(half, f64x2.neg(u3));
          const wA = mul(mul(d2, P1), P2);
          const vA = add(q1, q2);
          const xA = mul(q1, q2);
          const a0 = wA;
          const a1 = mul(wA, vA);
          const a2 = mul(wA, xA);
          const zBA = mul(hA, add(mul(m1, i1), mul(m2, i2)));
          const zFA = mul(q3, G12);
          const zGA = mul(mul(hA, mul(m1, m2)), add(mul(m2, i1), mul(m1, i2)));
          // Pair 23 (c = 1).
          const hB = mul(half, f64x2.neg(u1));
          const wB = mul(mul(d2, P2), P3);
          const b0 = wB;
          const b1 = mul(wB, add(q2, q3));
          const b2 = mul(wB, mul(q2, q3));
          const zBB = mul(hB, add(mul(m2, i2), mul(m3, i3)));
          const zFB = mul(q1, G23);
          const zGB = mul(mul(hB, mul(m2, m3)), add(mul(m3, i2), mul(m2, i3)));
          // Pair 31 (c = 2).
          const hC = mul(half, f64x2.neg(u2));
          const wC = mul(mul(d2, P3), P1);
          const c0 = wC;
          const c1 = mul(wC, add(q3, q1));
          const c2 = mul(wC, mul(q3, q1));
          const zBC = mul(hC, add(mul(m3, i3), mul(m1, i1)));
          const zFC = mul(q2, G31);
          const zGC = mul(mul(hC, mul(m3, m1)), add(mul(m1, i3), mul(m3, i1)));
          t0 = add(t0, add(add(mul(a0, F12), mul(b0, F23)), mul(c0, F31)));
          t1 = add(t1, add(add(mul(a0, zBA), mul(b0, zBB)), mul(c0, zBC)));
          t2 = add(t2, add(add(add(mul(a0, zFA), mul(a1, F12)), add(mul(b0, zFB), mul(b1, F23))), add(mul(c0, zFC), mul(c1, F31))));
          t3 = add(t3, add(add(add(mul(a0, zGA), mul(a1, zBA)), add(mul(b0, zGB), mul(b1, zBB))), add(mul(c0, zGC), mul(c1, zBC))));
          t4 = add(t4, add(add(add(mul(a1, zFA), mul(a2, F12)), add(mul(b1, zFB), mul(b2, F23))), add(mul(c1, zFC), mul(c2, F31))));
          t5 = add(t5, add(add(add(mul(a1, zGA), mul(a2, zBA)), add(mul(b1, zGB), mul(b2, zBB))), add(mul(c1, zGC), mul(c2, zBC))));
          t6 = add(t6, add(add(mul(a2, zFA), mul(b2, zFB)), mul(c2, zFC)));
          t7 = add(t7, add(add(mul(a2, zGA), mul(b2, zGB)), mul(c2, zGC)));
          t8 = add(t8, add(add(a0, b0), c0));
          t9 = add(t9, add(add(a1, b1), c1));
          t10 = add(t10, add(add(a2, b2), c2));
          t11 = add(t11, add(add(mul(a0, T12), mul(b0, T23)), mul(c0, T31)));
          t12 = add(t12, add(add(mul(a1, T12), mul(b1, T23)), mul(c1, T31)));
          t13 = add(t13, add(add(mul(a2, T12), mul(b2, T23)), mul(c2, T31)));
          sP = add(sP, add(add(P1, P2), P3));
          sQP = add(sQP, add(add(mul(q1, P1), mul(q2, P2)), mul(q3, P3)));
        }
        // Legendre weights per lane times the node weight, into [multipole][17] v128 accumulators.
        const wm = WMU2 + <usize>(jj * nm) * 16;
        for (let m = 0; m < nm; m++) {
          const w = mul(wn, v128.load(wm + (<usize>m << 4)));
          const a = ACC + (<usize>(m * T) << 4);
          v128.store(a, add(v128.load(a), mul(w, t0)));
          v128.store(a, add(v128.load(a, 16), mul(w, t1)), 16);
          v128.store(a, add(v128.load(a, 32), mul(w, t2)), 32);
          v128.store(a, add(v128.load(a, 48), mul(w, t3)), 48);
          v128.store(a, add(v128.load(a, 64), mul(w, t4)), 64);
          v128.store(a, add(v128.load(a, 80), mul(w, t5)), 80);
          v128.store(a, add(v128.load(a, 96), mul(w, t6)), 96);
          v128.store(a, add(v128.load(a, 112), mul(w, t7)), 112);
          v128.store(a, add(v128.load(a, 128), mul(w, mul(half, t8))), 128);
          v128.store(a, add(v128.load(a, 144), mul(w, mul(half, t9))), 144);
          v128.store(a, add(v128.load(a, 160), mul(w, mul(half, t10))), 160);
          v128.store(a, add(v128.load(a, 176), mul(w, t11)), 176);
          v128.store(a, add(v128.load(a, 192), mul(w, t12)), 192);
          v128.store(a, add(v128.load(a, 208), mul(w, t13)), 208);
          v128.store(a, add(v128.load(a, 224), mul(w, mul(vn1, sP))), 224);
          v128.store(a, add(v128.load(a, 240), mul(w, mul(vn1, sQP))), 240);
          v128.store(a, add(v128.load(a, 256), mul(w, vn1n1)), 256);
        }
      }
    }
    for (let m = 0; m < nm; m++) {
      const a = ACC + (<usize>(m * T) << 4);
      const o = out + (<usize>((bin * nm + m) * T) << 3);
      for (let t = 0; t < T; t++) {
        const v = v128.load(a + (<usize>t << 4));
        store<f64>(o + (<usize>t << 3), f64x2.extract_lane(v, 0) + f64x2.extract_lane(v, 1));
      }
    }
  }
}
