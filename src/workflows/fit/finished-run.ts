import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { InputError } from '../../contracts/input-error.js';
import type { ChainHistory } from '../../inference/sampling/chain-history.js';
import { chainCsvHeader, chainFilePaths, readChainCsv, readRunJson } from '../../inference/sampling/chain-files.js';
import type { ChainSidecar } from '../../inference/sampling/sidecar.js';

/** File stem of the chain inside a run's output folder. */
export const CHAIN_STEM = 'chain';

export interface FinishedRun {
  readonly sidecar: ChainSidecar;
  readonly names: readonly string[];
  readonly history: ChainHistory;
  /** Steps dropped as burn-in / warm-up, from the sampler's diagnostics. */
  readonly burnIn: number;
}

/** The chain of a run whose sampler has stopped (converged, at maxSteps, or interrupted). */
export function loadFinishedRun(folder: string): FinishedRun {
  const paths = chainFilePaths(join(folder, CHAIN_STEM));
  if (!existsSync(paths.sidecar)) throw new InputError(`${folder}: no sampling run here (${paths.sidecar} is missing)`, { hint: 'run `treble fit <config>` first' });
  const sidecar = readRunJson<ChainSidecar>(paths.sidecar, 'run');
  if (sidecar.format !== 'treble-chain') throw new InputError(`${paths.sidecar}: not a treble chain sidecar`);
  if (sidecar.status === 'running') throw new InputError(`${paths.sidecar}: the run has not finished (status "running"); resume it with \`treble fit --resume\``);
  const names = sidecar.parameters.map((p) => p.name);
  const members = Number(sidecar.sampler.walkers ?? sidecar.sampler.chains);
  const history = readChainCsv(paths.chain, statSync(paths.chain).size, chainCsvHeader(sidecar.columns[1], names), members, names.length);
  const burnIn = sidecar.diagnostics?.burnInSteps ?? Math.floor(history.steps / 2);
  return { sidecar, names, history, burnIn };
}

/** Kept draws of parameter p, one series per walker or chain. */
export function keptSeries(run: FinishedRun, p: number): Float64Array[] {
  return Array.from({ length: run.history.members }, (_, m) => run.history.series(m, p, run.burnIn));
}
