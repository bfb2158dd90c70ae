import type { JointLikelihood } from '../../inference/likelihood/joint-likelihood.js';
import type { ModeSearchResult } from '../../inference/optimize/find-posterior-mode.js';
import { version } from '../../io/package-version.js';
import { fitAssumptions, type Assumption } from './fit-assumptions.js';
import { keptSeries, type FinishedRun } from './finished-run.js';
import { posteriorRow, type PosteriorRow } from './posterior-summary.js';
import type { RunConfig } from './run-config.js';

/**
 * The summary of a finished fit (summary.json, layout "treble-fit-summary" 1):
 * posterior rows of the sampled parameters and of derived quantities (sigma8,
 * f, derived expressions; from at most DERIVED_DRAWS evenly thinned kept draws),
 * the best fit with its chi-square, dof and p-value, the best-fit values of
 * the analytically marginalised parameters, and — when the data come with a
 * truth — each truth against the posterior. Holds nothing that changes
 * between two runs of the same config and seed.
 */
export const DERIVED_DRAWS = 1000;

export interface SummaryRow extends PosteriorRow {
  readonly kind: 'sampled' | 'derived';
  readonly bestFit: number | null;
  readonly truth: number | null;
  /** (mean - truth) / sd. */
  readonly pull: number | null;
  readonly truthWithin95: boolean | null;
}

export interface FitSummary {
  readonly format: 'treble-fit-summary';
  readonly formatVersion: 1;
  readonly software: string;
  readonly title: string;
  readonly configFile: string;
  readonly assumptions: readonly Assumption[];
  readonly sampler: {
    readonly method: string;
    readonly status: string;
    readonly steps: number;
    readonly burnIn: number;
    readonly members: number;
    readonly keptDraws: number;
    readonly acceptance: number | null;
  };
  readonly parameters: readonly SummaryRow[];
  readonly marginalisedBestFit: Readonly<Record<string, number>>;
  readonly bestFit: {
    readonly theta: readonly number[];
    readonly logPosterior: number;
    readonly chi2: number;
    readonly dof: number;
    readonly pValue: number;
    readonly startsAgreeing: number;
    readonly starts: number;
  };
  /** Readable table of the parameters (summary.txt). */
  readonly table: string;
}

function row(kind: SummaryRow['kind'], r: PosteriorRow, best: number | undefined, truth: number | undefined): SummaryRow {
  const t = truth ?? null;
  return {
    ...r,
    kind,
    bestFit: best ?? null,
    truth: t,
    pull: t === null || !(r.sd > 0) ? null : (r.mean - t) / r.sd,
    truthWithin95: t === null ? null : t >= r.interval95[0] && t <= r.interval95[1],
  };
}

const fmt = (x: number | null | undefined, digits = 4) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : Number(x.toPrecision(digits)).toString());

function table(rows: readonly SummaryRow[], fit: FitSummary['bestFit']): string {
  const head = ['parameter', 'mean', 'sd', '68% interval', '95% interval', 'best fit', 'truth', 'R-hat', 'ESS'];
  const body = rows.map((r) => [
    r.kind === 'derived' ? `${r.name} (derived)` : r.name,
    fmt(r.mean),
    fmt(r.sd, 3),
    `[${fmt(r.interval68[0])}, ${fmt(r.interval68[1])}]`,
    `[${fmt(r.interval95[0])}, ${fmt(r.interval95[1])}]`,
    fmt(r.bestFit),
    r.truth === null ? '—' : `${fmt(r.truth)}${r.truthWithin95 ? '' : ' (outside 95%)'}`,
    r.rhat === null ? '—' : r.rhat.toFixed(3),
    r.ess === null ? '—' : Math.round(r.ess).toString(),
  ]);
  const widths = head.map((h, c) => Math.max(h.length, ...body.map((b) => b[c].length)));
  const line = (cells: string[]) => cells.map((x, c) => (c === 0 ? x.padEnd(widths[c]) : x.padStart(widths[c]))).join('  ');
  return `${[line(head), ...body.map(line)].join('\n')}\nbest fit: chi2 = ${fit.chi2.toFixed(2)} for ${fit.dof} dof, p = ${fit.pValue.toPrecision(3)}\n`;
}

export function summariseFit(config: RunConfig, likelihood: JointLikelihood, run: FinishedRun, mode: ModeSearchResult): FitSummary {
  const truth = config.truth ?? {};
  const bestTheta = Float64Array.from(mode.best.theta);
  const bestPoint = likelihood.pointAt(bestTheta, { bestFit: true });
  const rows: SummaryRow[] = run.names.map((name, p) => row('sampled', posteriorRow(name, keptSeries(run, p)), bestPoint.values[name], truth[name]));

  // Derived and provided quantities on evenly thinned kept draws, one series per member.
  const sampled = new Set(run.names);
  const fixed = new Set(Object.keys(likelihood.parameters.fixed));
  const derivedNames = Object.keys(bestPoint.values).filter((n) => !sampled.has(n) && !fixed.has(n) && !(n in (bestPoint.marginalised ?? {})));
  if (derivedNames.length > 0) {
    const members = run.history.members;
    const kept = run.history.steps - run.burnIn;
    const stride = Math.max(1, Math.ceil((kept * members) / DERIVED_DRAWS));
    const series = derivedNames.map(() => Array.from({ length: members }, () => [] as number[]));
    for (let s = run.burnIn; s < run.history.steps; s += stride) {
      for (let m = 0; m < members; m++) {
        const values = likelihood.pointAt(Float64Array.from(run.history.row(s, m).subarray(1))).values;
        derivedNames.forEach((n, i) => series[i][m].push(values[n]));
      }
    }
    derivedNames.forEach((n, i) => {
      const chains = series[i].map((c) => Float64Array.from(c));
      const r = posteriorRow(n, chains, false);
      // A quantity the sampled parameters do not move (e.g. the template's sigma8) is a constant, not a posterior.
      if (r.sd > 1e-10 * Math.abs(r.mean)) rows.push(row('derived', r, bestPoint.values[n], truth[n]));
    });
  }
  const bestFit = {
    theta: mode.best.theta,
    logPosterior: mode.best.logPosterior,
    chi2: bestPoint.chi2,
    dof: bestPoint.dof,
    pValue: bestPoint.pValue,
    startsAgreeing: mode.agreeing,
    starts: mode.climbs.length,
  };
  const d = run.sidecar.diagnostics;
  return {
    format: 'treble-fit-summary',
    formatVersion: 1,
    software: `treble ${version}`,
    title: config.title,
    configFile: config.file,
    assumptions: fitAssumptions(config, likelihood),
    sampler: {
      method: String(run.sidecar.sampler.method),
      status: run.sidecar.status,
      steps: run.history.steps,
      burnIn: run.burnIn,
      members: run.history.members,
      keptDraws: (run.history.steps - run.burnIn) * run.history.members,
      acceptance: d ? d.acceptance.mean : null,
    },
    parameters: rows,
    marginalisedBestFit: bestPoint.marginalised ?? {},
    bestFit,
    table: table(rows, bestFit),
  };
}
