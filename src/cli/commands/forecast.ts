import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Command } from 'commander';
import { InputError } from '../../contracts/input-error.js';
import { parseJsonWithLines } from '../../io/json-with-lines.js';
import { renderForecastEllipsesSvg, renderForecastTable } from '../../workflows/forecast/forecast-report.js';
import { runForecast } from '../../workflows/forecast/run-forecast.js';
import { action } from '../run-command.js';

/** Parsed JSON of a config file (strict: duplicate keys refused). */
export function readConfigJson(path: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError(`${path}: cannot read the config (${(e as Error).message})`, { where: path });
  }
  return parseJsonWithLines(text, path).value;
}

interface ForecastOptions {
  out?: string;
  ellipse?: string;
}

/** `treble forecast <config>`: Fisher forecast of a survey for P, B and P+B. */
export function registerForecast(program: Command): void {
  program
    .command('forecast')
    .description('Fisher forecast of a survey (JSON: survey, cosmology, parameters, power, bispectrum, prior): errors for P, B and P+B')
    .argument('<config>', 'forecast config (JSON)')
    .option('--out <dir>', 'write forecast.md, forecast.json and the ellipse plot here')
    .option('--ellipse <x,y>', 'the two parameters of the ellipse plot (default: the first two)')
    .action(
      action((configPath: string, opts: ForecastOptions) => {
        const result = runForecast(readConfigJson(configPath));
        const table = renderForecastTable(result);
        process.stdout.write(table);
        if (!opts.out) return;
        const names = Object.keys(result.fiducial);
        const [x, y] = opts.ellipse ? opts.ellipse.split(',') : names;
        if (!x || !y) throw new InputError(`--ellipse must name two parameters, x,y, got "${opts.ellipse ?? names.join(',')}"`);
        mkdirSync(opts.out, { recursive: true });
        writeFileSync(join(opts.out, 'forecast.md'), table);
        const sets = Object.fromEntries(
          Object.entries(result.sets).map(([k, s]) => [k, { names: s?.fisher.names, fisher: Array.from(s?.fisher.matrix ?? []), marginalised: s?.errors && Array.from(s.errors.marginalised), conditional: s?.errors && Array.from(s.errors.conditional), singular: s?.singular }]),
        );
        writeFileSync(join(opts.out, 'forecast.json'), `${JSON.stringify({ format: 'treble-forecast-1', fiducial: result.fiducial, sets, improvement: result.improvement, warnings: result.warnings, assumptions: result.assumptions }, null, 2)}\n`);
        writeFileSync(join(opts.out, `ellipse-${x}-${y}.svg`), renderForecastEllipsesSvg(result, x, y));
        process.stderr.write(`wrote ${opts.out}/forecast.md, forecast.json, ellipse-${x}-${y}.svg\n`);
      }),
    );
}
