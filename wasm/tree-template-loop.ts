// The averaged-template loops of TreeMultipoleEvaluator
// (src/bispectrum/tree-multipole-evaluator.ts, method undistortedTemplates)
// and of distortedTemplates (src/bispectrum/tree-multipole-distorted.ts, AP
// distortion) in f64x2 lanes of two mu nodes: per orientation point the three
// side powers, the fingers-of-god factor, the monomial split of 2 Z1 Z1 Z2 P P
// of each pair (addPairTemplates in src/bispectrum/tree-template-integrand.ts)
// and the stochastic pieces. Compiled into the module of tree-multipole-kernel.ts.

import { add, expNegative2, mul, S, sub } from './simd-f64x2';

const T: i32 = 17;

// The P_nw and P_w splines of the AP case (SharedGridSplines in
// src/numerics/cubic-spline.ts): grid X, records [y1, y1'', y2, y2''] at R.
let X: usize = 0;
let R: usize = 0;
let x0: f64 = 0;
let invStep: f64 = 0;
let h6: f64 = 0;
let last: i32 = 0;

/** P_nw(q) + c P_w(q), as SharedGridSplines.sum. */
// @ts-ignore: decorator
@inline function spline(q: f64, c: f64): f64 {
  let i = <i32>Math.floor((q - x0) * invStep);
  if (i < 0) i = 0;
  else if (i > last) i = last;
  const a = (load<f64>(X + ((<usize>i + 1) << 3)) - q) * invStep;
  const b = 1 - a;
  const ca = (a * a * a - a) * h6;
  const cb = (b * b * b - b) * h6;
  const r = R + (<usize>i << 5);
  return (
    a * load<f64>(r) + b * load<f64>(r, 32) + ca * load<f64>(r, 8) + cb * load<f64>(r, 40) +
    c * (a * load<f64>(r, 16) + b * load<f64>(r, 48) + ca * load<f64>(r, 24) + cb * load<f64>(r, 56))
  );
}

/** Both lanes of the spline at true lengths q with wiggle factors c. */
// @ts-ignore: decorator
@inline function spline2(q: v128, c: v128): v128 {
  return f64x2.replace_lane(
    f64x2.splat(spline(f64x2.extract_lane(q, 0), f64x2.extract_lane(c, 0))),
    1,
    spline(f64x2.extract_lane(q, 1), f64x2.extract_lane(c, 1)),
  );
}

/** F2 from the cosine and ka/kb + kb/ka (kernels.ts, kernelF2FromRatios). */
// @ts-ignore: decorator
@inline function F2(c: v128, r: v128): v128 {
  return add(add(S(5.0 / 7), mul(mul(S(0.5), c), r)), mul(mul(S(2.0 / 7), c), c));
}
/** G2 likewise (kernelG2FromRatios). */
// @ts-ignore: decorator
@inline function G2(c: v128, r: v128): v128 {
  return add(add(S(3.0 / 7), mul(mul(S(0.5), c), r)), mul(mul(S(4.0 / 7), c), c));
}

