/** A run stopped on a failure (a worker that could not be replaced, a log-posterior that threw). */
export class SamplingHaltedError extends Error {
  constructor(
    message: string,
    /** The checkpoint kept for a resumed run, or null when the run stopped before its first step. */
    readonly checkpoint: string | null,
  ) {
    super(message);
    this.name = 'SamplingHaltedError';
  }
}
