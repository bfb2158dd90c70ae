import { LogLogSpline } from '../numerics/cubic-spline.js';
import { gaussLegendreOn } from '../numerics/gauss-legendre.js';

/**
 * Energy density of one species of massive neutrinos with a relativistic
 * Fermi–Dirac momentum distribution (Lesgourgues & Pastor 2006, Phys. Rep. 429,
 * 307, sec. 4), as multiples of its massless value, with y = m / T_nu:
 *   G(y) = F(y) / F(0),  F(y) = int_0^inf dx x^2 sqrt(x^2 + y^2) / (e^x + 1),  F(0) = 7 pi^4 / 120;
 * and its "clustering" part (rho - 3p) / rho_massless,
 *   C(y) = int_0^inf dx x^2 y^2 / sqrt(x^2 + y^2) / (e^x + 1) / F(0),
 * which is zero while relativistic and G(y) once non-relativistic.
 * Tabulated once in ln y over [1e-3, 1e4] (log-log cubic splines); the two-term
 * series at both ends take over outside (errors below 1e-11 there).
 */
const F0 = (7 * Math.PI ** 4) / 120;
/** int x^2/(e^x+1) = (3/2) zeta(3); int x/(e^x+1) = pi^2/12; int x^4/(e^x+1) = (45/2) zeta(5). */
const MOMENT_2 = 1.5 * 1.2020569031595942;
const MOMENT_1 = Math.PI ** 2 / 12;
const MOMENT_4 = 22.5 * 1.0369277551433699;
const Y_MIN = 1e-3;
const Y_MAX = 1e4;

let tables: { energy: LogLogSpline; clustering: LogLogSpline } | undefined;

function buildTables(): { energy: LogLogSpline; clustering: LogLogSpline } {
  const panels = [
    [0, 1],
    [1, 3],
    [3, 8],
    [8, 20],
    [20, 60],
  ].map(([a, b]) => gaussLegendreOn(48, a, b));
  const n = 400;
  const ys = new Float64Array(n);
  const g = new Float64Array(n);
  const c = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const y = Y_MIN * (Y_MAX / Y_MIN) ** (i / (n - 1));
    let e = 0;
    let cl = 0;
    for (const rule of panels) {
      for (let j = 0; j < rule.nodes.length; j++) {
        const x = rule.nodes[j];
        const root = Math.sqrt(x * x + y * y);
        const w = (rule.weights[j] * x * x) / (Math.exp(x) + 1);
        e += w * root;
        cl += (w * y * y) / root;
      }
    }
    ys[i] = y;
    g[i] = e / F0;
    c[i] = cl / F0;
  }
  return { energy: new LogLogSpline(ys, g), clustering: new LogLogSpline(ys, c) };
}

/** G(y): energy density over its massless value. */
export function thermalNeutrinoEnergy(y: number): number {
  if (y < Y_MIN) return 1 + (MOMENT_1 * y * y) / (2 * F0);
  if (y > Y_MAX) return (MOMENT_2 * y + MOMENT_4 / (2 * y)) / F0;
  tables ??= buildTables();
  return tables.energy.at(y);
}

/** C(y) = (rho - 3p) over the massless energy density. */
export function thermalNeutrinoClustering(y: number): number {
  if (y < Y_MIN) return (MOMENT_1 * y * y) / F0;
  if (y > Y_MAX) return (MOMENT_2 * y - MOMENT_4 / (2 * y)) / F0;
  tables ??= buildTables();
  return tables.clustering.at(y);
}

/** Non-relativistic slope: G(y) -> NONRELATIVISTIC_SLOPE * y as y -> infinity. */
export const NONRELATIVISTIC_SLOPE = MOMENT_2 / F0;
