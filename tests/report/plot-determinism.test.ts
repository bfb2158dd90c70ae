import { describe, expect, it } from 'vitest';
import { renderBispectrumPlotSvg } from '../../src/report/plots/bispectrum-plot.js';
import { renderCornerPlotSvg } from '../../src/report/plots/corner-plot.js';
import { renderMultipolePlotSvg } from '../../src/report/plots/multipole-plot.js';
import { renderTracePlotSvg } from '../../src/report/plots/trace-plot.js';
import { renderTriangleShapeMapSvg } from '../../src/report/plots/triangle-shape-map.js';
import {
  syntheticBispectrum,
  syntheticChains,
  syntheticCornerInput,
  syntheticMultipoleInput,
  syntheticShapeMapInput,
  syntheticTraceInput,
} from './synthetic-plot-inputs.js';

describe('plot output', () => {
  it('is byte-identical for equal inputs built separately, and differs when the data differ', () => {
    const render = (seed: number): string[] => {
      const chains = syntheticChains(3, 300, seed);
      const b = syntheticBispectrum(seed);
      return [
        renderCornerPlotSvg(syntheticCornerInput(chains, 50)),
        renderTracePlotSvg(syntheticTraceInput(chains, 50)),
        renderMultipolePlotSvg(syntheticMultipoleInput(seed)),
        renderBispectrumPlotSvg(b.b0),
        renderTriangleShapeMapSvg(syntheticShapeMapInput(b)),
      ];
    };
    const first = render(21);
    expect(render(21)).toEqual(first);
    render(22).forEach((svg, i) => expect(svg).not.toBe(first[i]));
    // Coordinates are rounded to 0.01 px: no long decimals, no exponents, no minus zero.
    for (const svg of first) {
      for (const [, value] of svg.matchAll(/="([^"#]*)"/g)) {
        for (const [number] of value.matchAll(/-?\d*\.?\d+(?:e[+-]?\d+)?/g)) expect(number).toMatch(/^(?!-0$)-?\d+(\.\d{1,2})?$/);
      }
    }
  });
});
