import { describe, expect, it } from 'vitest';
import { ParameterSpace } from '../../../src/inference/parameters/parameter-space.js';

describe('parameter space', () => {
  const space = new ParameterSpace(
    {
      h: { value: 0.7 },
      b1: { prior: { kind: 'uniform', min: 0.5, max: 4 }, start: 2 },
      lnB: { prior: { kind: 'log-uniform', min: 0.1, max: 10 } },
      c0: { prior: { kind: 'gaussian', mean: 0, sigma: 5 }, marginalise: true },
      shot: { prior: { kind: 'flat' }, marginalise: true },
      b1h: { derived: 'b1 * h' },
      fsigma8Twice: { derived: '2 * fsigma8' },
    },
    ['fsigma8'],
  );

  it('orders sampled parameters as declared and separates fixed, marginalised and derived ones', () => {
    expect(space.free).toEqual(['b1', 'lnB']);
    expect([...space.starts]).toEqual([2, 1]);
    expect(space.fixed).toEqual({ h: 0.7 });
    expect(space.marginalised).toEqual([{ name: 'c0', mean: 0, sigma: 5 }, { name: 'shot', mean: 0, sigma: Infinity }]);
    const v = space.values(Float64Array.from([3, 2]), { fsigma8: 0.45 });
    expect(v).toMatchObject({ h: 0.7, b1: 3, lnB: 2, fsigma8: 0.45 });
    expect(v.b1h).toBeCloseTo(2.1, 14);
    expect(v.fsigma8Twice).toBeCloseTo(0.9, 14);
  });

  it('sums the log priors and is -Infinity outside them', () => {
    expect(space.logPrior(Float64Array.from([1, 1]))).toBeCloseTo(-Math.log(3.5) - Math.log(1 * Math.log(100)), 12);
    expect(space.logPrior(Float64Array.from([5, 1]))).toBe(-Infinity);
  });

  it('lists every problem by key', () => {
    let message = '';
    try {
      new ParameterSpace({
        a: { value: Number.NaN },
        b: { prior: { kind: 'uniform', min: 0, max: 1 }, start: 3 },
        c: { prior: { kind: 'uniform', min: 0, max: 1 }, marginalise: true },
        d: { prior: { kind: 'flat' } },
        e: { derived: 'import("x")' },
        g: { value: 1, prior: { kind: 'flat' } } as never,
        'bad name': { value: 1 },
        later: { derived: 'zz + 1' },
        zz: { value: 2 },
      });
    } catch (e) {
      message = (e as Error).message;
    }
    expect(message).toContain('parameters.a.value must be a finite number');
    expect(message).toContain('parameters.c: analytic marginalisation needs a gaussian prior without bounds or a flat prior, got uniform');
    expect(message).toContain('parameters.d: a flat (improper) prior is only allowed with "marginalise": true');
    expect(message).toContain('parameters.e.derived: expression "import("x")" is refused');
    expect(message).toContain('parameters.g must have exactly one of value, prior, derived');
    expect(message).toContain('parameters.bad name: a parameter name must be letters');
    expect(message).toContain("parameters.later.derived: expression \"zz + 1\" is refused: unknown name 'zz'");
  });

  it('refuses a start outside its prior', () => {
    expect(() => new ParameterSpace({ b: { prior: { kind: 'uniform', min: 0, max: 1 }, start: 3 } })).toThrow(/parameters\.b\.start \(3\) lies outside its prior/);
  });
});
