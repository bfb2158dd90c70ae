// Shorthand for the f64x2 operations of the compiled loops, and exp(-x) for
// both lanes as src/numerics/fast-exp.ts: exp(-j/128) from its table (set by
// the host, 128 * 64 + 1 entries) times the Taylor series of exp(-d) to d^4,
// j = floor(128 x). The host guarantees 0 <= x < 64 in both lanes.

const STEPS: f64 = 128;
let table: usize = 0;
export function setExpTable(p: usize): void {
  table = p;
}

// @ts-ignore: decorator
@inline export function expNegative2(x: v128): v128 {
  const j = i32x4.trunc_sat_f64x2_s_zero(f64x2.mul(x, f64x2.splat(STEPS)));
  const d = f64x2.sub(x, f64x2.mul(f64x2.convert_low_i32x4_s(j), f64x2.splat(1 / STEPS)));
  const t = f64x2.replace_lane(
    f64x2.splat(load<f64>(table + (<usize>i32x4.extract_lane(j, 0) << 3))),
    1,
    load<f64>(table + (<usize>i32x4.extract_lane(j, 1) << 3)),
  );
  let p = f64x2.sub(f64x2.splat(1.0 / 6), f64x2.mul(d, f64x2.splat(1.0 / 24)));
  p = f64x2.sub(f64x2.splat(0.5), f64x2.mul(d, p));
  p = f64x2.sub(f64x2.splat(1), f64x2.mul(d, p));
  p = f64x2.sub(f64x2.splat(1), f64x2.mul(d, p));
  return f64x2.mul(t, p);
}

// @ts-ignore: decorator
@inline export function S(x: f64): v128 {
  return f64x2.splat(x);
}
// @ts-ignore: decorator
@inline export function add(a: v128, b: v128): v128 {
  return f64x2.add(a, b);
}
// @ts-ignore: decorator
@inline export function sub(a: v128, b: v128): v128 {
  return f64x2.sub(a, b);
}
// @ts-ignore: decorator
@inline export function mul(a: v128, b: v128): v128 {
  return f64x2.mul(a, b);
}
