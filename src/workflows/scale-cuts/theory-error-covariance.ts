import { InputError } from '../../contracts/input-error.js';

/**
 * Theoretical-error covariance for the scale-cut scan, in the form of
 * Baldauf, Mirbabayi, Simonović & Zaldarriaga 2016 (PRD 93, 123007, sec. II):
 * an envelope E_i of the size of the neglected higher-order terms, fully
 * correlated over a correlation length and uncorrelated beyond,
 *   C^th_ij = E_i E_j exp(-|kappa_i - kappa_j|^2 / (2 Delta^2)),
 * where kappa is the wavenumber of a power-spectrum bin or the triple
 * (k1, k2, k3) of a triangle bin. Entries of different statistics or multipoles
 * are uncorrelated.
 *
 * The envelope here is E_i = amplitude * |S_i| * (kappa_i / kRef)^slope with S_i
 * the model signal of the entry and kappa_i its largest wavenumber; the paper's
 * fitted one-loop envelopes have slopes of roughly 3 for P and 2 for B (from
 * memory; tune `slope` and `kRef` to the tracer).
 */
export interface TheoryErrorEnvelope {
  /** Relative size of the neglected terms at kRef. */
  readonly amplitude: number;
  /** Wavenumber (h/Mpc) at which the envelope equals `amplitude` times the signal. */
  readonly kRef: number;
  readonly slope: number;
  /** Correlation length Delta in h/Mpc. */
  readonly correlationLength: number;
}

export interface TheoryErrorEntry {
  readonly block: string;
  readonly k: readonly number[];
}

export function theoryErrorCovariance(
  entries: readonly TheoryErrorEntry[],
  signal: Float64Array,
  envelope: TheoryErrorEnvelope,
): Float64Array {
  const { amplitude, kRef, slope, correlationLength } = envelope;
  if (!(amplitude >= 0)) throw new InputError(`theory error: amplitude must be non-negative, got ${amplitude}`);
  if (!(kRef > 0)) throw new InputError(`theory error: kRef must be positive, got ${kRef}`);
  if (!(correlationLength > 0)) throw new InputError(`theory error: correlationLength must be positive, got ${correlationLength}`);
  if (signal.length !== entries.length) {
    throw new InputError(`theory error: ${entries.length} data entries but ${signal.length} signal values`);
  }
  const n = entries.length;
  const e = new Float64Array(n);
  for (let i = 0; i < n; i++) e[i] = amplitude * Math.abs(signal[i]) * (Math.max(...entries[i].k) / kRef) ** slope;
  const cov = new Float64Array(n * n);
  const twoDelta2 = 2 * correlationLength * correlationLength;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const a = entries[i];
      const b = entries[j];
      if (a.block !== b.block || a.k.length !== b.k.length) continue;
      let d2 = 0;
      for (let c = 0; c < a.k.length; c++) d2 += (a.k[c] - b.k[c]) ** 2;
      const v = e[i] * e[j] * Math.exp(-d2 / twoDelta2);
      cov[i * n + j] = v;
      cov[j * n + i] = v;
    }
  }
  return cov;
}
