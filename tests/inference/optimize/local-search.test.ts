import { describe, expect, it } from 'vitest';
import { nelderMead } from '../../../src/inference/optimize/nelder-mead.js';
import { quasiNewton } from '../../../src/inference/optimize/quasi-newton.js';
import { restartedNelderMead } from '../../../src/inference/optimize/restarted-nelder-mead.js';
import { rosenbrockTarget } from '../sampling/targets/rosenbrock.js';

/** Rosenbrock's function, sum 100 (x_{i+1} - x_i^2)^2 + (1 - x_i)^2: minimum 0 at (1, ..., 1) (Rosenbrock 1960, Comput. J. 3, 175). */
const negated = rosenbrockTarget();
const rosenbrock = (x: Float64Array) => -negated(x);

const maxError = (x: Float64Array, target: number[]) => Math.max(...target.map((t, i) => Math.abs(x[i] - t)));

describe('local minimisers', () => {
  it('Nelder–Mead with restarts finds the 2-D Rosenbrock minimum from (-1.2, 1) to 1e-6', () => {
    const r = restartedNelderMead(rosenbrock, Float64Array.of(-1.2, 1), { step: Float64Array.of(0.5, 0.5) });
    expect(r.converged).toBe(true);
    expect(maxError(r.x, [1, 1])).toBeLessThan(1e-6);
  });

  it('Nelder–Mead with restarts finds the 4-D Rosenbrock minimum to 1e-6', () => {
    // From the origin: for 4 <= d <= 7 there is a second, local minimum near x_1 = -1 (Shang & Qiu 2006, Optim. Lett., from memory).
    const r = restartedNelderMead(rosenbrock, new Float64Array(4), { step: new Float64Array(4).fill(0.5) });
    expect(maxError(r.x, [1, 1, 1, 1])).toBeLessThan(1e-6);
  });

  it('BFGS with numerical gradients finds the 2-D Rosenbrock minimum to 1e-6', () => {
    const r = quasiNewton(rosenbrock, Float64Array.of(-1.2, 1));
    expect(maxError(r.x, [1, 1])).toBeLessThan(1e-6);
  });

  it('plain Nelder–Mead stops on its tolerance and reports it', () => {
    const bowl = (x: Float64Array) => (x[0] - 3) ** 2 + 10 * (x[1] + 1) ** 2;
    const r = nelderMead(bowl, Float64Array.of(0, 0), { step: Float64Array.of(1, 1) });
    expect(r.converged).toBe(true);
    expect(maxError(r.x, [3, -1])).toBeLessThan(1e-8);
    const starved = nelderMead(bowl, Float64Array.of(0, 0), { step: Float64Array.of(1, 1), maxEvaluations: 10 });
    expect(starved.converged).toBe(false);
  });
});
