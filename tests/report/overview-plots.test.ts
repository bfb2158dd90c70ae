import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/contracts/input-error.js';
import { renderLinePlotSvg } from '../../src/report/plots/line-plot.js';
import { renderTriangleShapeMapSvg } from '../../src/report/plots/triangle-shape-map.js';
import { axisFromTicks, drawnElements, pathPoints, xTicks, yTicks } from './svg-reading.js';

describe('shape map and line plots', () => {
  it('places triangles at (k2/k1, k3/k1) whatever the side order, largest |residual| drawn last', () => {
    // Sides given unsorted: (0.1, 0.2, 0.2) is the shape (1, 0.5); (0.3, 0.1, 0.25) is (0.8333, 0.3333).
    const svg = renderTriangleShapeMapSvg({ k1: [0.1, 0.3, 0.2], k2: [0.2, 0.1, 0.2], k3: [0.2, 0.25, 0.2], value: [-4, 0.5, 0] });
    const xAxis = axisFromTicks(xTicks(svg, (t) => Number(t.text) <= 1.0 && t.text.includes('.')));
    const yAxis = axisFromTicks(yTicks(svg, (t) => t.x < 100));
    const discs = drawnElements(svg, 'circle');
    expect(discs).toHaveLength(3);
    const at = (c: Record<string, string>): [number, number] => [xAxis.toValue(Number(c.cx)), yAxis.toValue(Number(c.cy))];
    // Drawn in order of |value|: 0 (equilateral), 0.5, then -4.
    expect(at(discs[0])[0]).toBeCloseTo(1, 3);
    expect(at(discs[0])[1]).toBeCloseTo(1, 3);
    expect(at(discs[1])[0]).toBeCloseTo(0.25 / 0.3, 3);
    expect(at(discs[1])[1]).toBeCloseTo(0.1 / 0.3, 3);
    expect(at(discs[2])[0]).toBeCloseTo(1, 3);
    expect(at(discs[2])[1]).toBeCloseTo(0.5, 3);
    // Zero residual is the neutral middle of the scale; the most negative one is pure blue-ish (blue channel largest).
    expect(discs[0].fill).toBe('#f5f2eb');
    const [r, , b] = [1, 3, 5].map((i) => parseInt(discs[2].fill.slice(i, i + 2), 16));
    expect(b).toBeGreaterThan(r);
    expect(() => renderTriangleShapeMapSvg({ k1: [0.1], k2: [0.1], k3: [0], value: [1] })).toThrow(/shape map k3\[0\] is 0/);
  });

  it('draws line series with bands and point series with error bars where the axes say', () => {
    const svg = renderLinePlotSvg({
      xLabel: 'x',
      yLabel: 'y',
      referenceY: [0],
      series: [
        { label: 'pts', x: [1.5, 2.5], y: [-1, 3], lower: [-2, 2], upper: [0, 4], style: 'points' },
        { label: 'band', x: [1, 2, 3], y: [0, 1, 2], lower: [-1, 0, 1], upper: [1, 2, 3] },
      ],
    });
    const xAxis = axisFromTicks(xTicks(svg, () => true));
    const yAxis = axisFromTicks(yTicks(svg, () => true));
    const band = drawnElements(svg, 'path').find((p) => p['fill-opacity'] === '0.2');
    const outline = pathPoints(band?.d ?? '')[0].map(([px, py]) => [xAxis.toValue(px), yAxis.toValue(py)]);
    const expected = [[1, 1], [2, 2], [3, 3], [3, 1], [2, 0], [1, -1]];
    outline.forEach(([vx, vy], i) => {
      expect(vx).toBeCloseTo(expected[i][0], 2);
      expect(vy).toBeCloseTo(expected[i][1], 2);
    });
    // The first series (points) uses disc markers at (1.5, -1) and (2.5, 3); the legend adds one more disc.
    const discs = drawnElements(svg, 'circle').filter((c) => c.r === '3.2');
    expect(discs.map((c) => [xAxis.toValue(Number(c.cx)), yAxis.toValue(Number(c.cy))].map((v) => Number(v.toFixed(2))))).toEqual([
      [1.5, -1],
      [2.5, 3],
    ]);
    expect(() => renderLinePlotSvg({ xLabel: 'x', yLabel: 'y', series: [{ label: 's', x: [1], y: [1], lower: [0] }] })).toThrow(InputError);
  });
});
