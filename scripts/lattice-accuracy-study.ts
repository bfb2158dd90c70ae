/**
 * Accuracy of the three box-free bin averages (bin centres, effective
 * wavenumbers, continuous bin volume) against the exact discrete-box average,
 * for the tree-level redshift-space B_0 and B_2: dk = 0.01 h/Mpc, centres
 * 0.01-0.10 h/Mpc, boxes L = 1000, 2000, 3000 Mpc/h. Prints markdown tables of
 * |approximation / exact - 1| by shape class (docs/bispectrum-bin-averaging.md).
 *
 *   npx tsx scripts/lattice-accuracy-study.ts [--max-first-shell N] [L ...]   tables
 *   npx tsx scripts/lattice-accuracy-study.ts --part L G   exact average of part G only, into the cache
 * The exact averages are cached by bin list (src/bispectrum/lattice/lattice-cache.ts),
 * always for the same parts (bins grouped by first shell: 0-7, 8, 9), which
 * separate processes can compute side by side. --max-first-shell N limits the
 * tables to bins whose first shell is at most N (parts above N are not needed).
 */
import { averageAtBinCentres, averageAtEffectiveWavenumbers, averageOverBinVolume } from '../src/bispectrum/bin-averaging.js';
import { discreteBoxBinAverage } from '../src/bispectrum/lattice/discrete-box-average.js';
import { triangleShapeClasses } from '../src/bispectrum/shape-classes.js';
import { enumerateTriangleBins, shellGrid, type TriangleBins } from '../src/bispectrum/triangle-bins.js';
import { studyDirectIntegrand } from './lattice-study-model.js';

const multipoles = [0, 2];
const bins = enumerateTriangleBins(shellGrid(0.01, 0.1, 0.01));
const nB = bins.size;
const top = bins.shells.count - 1;

const PARTS: readonly (readonly number[])[] = [[0, 1, 2, 3, 4, 5, 6, 7], [8], [9]];

function part(g: number): { sub: TriangleBins; members: number[] } {
  const members = [...Array(nB).keys()].filter((b) => PARTS[g].includes(bins.indices[3 * b]));
  const indices = Int32Array.from(members.flatMap((b) => [...bins.indices.subarray(3 * b, 3 * b + 3)]));
  const centres = Float64Array.from(members.flatMap((b) => [...bins.centres.subarray(3 * b, 3 * b + 3)]));
  return { sub: { shells: bins.shells, size: members.length, indices, centres }, members };
}

const args = process.argv.slice(2);
const limitAt = args.indexOf('--max-first-shell');
const maxFirstShell = limitAt >= 0 ? Number(args.splice(limitAt, 2)[1]) : top;

/** Exact B_l [bin][multipole] of the binning from its parts; NaN for bins beyond maxFirstShell. */
function exactAverage(boxSize: number): { values: Float64Array; seconds: number; fromCache: boolean } {
  const values = new Float64Array(nB * multipoles.length).fill(Number.NaN);
  let seconds = 0;
  let fromCache = true;
  for (let g = 0; g < PARTS.length; g++) {
    if (Math.max(...PARTS[g]) > maxFirstShell) continue;
    const { sub, members } = part(g);
    const r = discreteBoxBinAverage(sub, boxSize, studyDirectIntegrand(boxSize), { multipoles });
    seconds += r.seconds;
    fromCache &&= r.fromCache;
    members.forEach((b, n) => values.set(r.values.subarray(n * multipoles.length, (n + 1) * multipoles.length), b * multipoles.length));
  }
  return { values, seconds, fromCache };
}

if (args[0] === '--part') {
  const boxSize = Number(args[1]);
  const g = Number(args[2]);
  const r = discreteBoxBinAverage(part(g).sub, boxSize, studyDirectIntegrand(boxSize), { multipoles });
  console.log(`L=${boxSize} part ${g} (first shells ${PARTS[g].join(',')}): ${r.fromCache ? 'cached' : 'computed'} in ${r.seconds.toFixed(1)} s wall`);
  process.exit(0);
}

const boxes = args.length > 0 ? args.map(Number) : [1000, 2000, 3000];
const direct = studyDirectIntegrand();
const approximations: Record<string, Float64Array> = {
  centres: averageAtBinCentres(bins, direct, { multipoles }),
  effective: averageAtEffectiveWavenumbers(bins, direct, { multipoles }),
  continuous: averageOverBinVolume(bins, direct, { multipoles }),
};

interface Summary {
  n: number;
  rms: number;
  median: number;
  p90: number;
  max: number;
}

function summarise(d: number[]): Summary {
  const s = [...d].sort((a, b) => a - b);
  const q = (p: number): number => s[Math.min(s.length - 1, Math.floor(p * s.length))];
  return { n: s.length, rms: Math.sqrt(s.reduce((a, x) => a + x * x, 0) / s.length), median: q(0.5), p90: q(0.9), max: s[s.length - 1] };
}

const shape = triangleShapeClasses(bins); // the model's classes (src/bispectrum/shape-classes.ts)
const classNames = ['all', ...[...new Set(shape)].sort()];
const fmt = (x: number): string => (x < 1e-3 ? x.toExponential(1) : x.toFixed(4));
const summary: Record<string, Summary> = {};
// Layout [bin][multipole] with one value per configuration.
const at = (a: Float64Array, b: number, m: number): number => a[b * multipoles.length + m];

for (const boxSize of boxes) {
  const exact = exactAverage(boxSize);
  console.log(`\n### L = ${boxSize} Mpc/h (${[...Array(nB).keys()].filter((b) => bins.indices[3 * b] <= maxFirstShell).length} bins, c1 <= ${(0.01 * (maxFirstShell + 1)).toFixed(2)}; exact average ${exact.fromCache ? 'read from the cache; it took' : 'took'} ${exact.seconds.toFixed(0)} s wall)\n`);
  for (const [m, label] of [
    [0, 'B_0'],
    [1, 'B_2'],
  ] as const) {
    console.log(`${label}: |approximation/exact - 1|, rms / median / 90th percentile / max${m === 1 ? ' (bins with |B_2| > 0.05 |B_0| only)' : ''}\n`);
    console.log('| shape class | bins | centres | effective | continuous |');
    console.log('| --- | --- | --- | --- | --- |');
    for (const cls of classNames) {
      const members = [...Array(nB).keys()].filter(
        (b) => bins.indices[3 * b] <= maxFirstShell && (cls === 'all' || shape[b] === cls) && (m === 0 || Math.abs(at(exact.values, b, 1)) > 0.05 * Math.abs(at(exact.values, b, 0))),
      );
      if (members.length === 0) continue;
      const cells = Object.entries(approximations).map(([name, a]) => {
        const s = summarise(members.map((b) => Math.abs(at(a, b, m) / at(exact.values, b, m) - 1)));
        summary[`L${boxSize} ${label} ${cls} ${name}`] = s;
        return `${fmt(s.rms)} / ${fmt(s.median)} / ${fmt(s.p90)} / ${fmt(s.max)}`;
      });
      console.log(`| ${cls} | ${members.length} | ${cells.join(' | ')} |`);
    }
    console.log('');
  }
}
console.error(JSON.stringify(summary));
