/**
 * Invented, seeded inputs for the plot and report tests that only need
 * something plausible to draw (browser rendering, determinism, input checks).
 * Geometry checks compute their expectations independently and do not rely
 * on these shapes.
 */
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';
import { poolDraws } from '../../src/inference/diagnostics/pool-draws.js';
import { Random } from '../../src/numerics/random.js';
import type { BispectrumPlotInput } from '../../src/report/plots/bispectrum-plot.js';
import type { CornerPlotInput } from '../../src/report/plots/corner-plot.js';
import type { FisherEllipsePlotInput } from '../../src/report/plots/fisher-ellipse-plot.js';
import type { LinePlotInput } from '../../src/report/plots/line-plot.js';
import type { MultipolePlotInput } from '../../src/report/plots/multipole-plot.js';
import type { TracePlotInput } from '../../src/report/plots/trace-plot.js';
import type { TriangleShapeMapInput } from '../../src/report/plots/triangle-shape-map.js';

export const SYNTHETIC_PARAMETERS = [
  { label: 'b_1', truth: 2.0, mean: 2.02, sd: 0.05 },
  { label: 'b_2', truth: 0.4, mean: 0.35, sd: 0.3 },
  { label: 'b_{G2}', truth: -0.2, mean: -0.18, sd: 0.12 },
  { label: 'σ_8', truth: 0.8, mean: 0.79, sd: 0.02 },
] as const;

/** Chains of an AR(1) process around correlated Gaussian targets: chains[parameter][chain][step]. */
export function syntheticChains(chains: number, steps: number, seed: number): Float64Array[][] {
  const r = new Random(seed);
  const np = SYNTHETIC_PARAMETERS.length;
  const out = SYNTHETIC_PARAMETERS.map(() => Array.from({ length: chains }, () => new Float64Array(steps)));
  for (let c = 0; c < chains; c++) {
    const z = new Float64Array(np).map(() => 3 * r.normal());
    for (let s = 0; s < steps; s++) {
      for (let p = 0; p < np; p++) z[p] = 0.9 * z[p] + Math.sqrt(1 - 0.81) * r.normal();
      // b1 and sigma8 anti-correlated, b2 and bG2 correlated.
      const u = [z[0], z[1], 0.6 * z[1] + 0.8 * z[2], -0.8 * z[0] + 0.6 * z[3]];
      SYNTHETIC_PARAMETERS.forEach((par, p) => (out[p][c][s] = par.mean + par.sd * u[p]));
    }
  }
  return out;
}

export function syntheticCornerInput(chains: Float64Array[][], burnIn: number): CornerPlotInput {
  return {
    parameters: SYNTHETIC_PARAMETERS.map((p) => ({ label: p.label, truth: p.truth })),
    sets: [{ label: 'P + B', samples: chains.map((c) => poolDraws(c.map((x) => x.subarray(burnIn)))) }],
  };
}

export function syntheticTraceInput(chains: Float64Array[][], burnIn: number): TracePlotInput {
  return { parameters: SYNTHETIC_PARAMETERS.map((p, i) => ({ label: p.label, chains: chains[i], truth: p.truth })), burnIn };
}

const powerShape = (k: number): number => 2.5e4 / (1 + (k / 0.06) ** 1.6);

export function syntheticMultipoleInput(seed: number): MultipolePlotInput {
  const r = new Random(seed);
  const k = Float64Array.from({ length: 20 }, (_, i) => 0.01 + 0.01 * i);
  const multipoles = [0, 2, 4].map((ell, n) => {
    const amplitude = [1, 0.55, 0.08][n];
    const model = k.map((q) => amplitude * powerShape(q));
    const sigma = k.map((q) => 0.02 * powerShape(q) + 60);
    const data = model.map((m, i) => m + sigma[i] * r.normal());
    return { ell, k, data, sigma, model };
  });
  return { multipoles };
}

export interface SyntheticBispectrum {
  k1: Float64Array;
  k2: Float64Array;
  k3: Float64Array;
  shapeClass: string[];
  b0: BispectrumPlotInput;
  b2: BispectrumPlotInput;
}

function shapeOf(a: number, b: number, c: number, dk: number): string {
  const eq = (x: number, y: number): boolean => Math.abs(x - y) < 1e-9;
  if (eq(a, b) && eq(b, c)) return 'equilateral';
  if (c <= a / 3) return 'squeezed';
  if (a - b - c > -0.5 * dk) return 'flattened';
  if (eq(a, b) || eq(b, c)) return 'isosceles';
  return 'general';
}

export function syntheticBispectrum(seed: number): SyntheticBispectrum {
  const r = new Random(seed);
  const bins = enumerateTriangleBins(shellGrid(0.02, 0.14, 0.02));
  const n = bins.size;
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  const shapeClass: string[] = [];
  for (let t = 0; t < n; t++) {
    [k1[t], k2[t], k3[t]] = [bins.centres[3 * t], bins.centres[3 * t + 1], bins.centres[3 * t + 2]];
    shapeClass.push(shapeOf(k1[t], k2[t], k3[t], 0.02));
  }
  const make = (ell: number, amplitude: number): BispectrumPlotInput => {
    const model = Float64Array.from({ length: n }, (_, t) => {
      const [p1, p2, p3] = [powerShape(k1[t]), powerShape(k2[t]), powerShape(k3[t])];
      return amplitude * 1.8 * (p1 * p2 + p2 * p3 + p3 * p1);
    });
    const sigma = model.map((m) => 0.12 * m);
    const data = model.map((m, t) => m + sigma[t] * r.normal());
    return { ell, data, sigma, model, shapeClass };
  };
  return { k1, k2, k3, shapeClass, b0: make(0, 1), b2: make(2, 0.3) };
}

export function syntheticShapeMapInput(b: SyntheticBispectrum): TriangleShapeMapInput {
  const value = Float64Array.from(b.b0.model, (m, t) => (b.b0.data[t] - m) / b.b0.sigma[t]);
  return { k1: b.k1, k2: b.k2, k3: b.k3, value };
}

export function syntheticShiftInput(): LinePlotInput {
  const kMax = [0.08, 0.1, 0.12, 0.14, 0.16, 0.18, 0.2];
  const series = ['b_1', 'σ_8'].map((label, n) => {
    const y = kMax.map((k) => (n === 0 ? 1 : -1) * 6 * Math.max(0, k - 0.13) ** 1.5 * 30);
    return { label, x: kMax, y, lower: y.map((v, i) => v - 1 + 0.03 * i), upper: y.map((v, i) => v + 1 - 0.03 * i) };
  });
  return { series, xLabel: 'k_{max}  [h/Mpc]', yLabel: 'shift / σ', referenceY: [0] };
}

export function syntheticFisherInput(): FisherEllipsePlotInput {
  return {
    xLabel: 'b_1',
    yLabel: 'M_ν  [eV]',
    fiducial: [2, 0.06],
    forecasts: [
      { label: 'P_0 + P_2', covariance: [[0.0016, -0.0009], [-0.0009, 0.0025]] },
      { label: 'P + B_0', covariance: [[0.0004, -0.0001], [-0.0001, 0.0009]] },
    ],
  };
}
