import { InputError } from '../../contracts/input-error.js';
import type { ParameterValues, StatisticModel } from '../../contracts/statistic-model.js';
import { checkCovarianceShape } from '../../data/covariance/check-covariance.js';
import type { PreparedCovariance } from '../../data/covariance/covariance-choice.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { selectVector, type DataSelection } from '../../data/scale-cuts.js';
import { ParameterSpace } from '../parameters/parameter-space.js';
import { BlockCholesky } from './block-cholesky.js';
import { chiSquarePValue } from './chi-square-tail.js';
import { CompositeModel } from './composite-model.js';
import { marginaliseGaussian, marginaliseSellentinHeavens, sellentinHeavensLogLikelihood, type LinearPrior, type MarginalResult } from './linear-marginalisation.js';
import type { ModelSource } from './model-source.js';

/**
 * The joint P + B likelihood of one measurement bundle: data, model and
 * covariance cut alike, the covariance factorised once (Cholesky, by
 * independent blocks), parameters entering linearly marginalised analytically.
 * Gaussian:        ln L = -(chi2 + ln det(C/h) + n ln 2 pi)/2 (h the Hartlap factor);
 * t-distribution:  Sellentin & Heavens 2016 with the raw sample covariance.
 */
export interface LikelihoodPoint {
  readonly logLikelihood: number;
  readonly logPrior: number;
  readonly logPosterior: number;
  /** Data chi-square at this point (marginalised parameters at their best fit). */
  readonly chi2: number;
  /** Data points minus sampled minus marginalised parameters. */
  readonly dof: number;
  readonly pValue: number;
  /** Named values: fixed, sampled, derived, provided by the model source. */
  readonly values: Readonly<Record<string, number>>;
  /** Best-fit values of the marginalised parameters (when asked for). */
  readonly marginalised: Readonly<Record<string, number>> | undefined;
}

export interface JointLikelihoodParts {
  readonly bundle: MeasurementBundle;
  readonly selection: DataSelection;
  readonly covariance: PreparedCovariance;
  readonly parameters: ParameterSpace;
  readonly models: ModelSource;
}

export class JointLikelihood {
  readonly parameters: ParameterSpace;
  readonly selection: DataSelection;
  readonly covariance: PreparedCovariance;
  readonly source: ModelSource;
  readonly factor: BlockCholesky;
  private readonly bundle: MeasurementBundle;
  private readonly whitenedData: Float64Array;
  private readonly linearNames: readonly string[];
  private readonly linearPriors: readonly LinearPrior[];
  private composite: { models: readonly StatisticModel[]; model: CompositeModel } | undefined;
  private readonly scratch: Float64Array;

  constructor(parts: JointLikelihoodParts) {
    this.bundle = parts.bundle;
    this.parameters = parts.parameters;
    this.selection = parts.selection;
    this.covariance = parts.covariance;
    this.source = parts.models;
    const label = `covariance (${parts.covariance.description.source})`;
    checkCovarianceShape(parts.covariance.matrix, parts.covariance.size, parts.selection.indices.length, label);
    this.factor = new BlockCholesky(parts.covariance.matrix, parts.covariance.size, label);
    this.whitenedData = this.factor.whiten(selectVector(parts.bundle.dataVector.values, parts.selection.indices));
    this.linearNames = parts.parameters.marginalised.map((m) => m.name);
    this.linearPriors = parts.parameters.marginalised;
    this.scratch = new Float64Array(parts.covariance.size);
    const declared = new Set([...parts.parameters.free, ...Object.keys(parts.parameters.fixed), ...parts.parameters.derived.map((d) => d.name)]);
    const missing = parts.models.requiredNames.filter((n) => !declared.has(n));
    if (missing.length) throw new InputError(`parameters: the ${parts.models.mode} cosmology mode needs ${missing.join(', ')} declared (free, fixed or derived)`, { where: 'parameters' });
    if (parts.covariance.form.kind === 't-distribution') {
      const gaussian = this.linearPriors.filter((p) => p.sigma !== Infinity);
      if (gaussian.length) throw new InputError('parameters: with the t-distribution likelihood, analytically marginalised parameters must have flat priors', { where: 'parameters' });
    }
  }

  /** Number of kept data points. */
  get size(): number {
    return this.covariance.size;
  }

  get dof(): number {
    return this.size - this.parameters.dimension - this.linearNames.length;
  }

  private compositeFor(models: readonly StatisticModel[]): CompositeModel {
    if (this.composite?.models !== models) {
      const model = new CompositeModel(models, this.bundle.dataVector.entries, { P: this.bundle.power?.dk, B: this.bundle.bispectrum?.dk });
      model.checkLinear(this.linearNames);
      this.composite = { models, model };
    }
    return this.composite.model;
  }

  /** Residual r = L^{-1}(d - m) of a full-length model vector, and the whitened cut of a column. */
  private whitenedCut(v: Float64Array, out: Float64Array = new Float64Array(this.size)): Float64Array {
    const idx = this.selection.indices;
    for (let a = 0; a < idx.length; a++) this.scratch[a] = v[idx[a]];
    return this.factor.whiten(this.scratch, out);
  }

