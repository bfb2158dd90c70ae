import { describe, expect, it } from 'vitest';
import { PowerMultipoleModel, type PowerBinAveraging } from '../../src/power/index.js';
import { Random } from '../../src/numerics/random.js';
import { analyticSpectrum } from './support/analytic-spectrum.js';

const spectrum = analyticSpectrum({ growthTilt: -0.03 });
const averagings: PowerBinAveraging[] = [{ kind: 'centre' }, { kind: 'mean-k' }, { kind: 'lattice', boxSize: 400 }];

function randomParameters(rng: Random): Record<string, number> {
  const u = (lo: number, hi: number) => lo + (hi - lo) * rng.uniform();
  return {
    b1: u(1, 3),
    f: u(0.4, 1),
    alphaPar: u(0.93, 1.07),
    alphaPerp: u(0.93, 1.07),
    pCt0: u(-10, 10),
    pCt2: u(-10, 10),
    pCt4: u(-10, 10),
    pCtFog: u(-20, 20),
    pStochConst: u(0.5, 1.5),
    pStochK2Mu2: u(-20, 20),
  };
}

describe('power templates', () => {
  it('agree with the point-by-point formula to 1e-10 for every averaging', () => {
    const rng = new Random(41);
    for (const averaging of averagings) {
      const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.02, dk: 0.02, count: 12 }, nbar: 3e-4, averaging });
      for (let trial = 0; trial < 4; trial++) {
        const p = randomParameters(rng);
        const viaTemplates = model.evaluate(p);
        const direct = model.evaluateDirect(p);
        for (let e = 0; e < direct.length; e++) {
          const scale = Math.abs(direct[e % 12]); // the monopole of the same bin
          expect(Math.abs(viaTemplates[e] - direct[e]) / scale).toBeLessThan(1e-10);
        }
      }
    }
  });

  it('split into an offset and exact columns for the linear amplitudes', () => {
    const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.02, dk: 0.02, count: 10 }, nbar: 3e-4 });
    const p = randomParameters(new Random(7));
    const names = ['pCt2', 'pStochConst', 'pCtFog'];
    const part = model.linearPart(p, names);
    const full = model.evaluateDirect(p);
    for (let e = 0; e < full.length; e++) {
      let rebuilt = part.offset[e];
      names.forEach((n, j) => (rebuilt += p[n] * part.columns[j][e]));
      expect(Math.abs(rebuilt - full[e]) / Math.abs(full[e % 10])).toBeLessThan(1e-10);
    }
    // A column is the model's response to a unit change of its amplitude.
    const bumped = model.evaluateDirect({ ...p, pCt2: p.pCt2 + 1 });
    for (let e = 0; e < full.length; e++) {
      expect(Math.abs(bumped[e] - full[e] - part.columns[0][e]) / Math.abs(full[e % 10])).toBeLessThan(1e-10);
    }
  });

  it('refuse a linear name the model is not linear in', () => {
    const model = new PowerMultipoleModel({ spectrum, bins: { kMin: 0.02, dk: 0.02, count: 3 }, nbar: 3e-4 });
    expect(() => model.linearPart({}, ['b1'])).toThrow(/b1 is not one the power model is linear in/);
    expect(() => model.linearPart({}, ['pCt0', 'pCt0'])).toThrow(/listed twice/);
  });
});
