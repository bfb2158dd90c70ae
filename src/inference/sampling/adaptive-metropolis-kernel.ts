import { choleskyFactor } from '../../data/covariance/cholesky-factor.js';
import { Random } from '../../numerics/random.js';
import type { ProposalEvaluator, SamplerKernel, SavedRandom } from './sampler-kernel.js';

export interface AdaptiveMetropolisState {
  readonly step: number;
  readonly positions: number[];
  readonly logPosterior: number[];
  readonly accepted: number[];
  /** Per chain: running mean (dim) and sum of squared deviations (dim x dim) of all states so far. */
  readonly means: number[];
  readonly squares: number[];
  readonly random: SavedRandom;
}

/**
 * Independent adaptive-Metropolis chains (Haario, Saksman & Tamminen 2001,
 * Bernoulli 7, 223, eqs. 2-3): Gaussian random-walk proposals with covariance
 *   C_t = s_d diag(scale^2)                          for t <= t0,
 *   C_t = s_d (Cov(X_0 .. X_{t-1}) + eps diag(scale^2)) for t > t0,
 * s_d = 2.4^2 / d. The paper's eps I_d is taken relative to the starting
 * scales here, so the method is unit-free. Each chain adapts to its own
 * history only, so the chains stay independent and R-hat can compare them.
 * The running covariance uses Welford's update. All random numbers of a step
 * are drawn before its evaluations, chain after chain.
 */
export class AdaptiveMetropolisKernel implements SamplerKernel {
  readonly members: number;
  readonly positions: Float64Array;
  readonly logPosterior: Float64Array;
  readonly accepted: Float64Array;
  step: number;
  private random: Random;
  private readonly means: Float64Array;
  private readonly squares: Float64Array;
  private readonly proposals: Float64Array;
  private readonly logU: Float64Array;
  private readonly normals: Float64Array;
  private readonly covariance: Float64Array;
  private readonly sd: number;

  constructor(
    readonly dim: number,
    private readonly scales: Float64Array,
    private readonly adaptAfter: number,
    private readonly regularization: number,
    state: AdaptiveMetropolisState,
  ) {
    this.members = state.logPosterior.length;
    this.positions = Float64Array.from(state.positions);
    this.logPosterior = Float64Array.from(state.logPosterior);
    this.accepted = Float64Array.from(state.accepted);
    this.means = Float64Array.from(state.means);
    this.squares = Float64Array.from(state.squares);
    this.step = state.step;
    this.random = Random.fromState(state.random);
    this.proposals = new Float64Array(this.members * dim);
    this.logU = new Float64Array(this.members);
    this.normals = new Float64Array(dim);
    this.covariance = new Float64Array(dim * dim);
    this.sd = 2.4 ** 2 / dim;
  }

  /** Fresh running moments: each chain's history is its starting point (count 1). */
  static initialMoments(positions: Float64Array, members: number, dim: number): { means: number[]; squares: number[] } {
    return { means: Array.from(positions), squares: new Array<number>(members * dim * dim).fill(0) };
  }

  async advance(evaluate: ProposalEvaluator): Promise<void> {
    const saved = this.random.getState();
    const { dim, members, positions, proposals, normals } = this;
    for (let c = 0; c < members; c++) {
      const lower = this.proposalFactor(c);
      for (let p = 0; p < dim; p++) normals[p] = this.random.normal();
      for (let p = 0; p < dim; p++) {
        let s = positions[c * dim + p];
        for (let q = 0; q <= p; q++) s += lower[p * dim + q] * normals[q];
        proposals[c * dim + p] = s;
      }
      this.logU[c] = Math.log(this.random.uniform());
    }
    let values: Float64Array;
    try {
      values = await evaluate(proposals);
    } catch (err) {
      this.random = Random.fromState(saved);
      throw err;
    }
    for (let c = 0; c < members; c++) {
      if (this.logU[c] < values[c] - this.logPosterior[c]) {
        positions.set(proposals.subarray(c * dim, (c + 1) * dim), c * dim);
        this.logPosterior[c] = values[c];
        this.accepted[c]++;
      }
      this.updateMoments(c);
    }
    this.step++;
  }

  /** Lower Cholesky factor of chain c's proposal covariance. */
  private proposalFactor(c: number): Float64Array {
    const { dim, covariance, scales, sd } = this;
    const count = this.step + 1; // states X_0 .. X_step seen so far
    covariance.fill(0);
    if (this.step > this.adaptAfter) {
      const base = c * dim * dim;
      for (let i = 0; i < dim * dim; i++) covariance[i] = (sd * this.squares[base + i]) / (count - 1);
      for (let p = 0; p < dim; p++) covariance[p * dim + p] += sd * this.regularization * scales[p] ** 2;
    } else {
      for (let p = 0; p < dim; p++) covariance[p * dim + p] = sd * scales[p] ** 2;
    }
    return choleskyFactor(covariance, dim, 'adaptive-Metropolis proposal covariance').lower;
  }

  /** Welford update of chain c's running mean and squared deviations with its current state. */
  private updateMoments(c: number): void {
    const { dim, means, squares, positions } = this;
    const count = this.step + 2; // X_0 .. X_{step+1}
    const delta = this.normals; // reuse as scratch: deviation from the old mean
    for (let p = 0; p < dim; p++) {
      delta[p] = positions[c * dim + p] - means[c * dim + p];
      means[c * dim + p] += delta[p] / count;
    }
    const base = c * dim * dim;
    for (let p = 0; p < dim; p++) {
      const after = positions[c * dim + p] - means[c * dim + p];
      for (let q = 0; q < dim; q++) squares[base + p * dim + q] += after * delta[q];
    }
  }

  saveState(): AdaptiveMetropolisState {
    return {
      step: this.step,
      positions: Array.from(this.positions),
      logPosterior: Array.from(this.logPosterior),
      accepted: Array.from(this.accepted),
      means: Array.from(this.means),
      squares: Array.from(this.squares),
      random: this.random.getState(),
    };
  }
}