  private core(values: ParameterValues): { result: MarginalResult; provided: Readonly<Record<string, number>> } {
    const prepared = this.source.prepare(values);
    const model = this.compositeFor(prepared.models);
    const form = this.covariance.form;
    const h = form.kind === 'gaussian' ? form.precisionFactor : 1;
    const d = this.whitenedData;
    let result: MarginalResult;
    if (this.linearNames.length === 0) {
      const m = this.whitenedCut(model.evaluate(prepared.modelValues));
      let chi2 = 0;
      for (let i = 0; i < m.length; i++) chi2 += (d[i] - m[i]) ** 2;
      chi2 *= h;
      const n = this.size;
      const logLikelihood =
        form.kind === 'gaussian' ? -0.5 * (chi2 + this.factor.logDet - n * Math.log(h) + n * Math.log(2 * Math.PI)) : sellentinHeavensLogLikelihood(chi2, this.factor.logDet, n, form.realisations);
      result = { logLikelihood, chi2, bestFit: new Float64Array(0) };
    } else {
      const part = model.linearPart(prepared.modelValues, this.linearNames);
      const r = this.whitenedCut(part.offset);
      for (let i = 0; i < r.length; i++) r[i] = d[i] - r[i];
      const cols = part.columns.map((c) => this.whitenedCut(c));
      result =
        form.kind === 'gaussian'
          ? marginaliseGaussian(r, cols, h, this.linearPriors, this.factor.logDet, this.linearNames)
          : marginaliseSellentinHeavens(r, cols, this.factor.logDet, form.realisations, this.linearNames);
    }
    return { result, provided: prepared.provided };
  }

  /** ln L at named parameter values (marginalised parameters integrated out). */
  logLikelihoodAt(values: ParameterValues): number {
    return this.core(values).result.logLikelihood;
  }

  /** Everything about one point of the sampled parameters. */
  pointAt(theta: Float64Array, options: { bestFit?: boolean } = {}): LikelihoodPoint {
    const logPrior = this.parameters.logPrior(theta);
    const base = this.parameters.values(theta);
    const { result, provided } = this.core(base);
    const values = this.parameters.values(theta, provided);
    const marginalised = options.bestFit ? Object.fromEntries(this.linearNames.map((n, j) => [n, result.bestFit[j]])) : undefined;
    const dof = this.dof;
    return { logLikelihood: result.logLikelihood, logPrior, logPosterior: logPrior + result.logLikelihood, chi2: result.chi2, dof, pValue: chiSquarePValue(result.chi2, dof), values, marginalised };
  }

  /**
   * ln prior + ln L at theta (sampled parameters in `parameters.free` order);
   * -Infinity outside the prior or where the model refuses the parameters.
   */
  logPosterior(theta: Float64Array): number {
    const lp = this.parameters.logPrior(theta);
    if (!Number.isFinite(lp)) return -Infinity;
    let ll: number;
    try {
      ll = this.core(this.parameters.values(theta)).result.logLikelihood;
    } catch (e) {
      if (e instanceof InputError || e instanceof RangeError) return -Infinity;
      throw e;
    }
    return Number.isFinite(ll) ? lp + ll : -Infinity;
  }

  /**
   * Data, model and errors of the kept entries at theta, with the marginalised
   * parameters at their best fit (for residual plots and tables).
   */
  residualsAt(theta: Float64Array): { entries: DataSelection['entries']; data: Float64Array; model: Float64Array; sigma: Float64Array } {
    const values = this.parameters.values(theta);
    const prepared = this.source.prepare(values);
    const model = this.compositeFor(prepared.models);
    let full: Float64Array;
    if (this.linearNames.length === 0) full = model.evaluate(prepared.modelValues);
    else {
      const best = this.core(values).result.bestFit;
      const part = model.linearPart(prepared.modelValues, this.linearNames);
      full = Float64Array.from(part.offset);
      part.columns.forEach((c, j) => c.forEach((v, i) => (full[i] += best[j] * v)));
    }
    const n = this.size;
    const sigma = Float64Array.from({ length: n }, (_, a) => Math.sqrt(this.covariance.matrix[a * n + a]));
    return { entries: this.selection.entries, data: selectVector(this.bundle.dataVector.values, this.selection.indices), model: selectVector(full, this.selection.indices), sigma };
  }

  /** The choices behind this likelihood, for printing with a fit. */
  describe(): LikelihoodDescription {
    const blocks = Object.entries(this.selection.perBlock).map(([b, t]) => `${b} ${t.kept}/${t.total}`);
    return {
      dataPoints: this.size,
      blocks: blocks.join(', '),
      covariance: this.covariance.description.text,
      likelihood: this.covariance.form.kind === 'gaussian' ? 'Gaussian (Cholesky)' : `Sellentin–Heavens t-distribution, N_s = ${this.covariance.form.realisations}`,
      covarianceBlocks: this.factor.blocks.length,
      sampled: this.parameters.free.join(', '),
      fixed: Object.keys(this.parameters.fixed).join(', '),
      marginalised: this.linearPriors.map((p, j) => `${this.linearNames[j]} (${p.sigma === Infinity ? 'flat' : `N(${p.mean}, ${p.sigma})`})`).join(', ') || 'none',
      derived: this.parameters.derived.map((d) => `${d.name} = ${d.expression.text}`).join('; ') || 'none',
      ...this.source.describe(),
    };
  }
}

export type LikelihoodDescription = Readonly<Record<string, string | number>>;
