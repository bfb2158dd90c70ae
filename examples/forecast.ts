/**
 * A Fisher forecast of an invented survey (not any real experiment): two
 * redshift bins over 8000 deg^2, default bias, the ten default parameters,
 * P_l up to k = 0.2 h/Mpc and B_0 up to 0.12 h/Mpc; then how the joint errors
 * move with the bispectrum k_max and with the number density.
 * Run: npx tsx examples/forecast.ts   (about a minute on an idle laptop core)
 */
import { renderForecastTable, runForecast } from '../src/index.js';

const survey = {
  name: 'invented survey',
  skyArea: 8000,
  bins: [
    { zMin: 0.4, zMax: 0.6, nbar: 4e-4 },
    { zMin: 0.6, zMax: 0.8, nbar: 2e-4 },
  ],
};
const power = { kMin: 0.01, kMax: 0.2, dk: 0.01 };
const bispectrum = { kMin: 0.02, kMax: 0.12, dk: 0.01 };

process.stdout.write(renderForecastTable(runForecast({ survey, power, bispectrum })));

const oneBin = (nbar: number) => ({ skyArea: 8000, bins: [{ zMin: 0.4, zMax: 0.6, nbar }] });
const watched = ['mNu', 'b1', 'b2', 'bG2'];
const row = (label: string, spec: object) => {
  const r = runForecast(spec);
  const e = r.sets.joint?.errors;
  const cells = watched.map((n) => (e ? Number(e.marginalised[e.names.indexOf(n)].toPrecision(3)) : '—'));
  process.stdout.write(`| ${label} | ${cells.join(' | ')} |\n`);
};
process.stdout.write(`\nFirst bin alone, P+B marginalised errors\n| case | ${watched.join(' | ')} |\n| --- | ${watched.map(() => '---').join(' | ')} |\n`);
for (const kMax of [0.08, 0.12, 0.16]) row(`B k_max = ${kMax}`, { survey: oneBin(4e-4), power, bispectrum: { ...bispectrum, kMax } });
for (const nbar of [2e-4, 8e-4]) row(`nbar = ${nbar}`, { survey: oneBin(nbar), power, bispectrum });
