import { describe, expect, it } from 'vitest';
import { axisScale } from '../../src/report/svg/axis-scale.js';
import { axisDomain } from '../../src/report/svg/axis-domain.js';
import { divergingColour } from '../../src/report/svg/diverging-colour.js';
import { escapeMarkup } from '../../src/report/svg/escape-markup.js';
import { formatCoordinate } from '../../src/report/svg/format-coordinate.js';
import { linearTicks } from '../../src/report/svg/linear-ticks.js';
import { logTicks } from '../../src/report/svg/log-ticks.js';
import { parseRichText, richTextToSvg } from '../../src/report/svg/rich-text.js';
import { linearTickLabel, logTickLabel } from '../../src/report/svg/tick-label.js';
import { InputError } from '../../src/contracts/input-error.js';

describe('SVG core', () => {
  it('escapes every markup-significant character', () => {
    expect(escapeMarkup(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
  });

  it('rounds coordinates to 0.01 px without minus zero or exponents', () => {
    expect(formatCoordinate(12.345678)).toBe('12.35');
    expect(formatCoordinate(-0.001)).toBe('0');
    expect(formatCoordinate(1e-9)).toBe('0');
    expect(formatCoordinate(3)).toBe('3');
    expect(() => formatCoordinate(Number.NaN)).toThrow();
  });

  it('picks 1-2-5 linear ticks inside the range', () => {
    expect(linearTicks(0, 1, 5).values).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(linearTicks(-3.2, 7.9, 5).values).toEqual([-2, 0, 2, 4, 6]);
    const t = linearTicks(0.1, 0.35, 5);
    expect(t.step).toBeCloseTo(0.05, 15);
    expect(t.values).toEqual([0.1, 0.15, 0.2, 0.25, 0.3, 0.35]);
  });

  it('puts log ticks on powers of ten, adding 2 and 5 on narrow ranges', () => {
    expect(logTicks(0.003, 2000).values).toEqual([0.01, 0.1, 1, 10, 100, 1000]);
    expect(logTicks(0.015, 0.3).values).toEqual([0.02, 0.05, 0.1, 0.2]);
  });

  it('labels ticks with the decimals the step needs and powers of ten for extremes', () => {
    expect(linearTickLabel(0.25, 0.05)).toBe('0.25');
    expect(linearTickLabel(-2, 1)).toBe('\u22122');
    expect(linearTickLabel(2e6, 1e6)).toBe('2×10^{6}');
    expect(logTickLabel(1e-4)).toBe('10^{\u22124}');
    expect(logTickLabel(0.01)).toBe('0.01');
  });

  it('maps data to pixels linearly and logarithmically', () => {
    const lin = axisScale('linear', [2, 6], [100, 300]);
    expect(lin.map(2)).toBe(100);
    expect(lin.map(5)).toBe(250);
    const log = axisScale('log', [0.01, 1], [400, 0]);
    expect(log.map(0.1)).toBeCloseTo(200, 10);
    expect(() => axisScale('log', [0, 1], [0, 1])).toThrow(InputError);
  });

  it('pads the data range and refuses an axis with nothing finite', () => {
    expect(axisDomain([0, 10], 'linear', 0.1)).toEqual([-1, 11]);
    const [lo, hi] = axisDomain([1, 100], 'log', 0.5);
    expect(lo).toBeCloseTo(0.1, 12);
    expect(hi).toBeCloseTo(1000, 9);
    expect(() => axisDomain([Number.NaN], 'linear')).toThrow(InputError);
  });

  it('parses sub- and superscripts and escapes inside them', () => {
    expect(parseRichText('σ_8 k^{<2>}')).toEqual([
      { text: 'σ', shift: 'none' },
      { text: '8', shift: 'sub' },
      { text: ' k', shift: 'none' },
      { text: '<2>', shift: 'sup' },
    ]);
    expect(richTextToSvg('a_1')).toBe('a<tspan dy="0.3em" font-size="75%">1</tspan>');
    expect(richTextToSvg('x^{&}')).toContain('&amp;');
  });

  it('runs the diverging colours from blue through off-white to orange-red', () => {
    expect(divergingColour(0)).toBe('#f5f2eb');
    expect(divergingColour(-1)).toBe('#215fa8');
    expect(divergingColour(1)).toBe('#c24a12');
    expect(divergingColour(5)).toBe('#c24a12');
    // Halfway to blue: each channel halfway between the stops (0xf5 -> 0x21 gives 0x8b).
    expect(divergingColour(-0.5)).toBe('#8ba9ca');
  });
});
