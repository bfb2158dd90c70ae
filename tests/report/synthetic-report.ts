/** An invented, seeded report with every kind of plot, for the browser and determinism tests. */
import { bulkEffectiveSampleSize } from '../../src/inference/diagnostics/effective-sample-size.js';
import { poolDraws } from '../../src/inference/diagnostics/pool-draws.js';
import { pooledQuantile } from '../../src/inference/diagnostics/pooled-quantile.js';
import { rankNormalizedSplitRhat } from '../../src/inference/diagnostics/rhat.js';
import type { ReportInput, ReportParameterRow } from '../../src/report/html/report-input.js';
import { renderBispectrumPlotSvg } from '../../src/report/plots/bispectrum-plot.js';
import { renderCornerPlotSvg } from '../../src/report/plots/corner-plot.js';
import { renderFisherEllipsePlotSvg } from '../../src/report/plots/fisher-ellipse-plot.js';
import { renderLinePlotSvg } from '../../src/report/plots/line-plot.js';
import { renderMultipolePlotSvg } from '../../src/report/plots/multipole-plot.js';
import { renderTracePlotSvg } from '../../src/report/plots/trace-plot.js';
import { renderTriangleShapeMapSvg } from '../../src/report/plots/triangle-shape-map.js';
import {
  SYNTHETIC_PARAMETERS,
  syntheticBispectrum,
  syntheticChains,
  syntheticCornerInput,
  syntheticFisherInput,
  syntheticMultipoleInput,
  syntheticShapeMapInput,
  syntheticShiftInput,
  syntheticTraceInput,
} from './synthetic-plot-inputs.js';

export function syntheticReportInput(): ReportInput {
  const burnIn = 200;
  const chains = syntheticChains(4, 1200, 5);
  const kept = chains.map((perChain) => perChain.map((c) => c.subarray(burnIn)));
  const parameters: ReportParameterRow[] = SYNTHETIC_PARAMETERS.map((p, i) => {
    const draws = poolDraws(kept[i]);
    const mean = draws.reduce((a, b) => a + b, 0) / draws.length;
    const sd = Math.sqrt(draws.reduce((a, b) => a + (b - mean) ** 2, 0) / (draws.length - 1));
    const q = (x: number): number => pooledQuantile(kept[i], x);
    return {
      label: p.label,
      mean,
      sd,
      interval68: [q(0.16), q(0.84)],
      interval95: [q(0.025), q(0.975)],
      bestFit: p.mean,
      truth: p.truth,
      rHat: rankNormalizedSplitRhat(kept[i]),
      ess: bulkEffectiveSampleSize(kept[i]),
    };
  });
  const b = syntheticBispectrum(9);
  return {
    title: 'Invented test run <P + B joint fit>',
    subtitle: 'synthetic chains & data; not a survey',
    assumptions: [
      { key: 'model', value: 'tree-level P_ℓ and B_0, B_2' },
      { key: 'scale cuts', value: 'k_max(P) = 0.20 h/Mpc; k_max(B) = 0.14 h/Mpc' },
      { key: 'covariance', value: 'analytic Gaussian' },
    ],
    parameters,
    fitQuality: [
      { label: 'P_ℓ', chiSquare: 63.1, dof: 57, pValue: 0.27 },
      { label: 'P + B', chiSquare: 220.4, dof: 199, pValue: 0.143 },
    ],
    figures: [
      { title: 'Posterior', caption: 'Marginals and 68%/95% regions; dashed lines mark the truth.', svg: renderCornerPlotSvg(syntheticCornerInput(chains, burnIn)) },
      { title: 'Traces', caption: 'Shaded: burn-in.', svg: renderTracePlotSvg(syntheticTraceInput(chains, burnIn)) },
      { title: 'Power-spectrum multipoles', caption: 'Data and best fit.', svg: renderMultipolePlotSvg(syntheticMultipoleInput(3)) },
      { title: 'Bispectrum monopole', caption: 'By triangle index.', svg: renderBispectrumPlotSvg(b.b0) },
      { title: 'Bispectrum quadrupole', caption: 'By triangle index.', svg: renderBispectrumPlotSvg(b.b2) },
      { title: 'Residuals by shape', caption: 'B_0 residuals.', svg: renderTriangleShapeMapSvg(syntheticShapeMapInput(b)) },
      { title: 'Shifts against k_max', caption: 'Bands: 1 sigma.', svg: renderLinePlotSvg(syntheticShiftInput()) },
      { title: 'Forecast', caption: 'Ellipses.', svg: renderFisherEllipsePlotSvg(syntheticFisherInput()) },
    ],
    notes: ['All numbers on this page are invented for a test.'],
  };
}
