import { InputError } from '../contracts/input-error.js';
import { InterruptedError } from '../contracts/interrupted-error.js';

/** Exit codes of the treble CLI (documented in README.md). */
export const EXIT = {
  ok: 0,
  failure: 1,
  badInput: 2,
  interrupted: 130,
} as const;

let debug = false;
export function setDebug(on: boolean): void {
  debug = on;
}

/**
 * Wrap a command action: bad input prints one line plus a hint and exits 2;
 * anything else prints one line and exits 1; `--debug` adds the stack.
 */
export function action<A extends unknown[]>(fn: (...args: A) => Promise<void> | void): (...args: A) => Promise<void> {
  return async (...args: A) => {
    try {
      await fn(...args);
    } catch (err) {
      if (err instanceof InterruptedError) {
        process.stderr.write(`treble: ${err.message}\n`);
        process.exitCode = EXIT.interrupted;
        return;
      }
      if (err instanceof InputError) {
        process.stderr.write(`treble: ${err.message}\n`);
        if (err.hint) process.stderr.write(`hint: ${err.hint}\n`);
        if (debug && err.stack) process.stderr.write(`${err.stack}\n`);
        process.exitCode = EXIT.badInput;
        return;
      }
      const message = err instanceof Error ? err.message : String(err);
      process.stderr.write(`treble: ${message}\n`);
      if (debug && err instanceof Error && err.stack) process.stderr.write(`${err.stack}\n`);
      else process.stderr.write('hint: run again with --debug for the stack trace\n');
      process.exitCode = EXIT.failure;
    }
  };
}
