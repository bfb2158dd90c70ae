import { Random } from '../../numerics/random.js';
import type { ProposalEvaluator, SamplerKernel, SavedRandom } from './sampler-kernel.js';

export interface StretchMoveState {
  readonly step: number;
  readonly positions: number[];
  readonly logPosterior: number[];
  readonly accepted: number[];
  readonly random: SavedRandom;
}

/**
 * Affine-invariant ensemble sampler with the stretch move (Goodman & Weare
 * 2010, CAMCoS 5, 65, eqs. 7, 9, 10), updating the two halves of the ensemble
 * in turn so that each half's proposals can be evaluated in parallel.
 * For walker k of the active half and j drawn from the other half:
 *   z ~ g(z) ∝ 1/sqrt(z) on [1/a, a],  y = x_j + z (x_k - x_j),
 *   accept with probability min(1, z^(d-1) p(y) / p(x_k)).
 * z is drawn by inversion, z = ((a - 1) u + 1)^2 / a. Every random number of
 * a half-step is drawn before its evaluations, in walker order.
 */
export class StretchMoveKernel implements SamplerKernel {
  readonly members: number;
  readonly positions: Float64Array;
  readonly logPosterior: Float64Array;
  readonly accepted: Float64Array;
  step: number;
  private random: Random;
  private readonly half: number;
  private readonly proposals: Float64Array;
  private readonly logZ: Float64Array;
  private readonly logU: Float64Array;

  constructor(
    readonly dim: number,
    private readonly stretch: number,
    state: StretchMoveState,
  ) {
    this.members = state.logPosterior.length;
    this.half = this.members / 2;
    this.positions = Float64Array.from(state.positions);
    this.logPosterior = Float64Array.from(state.logPosterior);
    this.accepted = Float64Array.from(state.accepted);
    this.step = state.step;
    this.random = Random.fromState(state.random);
    this.proposals = new Float64Array(this.half * dim);
    this.logZ = new Float64Array(this.half);
    this.logU = new Float64Array(this.half);
  }

  async advance(evaluate: ProposalEvaluator): Promise<void> {
    const savedRandom = this.random.getState();
    const savedPositions = this.positions.slice();
    const savedLogPosterior = this.logPosterior.slice();
    const savedAccepted = this.accepted.slice();
    try {
      await this.halfStep(0, evaluate);
      await this.halfStep(1, evaluate);
      this.step++;
    } catch (err) {
      this.random = Random.fromState(savedRandom);
      this.positions.set(savedPositions);
      this.logPosterior.set(savedLogPosterior);
      this.accepted.set(savedAccepted);
      throw err;
    }
  }

  private async halfStep(which: number, evaluate: ProposalEvaluator): Promise<void> {
    const { dim, half, positions, proposals, logZ, logU, random, stretch } = this;
    const active = which * half;
    const other = (1 - which) * half;
    for (let i = 0; i < half; i++) {
      const k = active + i;
      const j = other + random.integer(half);
      const z = ((stretch - 1) * random.uniform() + 1) ** 2 / stretch;
      logZ[i] = Math.log(z);
      logU[i] = Math.log(random.uniform());
      for (let p = 0; p < dim; p++) {
        const xj = positions[j * dim + p];
        proposals[i * dim + p] = xj + z * (positions[k * dim + p] - xj);
      }
    }
    const values = await evaluate(proposals);
    for (let i = 0; i < half; i++) {
      const k = active + i;
      const q = (dim - 1) * logZ[i] + values[i] - this.logPosterior[k];
      if (logU[i] < q) {
        positions.set(proposals.subarray(i * dim, (i + 1) * dim), k * dim);
        this.logPosterior[k] = values[i];
        this.accepted[k]++;
      }
    }
  }

  saveState(): StretchMoveState {
    return {
      step: this.step,
      positions: Array.from(this.positions),
      logPosterior: Array.from(this.logPosterior),
      accepted: Array.from(this.accepted),
      random: this.random.getState(),
    };
  }
}
