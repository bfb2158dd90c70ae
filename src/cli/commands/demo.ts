import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Command } from 'commander';
import { formatLinearTheorySummary, linearPowerFromCosmology, readLinearTheoryConfig, summariseLinearTheory } from '../../cosmology/index.js';
import { action } from '../run-command.js';

const DEMO_CONFIG = join('data-demo', 'demo-cosmology.json');

/** data-demo/ next to the working directory, else above the installed module. */
function findDemoConfig(): string {
  if (existsSync(DEMO_CONFIG)) return DEMO_CONFIG;
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 5; i++) {
    const candidate = join(dir, DEMO_CONFIG);
    if (existsSync(candidate)) return candidate;
    dir = resolve(dir, '..');
  }
  return DEMO_CONFIG;
}

/** `treble demo`: the README's first command. Runs the main job on data-demo/. */
export function registerDemo(program: Command): void {
  program
    .command('demo')
    .description('run the main job on the bundled invented demo data (data-demo/)')
    .option('--config <file>', 'linear-theory config to use instead of the bundled demo')
    .action(
      action((opts: { config?: string }) => {
        const config = readLinearTheoryConfig(opts.config ?? findDemoConfig());
        const lp = linearPowerFromCosmology(config.cosmology, config.redshift);
        const out: string[] = [];
        if (config.scenario) out.push(config.scenario, '');
        out.push('Linear theory of the demo cosmology', formatLinearTheorySummary(summariseLinearTheory(lp)), '');
        out.push('k [h/Mpc]   P_cb [(Mpc/h)^3]   P_nw [(Mpc/h)^3]   f(k)');
        for (const k of [0.001, 0.01, 0.05, 0.1, 0.2, 0.3, 0.5]) {
          out.push(
            `${k.toString().padEnd(10)}  ${lp.power(k).toPrecision(6).padEnd(17)}  ${lp.powerNoWiggle(k).toPrecision(6).padEnd(17)}  ${lp.growthRate(k).toPrecision(5)}`,
          );
        }
        process.stdout.write(`${out.join('\n')}\n`);
      }),
    );
}
