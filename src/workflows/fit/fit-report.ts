import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { shapeClassOf } from '../../bispectrum/shape-classes.js';
import type { MeasuredEntry } from '../../data/data-vector.js';
import { loadMeasurementBundle, type MeasurementBundle } from '../../data/measurement-bundle.js';
import { createJointLikelihood } from '../../inference/likelihood/joint-likelihood-options.js';
import type { JointLikelihood } from '../../inference/likelihood/joint-likelihood.js';
import { renderBispectrumPlotSvg } from '../../report/plots/bispectrum-plot.js';
import { renderCornerPlotSvg } from '../../report/plots/corner-plot.js';
import { renderMultipolePlotSvg } from '../../report/plots/multipole-plot.js';
import { renderTracePlotSvg } from '../../report/plots/trace-plot.js';
import { renderTriangleShapeMapSvg } from '../../report/plots/triangle-shape-map.js';
import { renderReportHtml } from '../../report/html/render-report.js';
import type { ReportFigure } from '../../report/html/report-input.js';
import { loadFinishedRun, type FinishedRun } from './finished-run.js';
import type { FitSummary } from './fit-summary.js';
import { modelVectorAt } from './model-at-point.js';
import { parameterLabel } from './parameter-labels.js';
import type { RunConfig } from './run-config.js';

/** Most draws drawn in the corner plot (evenly thinned from the kept draws). */
export const CORNER_DRAWS = 6000;

interface KeptBlock {
  readonly entries: MeasuredEntry[];
  readonly data: number[];
  readonly sigma: number[];
  readonly model: number[];
}

/** Kept (post-cut) entries of each block with data, sigma (covariance diagonal) and best-fit model. */
function keptBlocks(likelihood: JointLikelihood, bundle: MeasurementBundle, model: Float64Array): Map<string, KeptBlock> {
  const out = new Map<string, KeptBlock>();
  const idx = likelihood.selection.indices;
  const n = likelihood.covariance.size;
  idx.forEach((i, a) => {
    const e = bundle.dataVector.entries[i];
    const b = out.get(e.block) ?? { entries: [], data: [], sigma: [], model: [] };
    b.entries.push(e);
    b.data.push(bundle.dataVector.values[i]);
    b.sigma.push(Math.sqrt(likelihood.covariance.matrix[a * n + a]));
    b.model.push(model[i]);
    out.set(e.block, b);
  });
  return out;
}

function cornerSamples(run: FinishedRun): number[][] {
  const members = run.history.members;
  const kept = run.history.steps - run.burnIn;
  const stride = Math.max(1, Math.ceil((kept * members) / CORNER_DRAWS));
  const samples = run.names.map(() => [] as number[]);
  let i = 0;
  for (let s = run.burnIn; s < run.history.steps; s++) {
    for (let m = 0; m < members; m++, i++) {
      if (i % stride !== 0) continue;
      const row = run.history.row(s, m);
      run.names.forEach((_, p) => samples[p].push(row[1 + p]));
    }
  }
  return samples;
}

