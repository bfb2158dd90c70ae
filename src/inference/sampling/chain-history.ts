/**
 * The draws of a run in memory: per step and member, the log-posterior and
 * the point, as rows [logPosterior, theta_1 .. theta_d] of a growing
 * Float64Array (step-major, then member).
 */
export class ChainHistory {
  private data: Float64Array;
  steps = 0;
  readonly width: number;

  constructor(
    readonly members: number,
    readonly dim: number,
    capacitySteps = 1024,
  ) {
    this.width = dim + 1;
    this.data = new Float64Array(Math.max(1, capacitySteps) * members * this.width);
  }

  /** Append one step: the members' points (members x dim) and log-posteriors. */
  append(positions: Float64Array, logPosterior: Float64Array): void {
    const size = this.members * this.width;
    if ((this.steps + 1) * size > this.data.length) {
      const grown = new Float64Array(this.data.length * 2);
      grown.set(this.data);
      this.data = grown;
    }
    let o = this.steps * size;
    for (let m = 0; m < this.members; m++) {
      this.data[o++] = logPosterior[m];
      this.data.set(positions.subarray(m * this.dim, (m + 1) * this.dim), o);
      o += this.dim;
    }
    this.steps++;
  }

  /** Row for (step index from 0, member): [logPosterior, theta...]. */
  row(step: number, member: number): Float64Array {
    const o = (step * this.members + member) * this.width;
    return this.data.subarray(o, o + this.width);
  }

  /** Parameter p (or -1 for the log-posterior) of one member over steps [from, to). */
  series(member: number, p: number, from = 0, to = this.steps): Float64Array {
    const out = new Float64Array(Math.max(0, to - from));
    for (let s = from; s < to; s++) out[s - from] = this.data[(s * this.members + member) * this.width + 1 + p];
    return out;
  }

  /** Points of steps [from, to) of all members as rows (step-major, then member), count x dim. */
  points(from = 0, to = this.steps): Float64Array {
    const count = Math.max(0, to - from) * this.members;
    const out = new Float64Array(count * this.dim);
    for (let r = 0; r < count; r++) {
      const o = (from * this.members + r) * this.width + 1;
      out.set(this.data.subarray(o, o + this.dim), r * this.dim);
    }
    return out;
  }

  /** Parameter p over steps [from, to) for every member. */
  seriesByMember(p: number, from = 0, to = this.steps): Float64Array[] {
    return Array.from({ length: this.members }, (_, m) => this.series(m, p, from, to));
  }
}
