import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { evaluateModelCsv } from '../../../src/workflows/fit/evaluate-model.js';
import { readRunConfig } from '../../../src/workflows/fit/run-config.js';
import { writeSmallFitProblem } from './support/small-fit-problem.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-evaluate-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('model of a run config as CSV', () => {
  const config = readRunConfig(writeSmallFitProblem(dir));

  it('lists every data-vector entry with data, sigma, model and a residual that is (data - model) / sigma', () => {
    const rows = evaluateModelCsv(config).trim().split('\n').filter((l) => !l.startsWith('#'));
    expect(rows[0]).toBe('block,k1,k2,k3,data,sigma,model,residual_sigma,kept');
    const body = rows.slice(1).map((r) => r.split(','));
    expect(body.filter((r) => r[0] === 'P0').length).toBe(6);
    expect(body.filter((r) => r[0] === 'P2').length).toBe(6);
    for (const r of body) {
      const [data, sigma, model, residual] = r.slice(4, 8).map(Number);
      expect(residual).toBeCloseTo((data - model) / sigma, 10);
    }
  });

  it('moves with an overridden parameter and refuses a name that is not sampled', () => {
    const at = (b1: number) => Number(evaluateModelCsv(config, { overrides: { b1 } }).split('\n').find((l) => l.startsWith('P0,'))!.split(',')[6]);
    expect(at(2.2) / at(1.7)).toBeGreaterThan(1.3); // P0 grows about as b1^2 (Kaiser 1987)
    expect(() => evaluateModelCsv(config, { overrides: { b9: 1 } })).toThrow(/b9: not a sampled parameter/);
  });
});
