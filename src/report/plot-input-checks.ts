import { InputError } from '../contracts/input-error.js';

/**
 * Checks of plot and report input; each failure is an InputError naming the
 * offending field in one line.
 */
export function requireFiniteValues(name: string, values: ArrayLike<number>): void {
  if (values.length === 0) throw new InputError(`${name} is empty`);
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) throw new InputError(`${name}[${i}] is ${values[i]}, expected a finite number`);
  }
}

export function requireLength(name: string, values: ArrayLike<number> | readonly unknown[], expected: number, reference: string): void {
  if (values.length !== expected) {
    throw new InputError(`${name} has ${values.length} entries but ${reference} has ${expected}`);
  }
}

function requirePositiveValues(name: string, values: ArrayLike<number>): void {
  requireFiniteValues(name, values);
  for (let i = 0; i < values.length; i++) {
    if (!(values[i] > 0)) throw new InputError(`${name}[${i}] is ${values[i]}, expected a positive number`);
  }
}

export function requireNonEmptyList(name: string, list: readonly unknown[]): void {
  if (list.length === 0) throw new InputError(`${name} is empty`);
}

/**
 * Several series that go with a reference series: each must have its length,
 * then hold finite (or, where asked, positive) numbers.
 */
export function requireMatchingSeries(
  reference: string,
  length: number,
  series: ReadonlyArray<readonly [name: string, values: ArrayLike<number>, rule: 'finite' | 'positive']>,
): void {
  for (const [name, values] of series) requireLength(name, values, length, reference);
  for (const [name, values, rule] of series) {
    if (rule === 'positive') requirePositiveValues(name, values);
    else requireFiniteValues(name, values);
  }
}
