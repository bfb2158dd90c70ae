/**
 * Everything the HTML report shows, filled by the fit workflow. Labels use
 * the rich-text markup of the plots ("b_1", "σ_8", "k_{max}"); every string
 * is escaped when written.
 */
export interface ReportInput {
  title: string;
  /** A line under the title, e.g. the run name and config file (no clock time, to keep reports reproducible). */
  subtitle?: string;
  /** Printed assumptions: model order, scale cuts, covariance source, sampler settings, ... in the order given. */
  assumptions: readonly ReportAssumption[];
  parameters: readonly ReportParameterRow[];
  /** One row per data combination (e.g. P_ℓ, B_0, joint). */
  fitQuality: readonly ReportFitQuality[];
  figures: readonly ReportFigure[];
  /** Free-text remarks printed at the end, one paragraph each. */
  notes?: readonly string[];
}

export interface ReportAssumption {
  key: string;
  value: string;
}

/** Posterior summary of one sampled parameter. */
export interface ReportParameterRow {
  /** Rich-text label, e.g. "b_{G2}". */
  label: string;
  mean: number;
  sd: number;
  /** Equal-tailed (or highest-density, as the workflow states in the assumptions) 68% and 95% intervals. */
  interval68: readonly [number, number];
  interval95: readonly [number, number];
  bestFit?: number;
  truth?: number;
  /** Rank-normalised split R-hat. */
  rHat?: number;
  /** Effective sample size (bulk). */
  ess?: number;
}

export interface ReportFitQuality {
  label: string;
  chiSquare: number;
  dof: number;
  pValue: number;
}

/** A plot as returned by one of the render...Svg functions, with its caption. */
export interface ReportFigure {
  title: string;
  caption: string;
  svg: string;
}
