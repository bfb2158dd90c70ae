import type { Command } from 'commander';
import { action } from '../run-command.js';

/** `treble demo`: the README's first command. Runs the main job on data-demo/. */
export function registerDemo(program: Command): void {
  program
    .command('demo')
    .description('run the main job on the bundled invented demo data (data-demo/)')
    .action(
      action(() => {
        process.stdout.write('treble demo: the linear-theory engine is not built yet; nothing to run.\n');
      }),
    );
}
