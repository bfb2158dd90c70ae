import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/contracts/input-error.js';
import { renderBispectrumPlotSvg } from '../../src/report/plots/bispectrum-plot.js';
import { renderMultipolePlotSvg } from '../../src/report/plots/multipole-plot.js';
import { axisFromTicks, drawnElements, xTicks, yTicks } from './svg-reading.js';

const k = Float64Array.from({ length: 10 }, (_, i) => 0.02 + 0.02 * i);
const model0 = k.map((q) => 30000 - 80000 * q); // k P_0 from ~580 to 2600
const data0 = model0.map((m, i) => m * (1 + 0.01 * ((i % 3) - 1)));
const sigma0 = model0.map((m) => 0.02 * m);

describe('data against model plots', () => {
  it('puts each multipole data point and residual where the drawn axes say', () => {
    const model2 = model0.map((m) => 0.5 * m);
    const svg = renderMultipolePlotSvg({
      multipoles: [
        { ell: 0, k, data: data0, sigma: sigma0, model: model0 },
        { ell: 2, k, data: model2.map((m) => m * 1.03), sigma: sigma0, model: model2 },
      ],
    });
    const x = axisFromTicks(xTicks(svg, () => true));
    const yMain = axisFromTicks(yTicks(svg, (t) => Math.abs(Number(t.text)) >= 100));
    const yResid = axisFromTicks(yTicks(svg, (t) => Math.abs(Number(t.text)) < 10));
    const circles = drawnElements(svg, 'circle');
    const main = circles.filter((c) => c.r === '3.2');
    const resid = circles.filter((c) => c.r === '2.8');
    expect(main).toHaveLength(k.length);
    expect(resid).toHaveLength(k.length);
    for (let i = 0; i < k.length; i++) {
      expect(Number(main[i].cx)).toBeCloseTo(x.toPixel(k[i]), 1);
      expect(Number(main[i].cy)).toBeCloseTo(yMain.toPixel(k[i] * data0[i]), 1);
      expect(Number(resid[i].cy)).toBeCloseTo(yResid.toPixel((data0[i] - model0[i]) / sigma0[i]), 1);
    }
    // Each error bar spans k (P - sigma) to k (P + sigma).
    const bars = drawnElements(svg, 'line').filter((l) => l.x1 === l.x2 && Math.abs(Number(l.x1) - Number(main[4].cx)) < 0.01);
    const bar = bars.find((l) => Math.abs(Number(l.y1) - yMain.toPixel(k[4] * (data0[4] - sigma0[4]))) < 0.05);
    expect(bar).toBeDefined();
    expect(Number(bar?.y2)).toBeCloseTo(yMain.toPixel(k[4] * (data0[4] + sigma0[4])), 1);
  });

  it('colours and shapes bispectrum points by triangle class, one style per class', () => {
    const classes = ['equilateral', 'isosceles', 'isosceles', 'squeezed', 'flattened', 'general', 'equilateral'];
    const n = classes.length;
    const model = Float64Array.from({ length: n }, (_, i) => 1000 + 100 * i);
    const svg = renderBispectrumPlotSvg({ ell: 0, data: model.map((m) => m + 10), sigma: model.map(() => 20), model, shapeClass: classes, yScale: 'linear' });
    const x = axisFromTicks(xTicks(svg, () => true));
    const y = axisFromTicks(yTicks(svg, (t) => Math.abs(Number(t.text)) >= 100));
    // Equilateral triangles are discs: the two of them sit at indices 0 and 6.
    const discs = drawnElements(svg, 'circle').filter((c) => c.r === '3.2');
    expect(discs.map((c) => Number(c.cx))).toEqual([0, 6].map((i) => Number(x.toPixel(i).toFixed(2))));
    expect(Number(discs[1].cy)).toBeCloseTo(y.toPixel(model[6] + 10), 1);
    // Markers are drawn per triangle in index order, each in the data and in the residual panel, before the
    // legend: filled shapes have a white outline, the cross is stroked.
    const markers = drawnElements(svg, 'circle|rect|path').filter((e) => e.stroke === '#ffffff' || e['stroke-width'] === '1.6');
    const colourOf = (i: number): string => markers[2 * i].fill === 'none' ? markers[2 * i].stroke : markers[2 * i].fill;
    const tagOf = (i: number): string => markers[2 * i].tag;
    expect(colourOf(1)).toBe(colourOf(2));
    expect(colourOf(0)).toBe(colourOf(6));
    expect(new Set([0, 1, 3, 4, 5].map(colourOf)).size).toBe(5);
    expect(markers[2 * 1 + 1].fill).toBe(colourOf(1)); // the residual marker shares the colour
    expect([0, 3].map(tagOf)).toEqual(['circle', 'rect']);
  });

  it('refuses mismatched, non-finite or unknown input with a message naming it', () => {
    const base = { ell: 0, k, data: data0, sigma: sigma0, model: model0 };
    expect(() => renderMultipolePlotSvg({ multipoles: [] })).toThrow(InputError);
    expect(() => renderMultipolePlotSvg({ multipoles: [{ ...base, model: model0.subarray(1) }] })).toThrow(/multipoles\[0\]\.model has 9 entries but multipoles\[0\]\.k has 10/);
    expect(() => renderMultipolePlotSvg({ multipoles: [{ ...base, data: [...data0.subarray(1), Number.NaN] }] })).toThrow(/multipoles\[0\]\.data\[9\] is NaN/);
    expect(() => renderMultipolePlotSvg({ multipoles: [{ ...base, sigma: sigma0.map((s, i) => (i === 2 ? 0 : s)) }] })).toThrow(/sigma\[2\] is 0/);
    const b = { ell: 0, data: [1, 2], sigma: [1, 1], model: [1, 2], shapeClass: ['equilateral', 'obtuse'] };
    expect(() => renderBispectrumPlotSvg(b)).toThrow(/shapeClass\[1\] is "obtuse"/);
    expect(() => renderBispectrumPlotSvg({ ...b, shapeClass: ['general'] })).toThrow(/shapeClass has 1 entries but bispectrum data has 2/);
  });
});
