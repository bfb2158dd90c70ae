import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { discreteBoxBinAverage } from '../src/bispectrum/lattice/discrete-box-average.js';
import { enumerateTriangleBins, shellGrid } from '../src/bispectrum/triangle-bins.js';
import { studyTemplateIntegrand } from '../scripts/lattice-study-model.js';
import { timeMedian, type Benchmark } from './harness.js';

/**
 * Exact discrete-box average of the tree-level template integrand (17 values,
 * B_0 and B_2) for centres 0.01-0.15 h/Mpc, dk = 0.01 (477 bins), in boxes of
 * L = 1000 and 2000 Mpc/h: the first (uncached) computation, then a cached read.
 * L = 2000 takes ~15-20 CPU minutes, so it runs only with TREBLE_BENCH_LATTICE_LARGE=1.
 */
const bench: Benchmark = {
  name: 'lattice',
  async run() {
    const bins = enumerateTriangleBins(shellGrid(0.01, 0.15, 0.01));
    const boxes = process.env.TREBLE_BENCH_LATTICE_LARGE ? [1000, 2000] : [1000];
    const cacheDir = mkdtempSync(join(tmpdir(), 'treble-lattice-bench-'));
    const results: Record<string, unknown> = { bins: bins.size, integrandSize: studyTemplateIntegrand().size, multipoles: [0, 2] };
    try {
      for (const boxSize of boxes) {
        const integrand = studyTemplateIntegrand(boxSize);
        const cpu0 = process.cpuUsage();
        const first = discreteBoxBinAverage(bins, boxSize, integrand, { cacheDir });
        const cpu = process.cpuUsage(cpu0);
        const triangles = first.counts.reduce((a, b) => a + b, 0);
        const cached = timeMedian(() => discreteBoxBinAverage(bins, boxSize, integrand, { cacheDir }), 5, 1);
        results[`L${boxSize}`] = {
          firstComputationSeconds: first.seconds,
          // CPU time of this process: the wall time above grows with the machine's load.
          firstComputationCpuSeconds: (cpu.user + cpu.system) / 1e6,
          // Ordered triples; the symmetry group of the z axis (16 elements) cuts the integrand calls to about 1/16 of this.
          latticeTriangles: triangles,
          cachedReadMs: cached.medianMs,
        };
      }
    } finally {
      rmSync(cacheDir, { recursive: true, force: true });
    }
    return results;
  },
};
export default bench;
