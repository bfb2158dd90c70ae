import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/contracts/input-error.js';
import type { ParameterSpecs } from '../../../src/inference/parameters/parameter-space.js';
import { runScaleCutScan } from '../../../src/workflows/scale-cuts/scale-cut-scan.js';
import { scanFixture, TRUTH } from './scan-fixture.js';

const KMAX = [0.06, 0.08, 0.1, 0.12, 0.14, 0.16];
const BASE = { limits: { P: { kMax: 0.1 } } };
const FREE_TIDAL: ParameterSpecs = {
  b1: { prior: { kind: 'uniform', min: 1, max: 3 } },
  b2: { prior: { kind: 'flat' }, marginalise: true },
  bG2: { prior: { kind: 'flat' }, marginalise: true },
  bispShotPower: { prior: { kind: 'flat' }, marginalise: true },
};

// A one-loop-sized correction: the one-loop / tree ratio of the bispectrum grows roughly as
// (k / k_NL)^2 and is ~10% near k = 0.1 h/Mpc at z ~ 0.5 (common practice); here
// B_data = B_tree [1 + (k1^2 + k2^2 + k3^2) / (3 k_NL^2)] with k_NL = 0.3 h/Mpc.
const oneLoopSized = (k: readonly number[]) => 1 + (k[0] ** 2 + k[1] ** 2 + k[2] ** 2) / (3 * 0.3 ** 2);

