/**
 * A long run stopped by the user (Ctrl-C) after writing its checkpoint. The
 * CLI prints the message and exits 130; the run can be resumed.
 */
export class InterruptedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InterruptedError';
  }
}
