/** A function to minimise. */
export type Objective = (x: Float64Array) => number;

export interface LocalSearchResult {
  readonly x: Float64Array;
  readonly value: number;
  readonly evaluations: number;
  /** True when the tolerances were met before the evaluation budget ran out. */
  readonly converged: boolean;
}

export interface NelderMeadOptions {
  /** Edge length of the starting simplex along each axis. */
  readonly step: Float64Array;
  /** Stop when every vertex is within xTolerance (1 + |x_i|) of the best ... Default 1e-10. */
  readonly xTolerance?: number;
  /** ... and every value within fTolerance (1 + |f_best|) of the best. Default 1e-12. */
  readonly fTolerance?: number;
  /** Default 1000 d^2. */
  readonly maxEvaluations?: number;
}

/**
 * Nelder–Mead downhill simplex (Nelder & Mead 1965, Computer Journal 7, 308)
 * with the dimension-dependent coefficients of Gao & Han 2012 (Comput. Optim.
 * Appl. 51, 259): reflection 1, expansion 1 + 2/d, contraction 3/4 - 1/(2d),
 * shrink 1 - 1/d. Points where f is NaN count as +Infinity.
 */
export function nelderMead(f: Objective, start: Float64Array, options: NelderMeadOptions): LocalSearchResult {
  const d = start.length;
  const xTol = options.xTolerance ?? 1e-10;
  const fTol = options.fTolerance ?? 1e-12;
  const maxEvaluations = options.maxEvaluations ?? 1000 * d * d;
  const expand = 1 + 2 / d;
  const contract = 0.75 - 1 / (2 * d);
  const shrink = 1 - 1 / d;
  let evaluations = 0;
  const value = (x: Float64Array) => {
    evaluations++;
    const v = f(x);
    return Number.isNaN(v) ? Infinity : v;
  };
  const vertices = Array.from({ length: d + 1 }, (_, i) => {
    const v = start.slice();
    if (i > 0) v[i - 1] += options.step[i - 1];
    return v;
  });
  const values = vertices.map(value);
  const centroid = new Float64Array(d);
  const along = (t: number) => {
    const worst = vertices[d];
    const p = new Float64Array(d);
    for (let k = 0; k < d; k++) p[k] = centroid[k] + t * (worst[k] - centroid[k]);
    return p;
  };
  let converged = false;
  while (evaluations < maxEvaluations) {
    const order = values.map((_, i) => i).sort((a, b) => values[a] - values[b]);
    const sortedV = order.map((i) => vertices[i]);
    const sortedF = order.map((i) => values[i]);
    for (let i = 0; i <= d; i++) {
      vertices[i] = sortedV[i];
      values[i] = sortedF[i];
    }
    const best = vertices[0];
    let spread = 0;
    for (let i = 1; i <= d; i++) for (let k = 0; k < d; k++) spread = Math.max(spread, Math.abs(vertices[i][k] - best[k]) / (1 + Math.abs(best[k])));
    if (spread <= xTol && values[d] - values[0] <= fTol * (1 + Math.abs(values[0]))) {
      converged = true;
      break;
    }
    centroid.fill(0);
    for (let i = 0; i < d; i++) for (let k = 0; k < d; k++) centroid[k] += vertices[i][k] / d;
    const reflected = along(-1);
    const fr = value(reflected);
    if (fr < values[0]) {
      const expanded = along(-expand);
      const fe = value(expanded);
      [vertices[d], values[d]] = fe < fr ? [expanded, fe] : [reflected, fr];
    } else if (fr < values[d - 1]) {
      [vertices[d], values[d]] = [reflected, fr];
    } else {
      const outside = fr < values[d];
      const contracted = along(outside ? -contract : contract);
      const fc = value(contracted);
      if (fc < (outside ? fr : values[d])) {
        [vertices[d], values[d]] = [contracted, fc];
      } else {
        for (let i = 1; i <= d; i++) {
          for (let k = 0; k < d; k++) vertices[i][k] = best[k] + shrink * (vertices[i][k] - best[k]);
          values[i] = value(vertices[i]);
        }
      }
    }
  }
  let b = 0;
  for (let i = 1; i <= d; i++) if (values[i] < values[b]) b = i;
  return { x: vertices[b], value: values[b], evaluations, converged };
}