describe('scale-cut scan', () => {
  it('does not flag correctly specified noiseless data, and every shift stays far below the threshold', async () => {
    const { bundle, source } = scanFixture();
    const scan = await runScaleCutScan({ bundle, source, parameters: FREE_TIDAL, covariance: { source: 'gaussian' }, statistic: 'B', kMaxValues: KMAX, truth: TRUTH, baseCuts: BASE });
    expect(scan.firstFlagged).toBeUndefined();
    // The marginal posterior mode differs from the truth only through the ln det term of the
    // analytic marginalisation over b2, bG2 and the shot amplitude: a few hundredths of a sigma.
    for (const s of scan.steps) expect(Math.abs(s.shift.b1)).toBeLessThan(0.1);
    expect(scan.steps.map((s) => s.dataPoints)).toEqual([...scan.steps.map((s) => s.dataPoints)].sort((a, b) => a - b));
    expect(new Set(scan.steps.map((s) => s.dataPoints)).size).toBe(KMAX.length);
  });

  it('flags the k_max where data with a one-loop-sized correction bias b1, and names the shape classes carrying chi2', async () => {
    const { bundle, source } = scanFixture({ distort: oneLoopSized });
    const scan = await runScaleCutScan({ bundle, source, parameters: FREE_TIDAL, covariance: { source: 'gaussian' }, statistic: 'B', kMaxValues: KMAX, truth: TRUTH, baseCuts: BASE });
    const first = scan.firstFlagged;
    expect(first).toBeDefined();
    expect(first).toBeGreaterThan(0.08);
    // The shift grows with k_max once the correction matters.
    const shifts = scan.steps.map((s) => Math.abs(s.shift.b1));
    expect(shifts.at(-1)).toBeGreaterThan(shifts[0] * 10);
    const last = scan.steps.at(-1)!;
    const shares = Object.values(last.chi2ByClass).reduce((a, b) => a + (b ?? 0), 0);
    expect(shares).toBeCloseTo(last.chi2, 6);
    expect(last.chi2ByClass.squeezed).toBeGreaterThan(0);
  });

  it('flags data made with a shifted tidal bias when the model ties bG2 to b1, and excludes shapes on request', async () => {
    // Model: bG2 fixed at the local-Lagrangian value -2/7 (b1 - 1) = -0.2857 (REFERENCES.md);
    // data: bG2 shifted by +0.4.
    const { bundle, source } = scanFixture({ truth: { bG2: -2 / 7 + 0.4 } });
    const tied: ParameterSpecs = { b1: FREE_TIDAL.b1, b2: FREE_TIDAL.b2, bG2: { value: -2 / 7 }, bispShotPower: FREE_TIDAL.bispShotPower };
    const scan = await runScaleCutScan({ bundle, source, parameters: tied, covariance: { source: 'gaussian' }, statistic: 'B', kMaxValues: KMAX, truth: TRUTH, baseCuts: BASE });
    expect(scan.firstFlagged).toBeDefined();
    const without = await runScaleCutScan({ bundle, source, parameters: tied, covariance: { source: 'gaussian' }, statistic: 'B', kMaxValues: [0.16], truth: TRUTH, baseCuts: BASE, excludeShapes: ['squeezed', 'flattened'] });
    expect(without.steps[0].chi2ByClass.squeezed).toBeUndefined();
    expect(without.steps[0].chi2ByClass.flattened).toBeUndefined();
    expect(without.steps[0].dataPoints).toBeLessThan(scan.steps.at(-1)!.dataPoints);
  });

  it('adding a theoretical-error covariance widens the errors and reduces the shifts', async () => {
    const { bundle, source } = scanFixture({ distort: oneLoopSized });
    const args = { bundle, source, parameters: FREE_TIDAL, covariance: { source: 'gaussian' } as const, statistic: 'B' as const, kMaxValues: [0.16], truth: TRUTH, baseCuts: BASE };
    const plain = (await runScaleCutScan(args)).steps[0];
    const padded = (await runScaleCutScan({ ...args, theoryError: { amplitude: 0.1, kRef: 0.1, slope: 2, correlationLength: 0.05 } })).steps[0];
    expect(padded.sigma.b1).toBeGreaterThan(plain.sigma.b1);
    expect(Math.abs(padded.shift.b1)).toBeLessThan(Math.abs(plain.shift.b1));
  });

  it('scans the power-spectrum k_max too (B held at k_max 0.08): no flag on correct data, the P entries grow', async () => {
    const { bundle, source } = scanFixture({ bKMax: 0.08 });
    const scan = await runScaleCutScan({ bundle, source, parameters: FREE_TIDAL, covariance: { source: 'gaussian' }, statistic: 'P', kMaxValues: [0.05, 0.1], truth: TRUTH });
    expect(scan.firstFlagged).toBeUndefined();
    expect(scan.steps[1].dataPoints - scan.steps[0].dataPoints).toBe(10); // P0 and P2 on 5 more bins
    expect(scan.steps[1].sigma.b1).toBeLessThan(scan.steps[0].sigma.b1);
  });

  it('without a truth, measures shifts from the most conservative cut', async () => {
    const { bundle, source } = scanFixture({ distort: oneLoopSized });
    const scan = await runScaleCutScan({ bundle, source, parameters: FREE_TIDAL, covariance: { source: 'gaussian' }, statistic: 'B', kMaxValues: [0.16, 0.06, 0.12], baseCuts: BASE });
    expect(scan.reference).toBe('most conservative cut');
    expect(scan.steps.map((s) => s.kMax)).toEqual([0.06, 0.12, 0.16]);
    expect(scan.steps[0].shift.b1).toBe(0);
    expect(scan.firstFlagged).toBe(0.16);
  });

  it('refuses bad input, naming the key', async () => {
    const { bundle, source } = scanFixture({ bKMax: 0.08 });
    const args = { bundle, source, parameters: FREE_TIDAL, covariance: { source: 'gaussian' } as const, statistic: 'B' as const, kMaxValues: [0.08] };
    await expect(runScaleCutScan({ ...args, kMaxValues: [] })).rejects.toThrow(/kMaxValues/);
    await expect(runScaleCutScan({ ...args, pValueLimit: 2 })).rejects.toThrow(/pValueLimit/);
    await expect(runScaleCutScan({ ...args, excludeShapes: ['pointy'] })).rejects.toThrow(/unknown shape class "pointy"/);
    await expect(runScaleCutScan({ ...args, truth: { b2: 1 } })).rejects.toThrow(InputError);
  });
});
