import { describe, expect, it } from 'vitest';
import { compileSafeExpression } from '../../../src/inference/parameters/safe-expression.js';

const vars = ['f', 'sigma8', 'h', 'omegaB', 'omegaCdm'];

describe('derived-parameter expressions (mathjs, locked down)', () => {
  it('evaluates arithmetic of parameters with elementary functions', () => {
    const e = compileSafeExpression('(omegaB + omegaCdm) / h^2', vars, 'parameters.omegaM.derived');
    expect(e.evaluate({ h: 0.7, omegaB: 0.022, omegaCdm: 0.12 })).toBeCloseTo(0.142 / 0.49, 14);
    expect(e.variables).toEqual(['omegaB', 'omegaCdm', 'h']);
    expect(compileSafeExpression('f * sigma8', vars, 'k').evaluate({ f: 0.8, sigma8: 0.6 })).toBeCloseTo(0.48, 14);
    expect(compileSafeExpression('sqrt(h) + exp(-f) + log(sigma8) + max(h, f) + 2 pi', vars, 'k').evaluate({ h: 4, f: 0, sigma8: 1 })).toBeCloseTo(2 + 1 + 0 + 4 + 2 * Math.PI, 12);
  });

  it('gives NaN rather than a complex number', () => {
    expect(compileSafeExpression('sqrt(h)', vars, 'k').evaluate({ h: -1 })).toBeNaN();
  });

  // Expressions that try to reach outside their scope (mathjs documentation, "Security":
  // import, createUnit, evaluate, parse, simplify, derivative; and the JavaScript escape
  // routes through constructors, property access and function definitions).
  const hostile = [
    'import({ x: 1 }, { override: true })',
    'createUnit("parsec2", "3 lightyear")',
    'evaluate("1 + 1")',
    'parse("2")',
    'simplify("h + h")',
    'derivative("h^2", "h")',
    'compile("h")',
    'resolve(h)',
    'chain(3)',
    'cos.constructor("return process")()',
    'h.constructor',
    'f["constructor"]',
    '[].map',
    '{ a: 1 }',
    'x = 3',
    'g(x) = x + 1',
    'h = 2; h',
    '"process"',
    '5 cm',
    'h > 0 ? 1 : 2',
    '1:10',
    'process',
    'require("fs")',
    'matrix([1, 2])',
    'f == sigma8',
    'sigma8!',
  ];
  for (const text of hostile) {
    it(`refuses ${text}`, () => {
      expect(() => compileSafeExpression(text, vars, 'parameters.x.derived')).toThrow(/parameters\.x\.derived: expression .* is refused/);
    });
  }

  it('refuses names outside the scope and empty or oversized text', () => {
    expect(() => compileSafeExpression('omegaM * 2', vars, 'k')).toThrow(/unknown name 'omegaM'/);
    expect(() => compileSafeExpression('  ', vars, 'k')).toThrow(/non-empty string/);
    expect(() => compileSafeExpression('h+'.repeat(300) + 'h', vars, 'k')).toThrow(/longer than 500 characters/);
  });
});
