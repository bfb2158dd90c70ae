/**
 * FFT estimator cost on the reference configuration: a 128^3 mesh in a
 * box of L = 2000 Mpc/h, all triangle bins with shell centres k_f*2, 4, ... up
 * to 0.15 h/Mpc (dk = 2 k_f), B_0 and B_2 with triangle counts, plus P_l.
 * Peak memory is the largest resident set size seen while it runs.
 */
import { memoryUsage } from 'node:process';
import { loadavg } from 'node:os';
import { enumerateTriangleBins, shellGrid } from '../src/bispectrum/triangle-bins.js';
import { fundamentalFrequency } from '../src/numerics/lattice-shell.js';
import { RealFourier3d } from '../src/numerics/fft-3d.js';
import { measureBispectrumMultipoles, triangleGeometryByFft, type TriangleGeometry } from '../src/mocks/bispectrum-multipoles.js';
import { gaussianFieldSpectrum } from '../src/mocks/gaussian-field.js';
import { measurePowerMultipoles } from '../src/mocks/power-multipoles.js';
import { binsNeedingShift } from '../src/mocks/triangle-sums.js';
import type { Benchmark } from './harness.js';

/** Wall and CPU (user + system) seconds of fn: the machine is shared, so CPU time stands for one free core. */
function seconds(fn: () => void): { wall: number; cpu: number } {
  const t0 = process.hrtime.bigint();
  const c0 = process.cpuUsage();
  fn();
  const c = process.cpuUsage(c0);
  return { wall: Number(process.hrtime.bigint() - t0) / 1e9, cpu: (c.user + c.system) / 1e6 };
}

const bench: Benchmark = {
  name: 'estimator',
  async run() {
    const mesh = { n: 128, boxSize: 2000 };
    const kf = fundamentalFrequency(mesh.boxSize);
    const dk = 2 * kf;
    const shells = shellGrid(dk, 0.15, dk);
    const bins = enumerateTriangleBins(shells);
    let peak = memoryUsage.rss();
    const sampler = setInterval(() => (peak = Math.max(peak, memoryUsage.rss())), 50);
    const load = loadavg()[0];
    const fourier = new RealFourier3d(mesh.n);
    const field = fourier.createField().map((_, i) => Math.sin(i * 0.37));
    const spectrum = fourier.createSpectrum();
    const fftForward = seconds(() => fourier.forward(field, spectrum));
    const fftInverse = seconds(() => fourier.inverse(spectrum, field));
    const gauss = gaussianFieldSpectrum(mesh, (k) => 2e4 * (k / 0.02) / (1 + (k / 0.02) ** 2) ** 1.2, 1);
    const powerSeconds = seconds(() => measurePowerMultipoles(gauss, mesh, shells));
    let geometry: TriangleGeometry | undefined;
    const countSeconds = seconds(() => (geometry = triangleGeometryByFft(mesh, bins)));
    const bispectrumSeconds = seconds(() => measureBispectrumMultipoles(gauss, mesh, bins, { geometry }));
    clearInterval(sampler);
    peak = Math.max(peak, memoryUsage.rss());
    return {
      mesh,
      kMaxCentre: shells.kMin + (shells.count - 1) * dk,
      dk,
      shells: shells.count,
      triangleBins: bins.size,
      binsNeedingShiftedSums: binsNeedingShift(mesh, bins).reduce((a, v) => a + v, 0),
      fft128ForwardSeconds: fftForward,
      fft128InverseSeconds: fftInverse,
      powerMultipolesSeconds: powerSeconds,
      triangleGeometrySeconds: countSeconds,
      bispectrumGivenCountsSeconds: bispectrumSeconds,
      bispectrumTotalSeconds: { wall: countSeconds.wall + bispectrumSeconds.wall, cpu: countSeconds.cpu + bispectrumSeconds.cpu },
      peakRssGiB: peak / 2 ** 30,
      loadAverage1minAtStart: load,
      loadAverage1minAtEnd: loadavg()[0],
      targets: { seconds: 60, peakGiB: 4 },
    };
  },
};
export default bench;
