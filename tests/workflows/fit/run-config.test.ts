import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputErrors } from '../../../src/contracts/input-error.js';
import { readRunConfig } from '../../../src/workflows/fit/run-config.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-config-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const demo = join(__dirname, '../../../data-demo');

function problemsOf(text: string): string[] {
  const file = join(dir, 'c.json');
  writeFileSync(file, text);
  try {
    readRunConfig(file);
  } catch (e) {
    if (e instanceof InputErrors) return [...e.problems];
    throw e;
  }
  return [];
}

describe('run config validation', () => {
  it('accepts the bundled demo config', () => {
    const c = readRunConfig(join(demo, 'fit.json'));
    expect(c.sampler.method).toBe('ensemble');
    expect(c.truth?.b1).toBe(2);
  });

  it('lists every problem at once, each naming its key and line', () => {
    const text = `{
  "measurement": "${demo.replace(/\\/g, '/')}",
  "covariance": { "source": "matrix" },
  "cosmology": { "mode": "fixed-template", "colour": 1 },
  "parameters": {
    "alphaPar": { "value": 1 }, "alphaPerp": { "value": 1 }, "templateAmplitude": { "value": 1 },
    "fsigma8": { "prior": { "kind": "uniform", "min": 1, "max": 0.5 } },
    "b1": { "value": 2, "prior": { "kind": "uniform", "min": 0, "max": 4 } }
  },
  "sampler": { "walkers": "many", "speed": 3 },
  "truth": "no-such-truth.json",
  "colour": "blue"
}`;
    const problems = problemsOf(text);
    const expectOne = (re: RegExp) => expect(problems.some((p) => re.test(p)), `${re} in\n${problems.join('\n')}`).toBe(true);
    expectOne(/^colour \(.*c\.json:12\): unknown key/);
    expectOne(/cosmology\.colour \(.*c\.json:4\)/);
    expectOne(/parameters\.fsigma8\.prior.*min/);
    expectOne(/parameters\.b1 must have exactly one of value, prior, derived/);
    expectOne(/sampler\.walkers \(.*:10\): must be a number/);
    expectOne(/sampler\.speed \(.*:10\): not a setting/);
    expectOne(/truth .*no-such-truth\.json/);
    expect(problems.length).toBeGreaterThanOrEqual(7);
  });

  it('checks the bispectrum model block: unknown keys and values of the wrong kind, with their lines', () => {
    const text = `{
  "measurement": "${demo.replace(/\\/g, '/')}",
  "covariance": { "source": "matrix" },
  "cosmology": { "mode": "fixed-template" },
  "parameters": {},
  "models": { "bispectrum": { "irResummation": "yes",
    "volumeOrder": 0, "averaging": "middle", "shape": 1 } }
}`;
    const problems = problemsOf(text).join('\n');
    expect(problems).toMatch(/models\.bispectrum\.irResummation \(.*c\.json:6\): must be true, false or "angle-averaged", got "yes"/);
    expect(problems).toMatch(/models\.bispectrum\.volumeOrder \(.*c\.json:7\): must be a positive integer/);
    expect(problems).toMatch(/models\.bispectrum\.averaging \(.*c\.json:7\): must be one of/);
    expect(problems).toMatch(/models\.bispectrum\.shape \(.*c\.json:7\): unknown key/);
  });

  it('refuses a parameter written twice (once fixed, once free) and a missing measurement folder', () => {
    const dup = problemsOf('{\n"parameters": {\n "b1": {"value": 1},\n "b1": {"prior": {"kind": "uniform", "min": 0, "max": 3}}\n}\n}');
    expect(dup.join('\n')).toMatch(/key "parameters\.b1" appears twice/);
    const missing = problemsOf('{ "measurement": "nowhere", "covariance": {"source": "matrix"}, "cosmology": {"mode": "full"}, "parameters": {} }');
    expect(missing.join('\n')).toMatch(/measurement .*: no folder at .*nowhere/);
  });

  it('names missing required keys', () => {
    const problems = problemsOf('{}');
    for (const k of ['measurement', 'covariance', 'cosmology', 'parameters']) expect(problems.some((p) => p.startsWith(`${k} (`) && p.endsWith('missing'))).toBe(true);
  });
});