/**
 * Templates [bin][multipole][17] into `out`. Inputs as `multipoles` in
 * tree-multipole-kernel.ts. Constants C: the damping coefficients a and c,
 * sigma_v^2 / 2, 1/nbar, the AP switch (0 or 1), then for AP: alpha_par,
 * 1/alpha_par^2, 1/alpha_perp^2, the amplitude 1/(alpha_par alpha_perp^2)^2,
 * Sigma^2, and the spline's x0, 1/step, step^2/6, last interval. Without AP
 * the side powers come from NW and WG per node and the damping is the
 * mu-dependent part exp(-u^2 (a + c mu^2)); with AP the true lengths and
 * cosines change per point and P = spline(q, exp(-q^2 Sigma^2 - t^2 (a + c nu^2)))
 * with t = q nu (grid GX, records GR). ACC: scratch of nm * 17 v128.
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
  GX: usize,
  GR: usize,
  ACC: usize,
  out: usize,
): void {
  const vaIR = S(load<f64>(C));
  const vcIR = S(load<f64>(C, 8));
  const halfSv2 = load<f64>(C, 16);
  const n1 = load<f64>(C, 24);
  const ap = load<f64>(C, 32) != 0;
  const apar = S(load<f64>(C, 40));
  const ip2 = S(load<f64>(C, 48));
  const iq2 = S(load<f64>(C, 56));
  const amp = load<f64>(C, 64);
  const vsig2 = S(load<f64>(C, 72));
  X = GX;
  R = GR;
  x0 = load<f64>(C, 80);
  invStep = load<f64>(C, 88);
  h6 = load<f64>(C, 96);
  last = <i32>load<f64>(C, 104);
  const vhs = S(halfSv2);
  const fog = halfSv2 > 0;
  const half = S(0.5);
  const two = S(2);
  const one = S(1);
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
      const k3 = load<f64>(K3 + o8);
      const vk1 = S(k1);
      const kk1 = S(k1 * k1);
      const kk2 = S(k2 * k2);
      const kk3 = S(k3 * k3);
      const i1 = S(1 / k1);
      const i2 = S(1 / k2);
      const i3 = S(1 / k3);
      const va2 = S(k2 * load<f64>(C12 + o8));
      const vb2 = S(k2 * load<f64>(S12 + o8));
      // Without AP: the pair kernels and side powers of the node.
      const pk = PK + <usize>i * 72;
      let F12 = S(load<f64>(pk));
      let G12 = S(load<f64>(pk, 8));
      let T12 = S(load<f64>(pk, 16));
      let F23 = S(load<f64>(pk, 24));
      let G23 = S(load<f64>(pk, 32));
      let T23 = S(load<f64>(pk, 40));
      let F31 = S(load<f64>(pk, 48));
      let G31 = S(load<f64>(pk, 56));
      let T31 = S(load<f64>(pk, 64));
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
      const wn = S(amp * load<f64>(W + o8));
      for (let jj = 0; jj < muPairs; jj++) {
        const mu = v128.load(MU2 + (<usize>jj << 4));
        const u1 = mul(vk1, mu);
        // Side 1: line-of-sight component t1, inverse length r1, cosine m1, P1 (true quantities with AP).
        let t1 = u1;
        let r1 = i1;
        let m1 = mu;
        let Q1 = kk1;
        let P1: v128;
        if (ap) {
          t1 = f64x2.div(u1, apar);
          Q1 = add(mul(mul(u1, u1), ip2), mul(sub(kk1, mul(u1, u1)), iq2));
          const q = f64x2.sqrt(Q1);
          r1 = f64x2.div(one, q);
          m1 = mul(t1, r1);
          P1 = spline2(q, expNegative2(add(mul(Q1, vsig2), mul(mul(t1, t1), add(vaIR, mul(vcIR, mul(m1, m1)))))));
        } else {
          P1 = add(nw1, mul(w1, expNegative2(mul(mul(u1, u1), add(vaIR, mul(vcIR, mul(m1, m1)))))));
        }
        const q1 = mul(m1, m1);
        const A2 = mul(va2, mu);
        const sc = SC2 + <usize>(jj * phiCount) * 16;
        let t0 = S(0), tA = S(0), tB = S(0), tC = S(0), tD = S(0), tE = S(0), tF = S(0);
        let tG = S(0), tH = S(0), tI = S(0), tJ = S(0), tK = S(0), tL = S(0), tM = S(0);
        let sP = S(0), sQP = S(0);
        for (let p = 0; p < phiCount; p++) {
          // Observed LOS components u_i = k_i mu_i of the three sides; u1 + u2 + u3 = 0.
          const u2 = sub(A2, mul(vb2, v128.load(sc + (<usize>p << 4))));
          const u3 = sub(f64x2.neg(u1), u2);
          let t2 = u2;
          let t3 = u3;
          let r2 = i2;
          let r3 = i3;
          let m2: v128;
          let m3: v128;
          let P2: v128;
          let P3: v128;
          if (ap) {
            t2 = f64x2.div(u2, apar);
            t3 = sub(f64x2.neg(t1), t2);
            const Q2 = add(mul(mul(u2, u2), ip2), mul(sub(kk2, mul(u2, u2)), iq2));
            const Q3 = add(mul(mul(u3, u3), ip2), mul(sub(kk3, mul(u3, u3)), iq2));
            const qb = f64x2.sqrt(Q2);
            const qc = f64x2.sqrt(Q3);
            r2 = f64x2.div(one, qb);
            r3 = f64x2.div(one, qc);
            m2 = mul(t2, r2);
            m3 = mul(t3, r3);
            P2 = spline2(qb, expNegative2(add(mul(Q2, vsig2), mul(mul(t2, t2), add(vaIR, mul(vcIR, mul(m2, m2)))))));
            P3 = spline2(qc, expNegative2(add(mul(Q3, vsig2), mul(mul(t3, t3), add(vaIR, mul(vcIR, mul(m3, m3)))))));
            // True cosines between the sides of each pair and ka/kb + kb/ka (closed triangle).
            const j12 = mul(r1, r2);
            const j23 = mul(r2, r3);
            const j31 = mul(r3, r1);
            const c12 = mul(mul(half, sub(sub(Q3, Q1), Q2)), j12);
            const c23 = mul(mul(half, sub(sub(Q1, Q2), Q3)), j23);
            const c31 = mul(mul(half, sub(sub(Q2, Q3), Q1)), j31);
            const x12 = mul(add(Q1, Q2), j12);
            const x23 = mul(add(Q2, Q3), j23);
            const x31 = mul(add(Q3, Q1), j31);
            F12 = F2(c12, x12);
            G12 = G2(c12, x12);
            T12 = sub(mul(c12, c12), one);
            F23 = F2(c23, x23);
            G23 = G2(c23, x23);
            T23 = sub(mul(c23, c23), one);
            F31 = F2(c31, x31);
            G31 = G2(c31, x31);
            T31 = sub(mul(c31, c31), one);
          } else {
            m2 = mul(u2, i2);
            m3 = mul(u3, i3);
            P2 = add(nw2, mul(w2, expNegative2(mul(mul(u2, u2), add(vaIR, mul(vcIR, mul(m2, m2)))))));
            P3 = add(nw3, mul(w3, expNegative2(mul(mul(u3, u3), add(vaIR, mul(vcIR, mul(m3, m3)))))));
          }
          const q2 = mul(m2, m2);
          const q3 = mul(m3, m3);
          let d2 = two;
          if (fog) d2 = mul(two, expNegative2(mul(vhs, add(add(mul(t1, t1), mul(t2, t2)), mul(t3, t3)))));
          // Per pair (a, b; c the third side): weights u0 = w, u1 = w (nu_a^2 + nu_b^2), u2 = w nu_a^2 nu_b^2
          // with w = 2 D P_a P_b, and the mu-dependent Z2 pieces zB (b1 f), zF (f: nu_c^2 G2), zF2 (f^2),
          // mu k = -t_c (addPairTemplates in src/bispectrum/tree-template-integrand.ts).
          // Pair 12 (c = 3).
          const hA = mul(half, f64x2.neg(t3));
          const wA = mul(mul(d2, P1), P2);
          const a0 = wA;
          const a1 = mul(wA, add(q1, q2));
          const a2 = mul(wA, mul(q1, q2));
          const zBA = mul(hA, add(mul(m1, r1), mul(m2, r2)));
          const zFA = mul(q3, G12);
          const zGA = mul(mul(hA, mul(m1, m2)), add(mul(m2, r1), mul(m1, r2)));
          // Pair 23 (c = 1).
          const hB = mul(half, f64x2.neg(t1));
          const wB = mul(mul(d2, P2), P3);
          const b0 = wB;
          const b1 = mul(wB, add(q2, q3));
          const b2 = mul(wB, mul(q2, q3));
          const zBB = mul(hB, add(mul(m2, r2), mul(m3, r3)));
          const zFB = mul(q1, G23);
          const zGB = mul(mul(hB, mul(m2, m3)), add(mul(m3, r2), mul(m2, r3)));
          // Pair 31 (c = 2).
          const hC = mul(half, f64x2.neg(t2));
          const wC = mul(mul(d2, P3), P1);
          const c0 = wC;
          const c1 = mul(wC, add(q3, q1));
          const c2 = mul(wC, mul(q3, q1));
          const zBC = mul(hC, add(mul(m3, r3), mul(m1, r1)));
          const zFC = mul(q2, G31);
          const zGC = mul(mul(hC, mul(m3, m1)), add(mul(m1, r3), mul(m3, r1)));
          t0 = add(t0, add(add(mul(a0, F12), mul(b0, F23)), mul(c0, F31)));
          tA = add(tA, add(add(mul(a0, zBA), mul(b0, zBB)), mul(c0, zBC)));
          tB = add(tB, add(add(add(mul(a0, zFA), mul(a1, F12)), add(mul(b0, zFB), mul(b1, F23))), add(mul(c0, zFC), mul(c1, F31))));
          tC = add(tC, add(add(add(mul(a0, zGA), mul(a1, zBA)), add(mul(b0, zGB), mul(b1, zBB))), add(mul(c0, zGC), mul(c1, zBC))));
          tD = add(tD, add(add(add(mul(a1, zFA), mul(a2, F12)), add(mul(b1, zFB), mul(b2, F23))), add(mul(c1, zFC), mul(c2, F31))));
          tE = add(tE, add(add(add(mul(a1, zGA), mul(a2, zBA)), add(mul(b1, zGB), mul(b2, zBB))), add(mul(c1, zGC), mul(c2, zBC))));
          tF = add(tF, add(add(mul(a2, zFA), mul(b2, zFB)), mul(c2, zFC)));
          tG = add(tG, add(add(mul(a2, zGA), mul(b2, zGB)), mul(c2, zGC)));
          tH = add(tH, add(add(a0, b0), c0));
          tI = add(tI, add(add(a1, b1), c1));
          tJ = add(tJ, add(add(a2, b2), c2));
          tK = add(tK, add(add(mul(a0, T12), mul(b0, T23)), mul(c0, T31)));
          tL = add(tL, add(add(mul(a1, T12), mul(b1, T23)), mul(c1, T31)));
          tM = add(tM, add(add(mul(a2, T12), mul(b2, T23)), mul(c2, T31)));
          sP = add(sP, add(add(P1, P2), P3));
          sQP = add(sQP, add(add(mul(q1, P1), mul(q2, P2)), mul(q3, P3)));
        }
        // Legendre weights per lane times the node weight, into [multipole][17] v128 accumulators.
        const wm = WMU2 + <usize>(jj * nm) * 16;
        for (let m = 0; m < nm; m++) {
          const w = mul(wn, v128.load(wm + (<usize>m << 4)));
          const a = ACC + (<usize>(m * T) << 4);
          v128.store(a, add(v128.load(a), mul(w, t0)));
          v128.store(a, add(v128.load(a, 16), mul(w, tA)), 16);
          v128.store(a, add(v128.load(a, 32), mul(w, tB)), 32);
          v128.store(a, add(v128.load(a, 48), mul(w, tC)), 48);
          v128.store(a, add(v128.load(a, 64), mul(w, tD)), 64);
          v128.store(a, add(v128.load(a, 80), mul(w, tE)), 80);
          v128.store(a, add(v128.load(a, 96), mul(w, tF)), 96);
          v128.store(a, add(v128.load(a, 112), mul(w, tG)), 112);
          v128.store(a, add(v128.load(a, 128), mul(w, mul(half, tH))), 128);
          v128.store(a, add(v128.load(a, 144), mul(w, mul(half, tI))), 144);
          v128.store(a, add(v128.load(a, 160), mul(w, mul(half, tJ))), 160);
          v128.store(a, add(v128.load(a, 176), mul(w, tK)), 176);
          v128.store(a, add(v128.load(a, 192), mul(w, tL)), 192);
          v128.store(a, add(v128.load(a, 208), mul(w, tM)), 208);
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
