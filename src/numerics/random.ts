/**
 * Seeded pseudo-random numbers: xoshiro128** (Blackman & Vigna 2018,
 * "Scrambled linear pseudorandom number generators"), seeded through
 * splitmix32. The state is four uint32 words and can be saved and restored
 * exactly, which checkpoints rely on.
 */
export type RandomState = [number, number, number, number];

function splitmix32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

export class Random {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  /** Second normal deviate kept from the polar method, or NaN when none. */
  private spare = Number.NaN;

  constructor(seed: number | RandomState) {
    if (Array.isArray(seed)) {
      [this.s0, this.s1, this.s2, this.s3] = seed.map((v) => v >>> 0) as RandomState;
    } else {
      if (!Number.isFinite(seed)) throw new RangeError(`random seed must be a finite number, got ${seed}`);
      const sm = splitmix32(Math.floor(seed));
      this.s0 = sm();
      this.s1 = sm();
      this.s2 = sm();
      this.s3 = sm();
    }
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /** Next uint32. */
  nextUint32(): number {
    const result = Math.imul(rotl(Math.imul(this.s1, 5), 7), 9) >>> 0;
    const t = (this.s1 << 9) >>> 0;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    this.s0 >>>= 0;
    this.s1 >>>= 0;
    this.s2 >>>= 0;
    this.s3 >>>= 0;
    return result;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  uniform(): number {
    const hi = this.nextUint32() >>> 5; // 27 bits
    const lo = this.nextUint32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) / 9007199254740992;
  }

  /** Standard normal deviate (Marsaglia polar method). */
  normal(): number {
    if (!Number.isNaN(this.spare)) {
      const v = this.spare;
      this.spare = Number.NaN;
      return v;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const m = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * m;
    return u * m;
  }

  /** Integer uniform in [0, n). */
  integer(n: number): number {
    return Math.floor(this.uniform() * n);
  }

  /** Exact generator state (the spare normal deviate included) for checkpoints. */
  getState(): { words: RandomState; spare: number | null } {
    return {
      words: [this.s0, this.s1, this.s2, this.s3],
      spare: Number.isNaN(this.spare) ? null : this.spare,
    };
  }

  static fromState(state: { words: RandomState; spare: number | null }): Random {
    const r = new Random(state.words);
    r.spare = state.spare === null ? Number.NaN : state.spare;
    return r;
  }
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
