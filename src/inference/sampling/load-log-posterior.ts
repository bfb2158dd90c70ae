import { InputError } from '../../contracts/input-error.js';
import type { LogPosterior, LogPosteriorReference } from './log-posterior-reference.js';

/** Import the module of a (normalised) reference and build its log-posterior. */
export async function loadLogPosterior(ref: Required<LogPosteriorReference>): Promise<LogPosterior> {
  let mod: Record<string, unknown>;
  try {
    mod = (await import(ref.module)) as Record<string, unknown>;
  } catch (err) {
    throw new InputError(`target.module ${ref.module} could not be loaded: ${(err as Error).message}`);
  }
  const make = mod[ref.exportName];
  if (typeof make !== 'function') throw new InputError(`target.exportName: ${ref.module} has no function export "${ref.exportName}"`);
  const logPost = (await (make as (options: unknown) => unknown)(ref.options)) as unknown;
  if (typeof logPost !== 'function') {
    throw new InputError(`target.exportName: "${ref.exportName}"(options) must return a function theta => log-posterior`);
  }
  return logPost as LogPosterior;
}
