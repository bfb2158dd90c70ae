import { writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { InputError } from '../../contracts/input-error.js';
import { evaluateModelCsv } from '../../workflows/fit/evaluate-model.js';
import { readRunConfig } from '../../workflows/fit/run-config.js';
import { numberOption } from '../cli-options.js';
import { action } from '../run-command.js';

/** `treble evaluate <config>`: the model of a run config against its data, as CSV. */
export function registerEvaluate(program: Command): void {
  program
    .command('evaluate')
    .description("the model of a run config over the bundle's data vector as CSV (data, sigma, model, residual), at the parameters' starts or the truth")
    .argument('<config>', 'run config (JSON); see docs/run-config.md')
    .option('--at <point>', 'start (the parameters\' starts) or truth (the config\'s truth file)', 'start')
    .option('--set <name=value...>', 'override sampled parameters', [])
    .option('--out <file>', 'write the CSV here instead of standard output')
    .action(
      action((file: string, opts: { at: string; set: string[]; out?: string }) => {
        if (opts.at !== 'start' && opts.at !== 'truth') throw new InputError(`--at must be start or truth, got "${opts.at}"`);
        const overrides: Record<string, number> = {};
        for (const item of opts.set) {
          const [name, value, extra] = item.split('=');
          if (!name || value === undefined || extra !== undefined) throw new InputError(`--set ${item}: expected name=value`);
          overrides[name] = numberOption(`set ${name}`, value);
        }
        const csv = evaluateModelCsv(readRunConfig(file), { at: opts.at, overrides });
        if (opts.out) writeFileSync(opts.out, csv);
        else process.stdout.write(csv);
      }),
    );
}
