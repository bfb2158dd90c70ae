import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Background, backgroundOf } from '../../src/cosmology/background.js';
import { validateCosmology } from '../../src/cosmology/cosmology-parameters.js';
import { GrowthHistory } from '../../src/cosmology/growth-history.js';
import { thermalNeutrinoClustering, thermalNeutrinoEnergy } from '../../src/cosmology/neutrino-thermal-density.js';
import { HUBBLE_DISTANCE_MPC_H } from '../../src/cosmology/physical-constants.js';

interface FixtureCase {
  parameters: Record<string, number>;
  radiation: boolean;
  z: number[];
  E: number[];
  hubble: number[];
  comovingDistance: number[];
  growthFactor: number[];
  growthRate: number[];
  heathGrowthFactor?: number[];
}
const fixture = JSON.parse(
  readFileSync(new URL('../fixtures/scipy-background/background.json', import.meta.url), 'utf8'),
) as { cases: Record<string, FixtureCase> };

const relative = (a: number, b: number) => Math.abs(a / b - 1);

describe('background and growth against scipy (tests/fixtures/scipy-background, quad and solve_ivp)', () => {
  for (const [name, c] of Object.entries(fixture.cases)) {
    it(`${name}: E(z), H(z), comoving distance, D(z) and f(z) agree to 1e-5`, () => {
      const bg = backgroundOf(validateCosmology(c.parameters), { radiation: c.radiation });
      const growth = new GrowthHistory(bg);
      c.z.forEach((z, i) => {
        expect(relative(bg.e(z), c.E[i])).toBeLessThan(1e-10);
        expect(relative(bg.hubble(z), c.hubble[i])).toBeLessThan(1e-10);
        if (z > 0) expect(relative(bg.comovingDistance(z), c.comovingDistance[i])).toBeLessThan(1e-5);
        expect(relative(growth.factor(z), c.growthFactor[i])).toBeLessThan(1e-5);
        expect(relative(growth.rate(z), c.growthRate[i])).toBeLessThan(1e-5);
      });
    });
  }

  it('ODE growth matches the exact LCDM growth integral (Heath 1977, MNRAS 179, 351; by scipy quad) to 1e-5', () => {
    const c = fixture.cases.lcdmNoRadiation;
    const growth = new GrowthHistory(backgroundOf(validateCosmology(c.parameters), { radiation: false }));
    const heath = c.heathGrowthFactor as number[];
    let worst = 0;
    c.z.forEach((z, i) => (worst = Math.max(worst, relative(growth.factor(z), heath[i]))));
    expect(worst).toBeLessThan(1e-5);
  });
});

describe('Einstein–de Sitter limits (exact: D = a, f = 1, chi = 2 c/H0 (1 - 1/sqrt(1+z)))', () => {
  const eds = new Background({ h: 0.7, omegaRadiation: 0, omegaCold: 0.49, omegaNu: 0, w0: -1, wa: 0 });
  const growth = new GrowthHistory(eds);
  it('has no dark energy', () => expect(Math.abs(eds.omegaDarkEnergy0)).toBeLessThan(1e-15));
  for (const z of [0, 0.5, 1, 2, 5, 30]) {
    it(`z = ${z}: D = a and f = 1 to 1e-6, comoving distance analytic to 1e-6`, () => {
      const a = 1 / (1 + z);
      expect(relative(growth.factor(z), a)).toBeLessThan(1e-6);
      expect(Math.abs(growth.rate(z) - 1)).toBeLessThan(1e-6);
      if (z > 0) {
        const exact = 2 * HUBBLE_DISTANCE_MPC_H * (1 - 1 / Math.sqrt(1 + z));
        expect(relative(eds.comovingDistance(z), exact)).toBeLessThan(1e-6);
        expect(relative(eds.angularDiameterDistance(z), exact / (1 + z))).toBeLessThan(1e-6);
      }
    });
  }

  it('with radiation the growing mode is the Meszaros (1974) solution D = a + 2 a_eq / 3 to 1e-6', () => {
    const mr = new Background({ h: 0.7, omegaRadiation: 0.49 * 3e-4, omegaCold: 0.49 * (1 - 3e-4), omegaNu: 0, w0: -1, wa: 0 });
    const g = new GrowthHistory(mr);
    const aEq = mr.omegaRadiation0 / mr.omegaMatter0;
    for (const z of [0, 1, 10, 100, 1000, 3000]) {
      const a = 1 / (1 + z);
      expect(relative(g.factor(z), a + (2 / 3) * aEq)).toBeLessThan(1e-6);
      expect(relative(g.rate(z), a / (a + (2 / 3) * aEq))).toBeLessThan(1e-6);
    }
  });
});

describe('growth rate against the Omega_m(z)^0.55 rule (Linder 2005, PRD 72, 043529)', () => {
  // Planck 2018 best fit (A&A 641, A6, Table 2, from memory) with one 0.06 eV neutrino.
  const bg = backgroundOf(validateCosmology({ h: 0.6736, omegaB: 0.02237, omegaCdm: 0.12, ns: 0.9649, lnAs: 3.044, mNu: 0.06, massiveNuCount: 1 }));
  const growth = new GrowthHistory(bg);
  it('within 0.6% at z = 0', () => {
    expect(relative(growth.rate(0), bg.omegaMatterAt(0) ** 0.55)).toBeLessThan(0.006);
  });
  it('within 0.2% for z in [0.3, 3]', () => {
    for (let z = 0.3; z <= 3.0001; z += 0.1) expect(relative(growth.rate(z), bg.omegaMatterAt(z) ** 0.55)).toBeLessThan(0.002);
  });
});

describe('thermal massive neutrinos (relativistic Fermi–Dirac, Lesgourgues & Pastor 2006, sec. 4)', () => {
  const fd = (fixture as unknown as { fermiDirac: { y: number[]; energy: number[]; clustering: number[] } }).fermiDirac;
  it('G(y) = rho / rho_massless agrees with scipy quad to 1e-8, and C(y) = (rho - 3p) / rho_massless to 1e-8 of G', () => {
    // C is measured against G: it is an additive part of the neutrino density, and vanishes like y^2 while relativistic.
    fd.y.forEach((y, i) => {
      expect(relative(thermalNeutrinoEnergy(y), fd.energy[i])).toBeLessThan(1e-8);
      expect(Math.abs(thermalNeutrinoClustering(y) - fd.clustering[i]) / fd.energy[i]).toBeLessThan(1e-8);
    });
  });
  it('the late-time neutrino density is sum m / 93.14 eV (Mangano et al. 2005) to 1e-4 for 0.06 eV', () => {
    const bg = backgroundOf(validateCosmology({ h: 0.7, omegaB: 0.022, omegaCdm: 0.12, ns: 0.96, lnAs: 3, mNu: 0.06, massiveNuCount: 1 }));
    expect(relative(bg.omegaNu0 * 0.49, 0.06 / 93.14)).toBeLessThan(1e-4);
    // Early on the massive species is radiation with the massless density: E(a) as with three massless species.
    const noNu = backgroundOf(validateCosmology({ h: 0.7, omegaB: 0.022, omegaCdm: 0.12, ns: 0.96, lnAs: 3 }));
    expect(relative(bg.e2(1e-7), noNu.e2(1e-7))).toBeLessThan(1e-6);
  });
});