function figures(summary: FitSummary, run: FinishedRun, blocks: Map<string, KeptBlock>, dkB: number): ReportFigure[] {
  const truthOf = (name: string) => summary.parameters.find((r) => r.name === name)?.truth ?? undefined;
  const out: ReportFigure[] = [
    {
      title: 'Posterior',
      caption: `1-D marginals and 68% / 95% credible regions of the sampled parameters (${summary.sampler.keptDraws} kept draws${summary.sampler.keptDraws > CORNER_DRAWS ? `, ${CORNER_DRAWS} drawn` : ''}); lines mark the truth where known.`,
      svg: renderCornerPlotSvg({
        parameters: run.names.map((n) => ({ label: parameterLabel(n), truth: truthOf(n) })),
        sets: [{ label: 'P + B', samples: cornerSamples(run) }],
      }),
    },
  ];
  const power = [...blocks.entries()].filter(([b]) => b.startsWith('P'));
  if (power.length) {
    out.push({
      title: 'Power-spectrum multipoles',
      caption: 'k P_ℓ(k) of the data (points, 1σ from the covariance diagonal) and the best-fit model (lines); below, residuals in units of σ.',
      svg: renderMultipolePlotSvg({
        multipoles: power.map(([, b]) => ({ ell: b.entries[0].ell, k: b.entries.map((e) => e.kEffective[0]), data: b.data, sigma: b.sigma, model: b.model })),
      }),
    });
  }
  for (const [block, b] of blocks) {
    if (!block.startsWith('B')) continue;
    const shapeClass = b.entries.map((e) => shapeClassOf(e.shells[0], e.shells[1], e.shells[2], e.k[0], e.k[1], e.k[2], dkB));
    out.push({
      title: `Bispectrum ${block}`,
      caption: `${block} per kept triangle bin (lexicographic order) with 1σ errors and the best-fit model, coloured by shape class; below, residuals in units of σ.`,
      svg: renderBispectrumPlotSvg({ ell: b.entries[0].ell, data: b.data, sigma: b.sigma, model: b.model, shapeClass }),
    });
    out.push({
      title: `Triangle-shape map of ${block} residuals`,
      caption: `(data − model)/σ of ${block} for every kept triangle bin at (k2/k1, k3/k1).`,
      svg: renderTriangleShapeMapSvg({
        k1: b.entries.map((e) => e.k[0]),
        k2: b.entries.map((e) => e.k[1]),
        k3: b.entries.map((e) => e.k[2]),
        value: b.data.map((d, i) => (d - b.model[i]) / b.sigma[i]),
        colourLabel: '(data − model)/σ',
      }),
    });
  }
  out.push({
    title: 'Traces',
    caption: `Every walker or chain against step; the shaded part (${summary.sampler.burnIn} steps) is dropped as burn-in.`,
    svg: renderTracePlotSvg({
      parameters: run.names.map((n, p) => ({ label: parameterLabel(n), truth: truthOf(n), chains: Array.from({ length: run.history.members }, (_, m) => run.history.series(m, p)) })),
      burnIn: summary.sampler.burnIn,
    }),
  });
  return out;
}

/** Write report.html and figures/*.svg for a summarised run; returns the report path. */
export function writeFitReport(config: RunConfig, summary: FitSummary, likelihood: JointLikelihood = createJointLikelihood(config.likelihood)): string {
  const run = loadFinishedRun(config.output);
  const bundle = loadMeasurementBundle(config.likelihood.bundle);
  const best = likelihood.pointAt(Float64Array.from(summary.bestFit.theta), { bestFit: true });
  const model = modelVectorAt(likelihood, bundle, { ...best.values, ...(best.marginalised ?? {}) });
  const figs = figures(summary, run, keptBlocks(likelihood, bundle, model), bundle.bispectrum?.dk ?? 0);
  const folder = join(config.output, 'figures');
  mkdirSync(folder, { recursive: true });
  figs.forEach((f, i) => writeFileSync(join(folder, `${String(i + 1).padStart(2, '0')}-${f.title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/-$/, '')}.svg`), f.svg));
  const html = renderReportHtml({
    title: summary.title,
    subtitle: `${config.note ? `${config.note} — ` : ''}config ${config.file}; ${summary.software}`,
    assumptions: summary.assumptions,
    parameters: summary.parameters.map((r) => ({
      label: r.kind === 'derived' ? `${parameterLabel(r.name)} (derived)` : parameterLabel(r.name),
      mean: r.mean,
      sd: r.sd,
      interval68: r.interval68,
      interval95: r.interval95,
      bestFit: r.bestFit ?? undefined,
      truth: r.truth ?? undefined,
      rHat: r.rhat ?? undefined,
      ess: r.ess ?? undefined,
    })),
    fitQuality: [{ label: 'P + B (best fit)', chiSquare: summary.bestFit.chi2, dof: summary.bestFit.dof, pValue: summary.bestFit.pValue }],
    figures: figs,
    notes: [
      `Sampler: ${summary.sampler.method}, ${summary.sampler.steps} steps of ${summary.sampler.members} members (status ${summary.sampler.status}), ${summary.sampler.burnIn} burn-in steps dropped, mean acceptance ${summary.sampler.acceptance === null ? '—' : summary.sampler.acceptance.toFixed(3)}. R-hat is rank-normalised split R-hat over ${summary.sampler.method.includes('ensemble') ? 'walkers (walkers of one ensemble are not independent chains)' : 'independent chains'}.`,
      `Best fit from ${summary.bestFit.starts} optimiser starts (${summary.bestFit.startsAgreeing} reached the same maximum). Analytically marginalised parameters at the best fit: ${Object.entries(summary.marginalisedBestFit).map(([k, v]) => `${k} = ${Number(v.toPrecision(4))}`).join(', ') || 'none'}.`,
      'Residuals use the square root of the covariance diagonal; neighbouring bins may be correlated.',
    ],
  });
  const path = join(config.output, 'report.html');
  writeFileSync(path, html);
  return path;
}
