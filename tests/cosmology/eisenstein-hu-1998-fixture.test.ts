import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { baoDampingScales } from '../../src/cosmology/bao-damping-scales.js';
import { eisensteinHu98, transferEH98, transferNoWiggleEH98 } from '../../src/cosmology/eisenstein-hu-1998.js';

const fx = JSON.parse(readFileSync(new URL('../fixtures/scipy-eh98/eh98.json', import.meta.url), 'utf8'));
const p = fx.parameters;
const eh = eisensteinHu98(p.h, p.omegaB + p.omegaCdm, p.omegaB, p.tCmb);

describe('EH98 against a second transcription in numpy (tests/fixtures/scipy-eh98)', () => {
  it('sound horizon, drag and equality redshifts agree to 1e-12', () => {
    expect(eh.soundHorizon / fx.soundHorizonMpc - 1).toBeCloseTo(0, 12);
    expect(eh.soundHorizonFit / fx.soundHorizonFitMpc - 1).toBeCloseTo(0, 12);
    expect(eh.zDrag / fx.zDrag - 1).toBeCloseTo(0, 12);
    expect(eh.zEq / fx.zEq - 1).toBeCloseTo(0, 12);
  });
  it('transfer functions with and without wiggles agree to 1e-10', () => {
    fx.k.forEach((k: number, i: number) => {
      expect(Math.abs(transferEH98(eh, k) / fx.transfer[i] - 1)).toBeLessThan(1e-10);
      expect(Math.abs(transferNoWiggleEH98(eh, k) / fx.transferNoWiggle[i] - 1)).toBeLessThan(1e-10);
    });
  });
  it('BAO damping scales of the no-wiggle shape agree with scipy quad to 1e-6', () => {
    const d = fx.dampingShape;
    const pnw = (q: number) => d.amplitude * (q / d.pivot) ** p.ns * transferNoWiggleEH98(eh, q) ** 2;
    const got = baoDampingScales(pnw, d.baoScale, d.separationScale);
    expect(Math.abs(got.sigma2 / d.sigma2 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(got.deltaSigma2 / d.deltaSigma2 - 1)).toBeLessThan(1e-6);
  });
});
