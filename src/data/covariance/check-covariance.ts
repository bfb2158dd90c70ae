import { InputError } from '../../contracts/input-error.js';

/**
 * Checks every covariance passes before use: its size matches the data vector,
 * every element is finite and it is symmetric. Positive definiteness is checked
 * by the factorisation (choleskyFactor), which quotes the smallest eigenvalue.
 */
export function checkCovarianceShape(values: Float64Array, size: number, expected: number, label: string): void {
  if (size !== expected || values.length !== size * size) {
    throw new InputError(`${label}: a ${size} x ${size} matrix (${values.length} elements) does not match the data vector of ${expected} entries`, { where: label });
  }
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) {
      throw new InputError(`${label}: element (${Math.floor(i / size) + 1}, ${(i % size) + 1}) is ${values[i]}, not a finite number`, { where: label });
    }
  }
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < i; j++) {
      const a = values[i * size + j];
      const b = values[j * size + i];
      if (Math.abs(a - b) > 1e-8 * Math.sqrt(Math.abs(values[i * size + i] * values[j * size + j]))) {
        throw new InputError(`${label}: not symmetric at (${i + 1}, ${j + 1}): ${a} vs ${b}`, { where: label });
      }
    }
  }
}
