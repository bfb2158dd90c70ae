import { InputError } from '../contracts/input-error.js';

/** A numeric command-line option, or an InputError naming the option. */
export function numberOption(name: string, text: string): number {
  const v = Number(text);
  if (text.trim() === '' || !Number.isFinite(v)) throw new InputError(`--${name} must be a number, got "${text}"`);
  return v;
}

/** `--set name=value ...` assignments, each name one of `names`. */
export function parameterAssignments(items: readonly string[], names: readonly string[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const item of items) {
    const [name, value, extra] = item.split('=');
    if (value === undefined || extra !== undefined || !names.includes(name)) {
      throw new InputError(`--set ${item}: expected name=value with name one of ${names.join(', ')}`);
    }
    out[name] = numberOption(`set ${name}`, value);
  }
  return out;
}

/** A non-negative integer option (worker counts, seeds). */
export function countOption(name: string, text: string): number {
  const v = numberOption(name, text);
  if (!Number.isInteger(v) || v < 0) throw new InputError(`--${name} must be a non-negative integer, got "${text}"`);
  return v;
}

const PROGRESS_MODES = ['auto', 'bar', 'lines', 'off'] as const;
export type ProgressModeName = (typeof PROGRESS_MODES)[number];

export function progressModeOption(text: string): ProgressModeName {
  const hit = PROGRESS_MODES.find((m) => m === text);
  if (!hit) throw new InputError(`--progress must be one of ${PROGRESS_MODES.join(', ')}, got "${text}"`);
  return hit;
}
