/**
 * The contract shared by the power-spectrum multipole model (src/power) and the
 * bispectrum model (src/bispectrum), so that the likelihood, the optimiser, the
 * scale-cut scan and the Fisher code treat both statistics alike.
 *
 * A StatisticModel is built for one linear spectrum and one binning; building
 * it pays for everything that does not depend on the sampled parameters.
 * Evaluating it for new nuisance parameters is then cheap.
 *
 * Parameter names (camelCase, see docs/conventions.md):
 *   b1, b2, bG2, f, alphaPar, alphaPerp   — bias, growth rate, AP dilations
 *   model-specific amplitudes (counterterms, stochastic terms, damping) are
 *   listed by `parameterNames`.
 */
export type ParameterValues = Readonly<Record<string, number>>;

/** model(theta) = offset + sum_j theta_j * columns[j] for the named linear parameters. */
export interface LinearDecomposition {
  readonly names: readonly string[];
  readonly offset: Float64Array;
  readonly columns: readonly Float64Array[];
}

export interface DataVectorEntry {
  /** Which statistic and multipole, for example "P0", "P2", "B0". */
  readonly block: string;
  /** Wavenumbers of the entry: one for P, three (k1 >= k2 >= k3) for B. */
  readonly k: readonly number[];
}

export interface StatisticModel {
  /** Entries in data-vector order. */
  readonly entries: readonly DataVectorEntry[];
  /** Every parameter the model reads, with its default value. */
  readonly parameterNames: readonly string[];
  readonly defaults: ParameterValues;
  /** Names of the parameters the model is exactly linear in (for analytic marginalisation). */
  readonly linearParameterNames: readonly string[];
  /** Model vector for the given parameters (missing ones take defaults). */
  evaluate(params: ParameterValues, out?: Float64Array): Float64Array;
  /**
   * Decomposition of the model into a part independent of `linear` and one
   * column per name in `linear` (each must be in linearParameterNames), at the
   * other parameters' values in `params`.
   */
  linearPart(params: ParameterValues, linear: readonly string[]): LinearDecomposition;
}
