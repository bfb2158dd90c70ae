import { describe, expect, it } from 'vitest';
import { insideLoops } from './point-in-loops.js';
import { InputError } from '../../src/contracts/input-error.js';
import { Random } from '../../src/numerics/random.js';
import { renderCornerPlotSvg } from '../../src/report/plots/corner-plot.js';
import { renderFisherEllipsePlotSvg } from '../../src/report/plots/fisher-ellipse-plot.js';
import { renderTracePlotSvg } from '../../src/report/plots/trace-plot.js';
import { axisFromTicks, drawnElements, pathPoints, xTicks, yTicks } from './svg-reading.js';

function gaussianPairs(n: number, seed: number): [Float64Array, Float64Array] {
  const r = new Random(seed);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = r.normal();
    x[i] = 1 + 2 * a;
    y[i] = -3 + 0.5 * (0.6 * a + 0.8 * r.normal());
  }
  return [x, y];
}

describe('posterior plots', () => {
  it('draws corner contours that enclose 68% and 95% of the sample, read back through the drawn axes', () => {
    const [x, y] = gaussianPairs(20000, 3);
    const svg = renderCornerPlotSvg({
      parameters: [
        { label: 'a', truth: 1 },
        { label: 'b', truth: -3 },
      ],
      sets: [{ label: 'test', samples: [x, y] }],
    });
    // Lower-left panel: x ticks are the bottom labels left of the second column, y ticks the only right-aligned ones.
    const firstColumnEnd = 70 + 170;
    const xAxis = axisFromTicks(xTicks(svg, (t) => t.x <= firstColumnEnd).sort((p, q) => p.value - q.value));
    const yAxis = axisFromTicks(yTicks(svg, () => true));
    const filled = drawnElements(svg, 'path').filter((p) => p['fill-rule'] === 'evenodd');
    expect(filled).toHaveLength(2);
    for (const [element, fraction] of [
      [filled.find((p) => p['fill-opacity'] === '0.2'), 0.95],
      [filled.find((p) => p['fill-opacity'] === '0.45'), 0.68],
    ] as const) {
      const loops = pathPoints(element?.d ?? '').map((loop) => loop.map(([px, py]): [number, number] => [xAxis.toValue(px), yAxis.toValue(py)]));
      let count = 0;
      for (let i = 0; i < x.length; i++) if (insideLoops(x[i], y[i], loops)) count++;
      expect(count / x.length).toBeGreaterThan(fraction - 0.025);
      expect(count / x.length).toBeLessThan(fraction + 0.025);
    }
    // Truth lines: dashed verticals at a = 1 (both panels of the first column) and a horizontal at b = -3.
    const dashed = drawnElements(svg, 'line').filter((l) => l['stroke-dasharray'] === '4 3');
    expect(dashed.filter((l) => l.x1 === l.x2 && Math.abs(Number(l.x1) - xAxis.toPixel(1)) < 0.02)).toHaveLength(2);
    expect(dashed.some((l) => l.y1 === l.y2 && Math.abs(Number(l.y1) - yAxis.toPixel(-3)) < 0.02)).toBe(true);
  });

  it('thins long chains for the trace plot but keeps the first and last steps at their places', () => {
    const steps = 5000;
    const chains = [0, 1, 2].map((c) => Float64Array.from({ length: steps }, (_, s) => 10 + c + Math.sin(s / 50)));
    const svg = renderTracePlotSvg({ parameters: [{ label: 'q', chains }], maxPointsPerChain: 500 });
    const xAxis = axisFromTicks(xTicks(svg, () => true));
    const yAxis = axisFromTicks(yTicks(svg, () => true));
    const traces = drawnElements(svg, 'path').filter((p) => p.fill === 'none');
    expect(traces).toHaveLength(3);
    traces.forEach((trace, c) => {
      const [points] = pathPoints(trace.d);
      expect(points.length).toBeLessThanOrEqual(501);
      expect(points[0][0]).toBeCloseTo(xAxis.toPixel(0), 1);
      expect(points[points.length - 1][0]).toBeCloseTo(xAxis.toPixel(steps - 1), 1);
      expect(points[points.length - 1][1]).toBeCloseTo(yAxis.toPixel(chains[c][steps - 1]), 1);
      expect(points[1][1]).toBeCloseTo(yAxis.toPixel(chains[c][10]), 1); // stride 10
    });
  });

  it('thins harder when there are many walkers, about 24000 points per panel', () => {
    const walkers = Array.from({ length: 60 }, (_, w) => Float64Array.from({ length: 2000 }, (_, s) => w + Math.cos(s)));
    const svg = renderTracePlotSvg({ parameters: [{ label: 'q', chains: walkers }] });
    const traces = drawnElements(svg, 'path').filter((p) => p.fill === 'none');
    expect(traces).toHaveLength(60);
    // 24000 / 60 = 400 points per walker: stride 5 over 2000 steps gives steps 0, 5, ..., 1995, plus the last one.
    for (const t of traces) expect(pathPoints(t.d)[0]).toHaveLength(401);
  });

  it('traces Fisher ellipses on Delta chi^2 = 2.30 and 6.18 of the given covariance', () => {
    const cov = [
      [0.04, -0.012],
      [-0.012, 0.01],
    ];
    const svg = renderFisherEllipsePlotSvg({ xLabel: 'p', yLabel: 'q', fiducial: [2, 1], forecasts: [{ label: 'F', covariance: cov }] });
    const xAxis = axisFromTicks(xTicks(svg, () => true));
    const yAxis = axisFromTicks(yTicks(svg, () => true));
    const det = cov[0][0] * cov[1][1] - cov[0][1] ** 2;
    const chi2 = ([px, py]: [number, number]): number => {
      const dx = xAxis.toValue(px) - 2;
      const dy = yAxis.toValue(py) - 1;
      return (cov[1][1] * dx * dx - 2 * cov[0][1] * dx * dy + cov[0][0] * dy * dy) / det;
    };
    const ellipses = drawnElements(svg, 'path').filter((p) => p.d.endsWith('Z') && p['fill-opacity'] !== undefined);
    const solid = ellipses.find((p) => p['stroke-dasharray'] === undefined);
    const dashed = ellipses.find((p) => p['stroke-dasharray'] !== undefined);
    // Gaussian 1- and 2-sigma masses in 2-D: Delta chi^2 = -2 ln(1 - 0.6827) = 2.296 and -2 ln(1 - 0.9545) = 6.180.
    for (const p of pathPoints(solid?.d ?? '')[0]) expect(chi2(p)).toBeCloseTo(2.296, 1);
    for (const p of pathPoints(dashed?.d ?? '')[0]) expect(chi2(p)).toBeCloseTo(6.18, 1);
  });

  it('refuses empty or broken chains and bad covariances with a message naming them', () => {
    const good = Float64Array.from({ length: 50 }, (_, i) => Math.sin(i));
    expect(() => renderCornerPlotSvg({ parameters: [{ label: 'a' }], sets: [{ label: 's', samples: [new Float64Array()] }] })).toThrow(/samples\[0\] \(a\) is empty/);
    expect(() => renderCornerPlotSvg({ parameters: [{ label: 'a' }, { label: 'b' }], sets: [{ label: 's', samples: [good] }] })).toThrow(
      /sets\[0\]\.samples has 1 entries but parameters has 2/,
    );
    expect(() =>
      renderCornerPlotSvg({ parameters: [{ label: 'a' }, { label: 'b' }], sets: [{ label: 's', samples: [good, good.subarray(1)] }] }),
    ).toThrow(/sets\[0\]\.samples\[1\] has 49 entries/);
    expect(() => renderTracePlotSvg({ parameters: [{ label: 'a', chains: [] }] })).toThrow(InputError);
    expect(() => renderTracePlotSvg({ parameters: [{ label: 'a', chains: [Float64Array.of(1, Number.NaN)] }] })).toThrow(/trace parameters\[0\]\.chains\[0\] \(a\)\[1\] is NaN/);
    expect(() =>
      renderFisherEllipsePlotSvg({ xLabel: 'p', yLabel: 'q', fiducial: [0, 0], forecasts: [{ label: 'F', covariance: [[1, 0], [0, -1]] }] }),
    ).toThrow(/forecasts\[0\]\.covariance \(F\) is not positive definite/);
  });
});
