import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/contracts/input-error.js';
import type { ReportInput } from '../../src/report/html/report-input.js';
import { renderReportHtml } from '../../src/report/html/render-report.js';
import { renderFisherEllipsePlotSvg } from '../../src/report/plots/fisher-ellipse-plot.js';
import { syntheticReportInput } from './synthetic-report.js';

const figure = renderFisherEllipsePlotSvg({ xLabel: 'a', yLabel: 'b', fiducial: [0, 0], forecasts: [{ label: 'F', covariance: [[1, 0], [0, 1]] }] });

function minimal(): ReportInput {
  return {
    title: 'Run <one> & "two"',
    assumptions: [{ key: 'scale cuts', value: 'k < 0.2 h/Mpc <b>' }],
    parameters: [{ label: 'b_1', mean: 2.01234, sd: 0.0345, interval68: [1.98, 2.05], interval95: [1.94, 2.08], truth: 2.2, rHat: 1.02, ess: 350 }],
    fitQuality: [{ label: 'P + B', chiSquare: 210.44, dof: 200, pValue: 0.2921 }],
    figures: [{ title: 'Ellipse', caption: 'x < y', svg: figure }],
  };
}

describe('the HTML report', () => {
  it('escapes every given string and prints numbers to the precision of their uncertainty', () => {
    const html = renderReportHtml(minimal());
    expect(html).toContain('<title>Run &lt;one&gt; &amp; &quot;two&quot;</title>');
    expect(html).toContain('k &lt; 0.2 h/Mpc &lt;b&gt;');
    expect(html).not.toContain('<b>');
    expect(html).toContain('x &lt; y');
    // sd 0.0345 -> two significant digits -> 3 decimals.
    expect(html).toContain('<td>2.012</td><td>0.035</td><td>[1.980, 2.050]</td><td>[1.940, 2.080]</td>');
    expect(html).toContain('<td>b<sub>1</sub></td>');
    expect(html).toContain('<td>210.4</td><td>200</td><td>1.05</td><td>0.292</td>');
  });

  it('flags R-hat above 1.01, ESS below 400 and a truth outside the 95% interval', () => {
    const html = renderReportHtml(minimal());
    expect(html).toContain('<td class="flag">2.200</td><td class="flag">1.020</td><td class="flag">350</td>');
    const calm = minimal();
    calm.parameters = [{ ...calm.parameters[0], truth: 2.0, rHat: 1.001, ess: 4000 }];
    expect(renderReportHtml(calm)).not.toContain('class="flag"');
  });

  it('is self-contained: inline CSS and SVG, no scripts, no outside addresses', () => {
    const input = syntheticReportInput();
    const html = renderReportHtml(input);
    expect(html).not.toMatch(/<script|<link rel="stylesheet"|<img|@import|url\(/i);
    const addresses = [...html.matchAll(/(?:https?:)?\/\/[^\s"'<>]+/g)].map((m) => m[0]);
    expect(new Set(addresses)).toEqual(new Set(['http://www.w3.org/2000/svg']));
    expect(html.match(/<svg /g)?.length).toBe(input.figures.length);
  });

  it('gives byte-identical output for the same input', () => {
    expect(renderReportHtml(syntheticReportInput())).toBe(renderReportHtml(syntheticReportInput()));
  });

  it('refuses broken numbers, reversed intervals and foreign markup, naming the field', () => {
    const bad = (change: (r: ReportInput) => void): (() => string) => () => {
      const r = minimal();
      change(r);
      return renderReportHtml(r);
    };
    expect(bad((r) => (r.parameters = [{ ...r.parameters[0], mean: Number.NaN }]))).toThrow(/parameters\[0\] \(b_1\)\.mean is NaN/);
    expect(bad((r) => (r.parameters = [{ ...r.parameters[0], interval68: [2, 1] }]))).toThrow(/interval68 has lower 2 above upper 1/);
    expect(bad((r) => (r.fitQuality = [{ ...r.fitQuality[0], pValue: 1.5 }]))).toThrow(/pValue must lie in \[0, 1\]/);
    expect(bad((r) => (r.fitQuality = [{ ...r.fitQuality[0], dof: 0 }]))).toThrow(InputError);
    expect(bad((r) => (r.figures = [{ title: 'X', caption: '', svg: '<p>no</p>' }]))).toThrow(/figures\[0\] \(X\)\.svg is not a single <svg> element/);
    expect(bad((r) => (r.figures = [{ title: 'X', caption: '', svg: '<svg><script>alert(1)</script></svg>' }]))).toThrow(/scripts/);
    expect(bad((r) => (r.figures = [{ title: 'X', caption: '', svg: '<svg><a href="http://x">x</a></svg>' }]))).toThrow(/links/);
  });
});
