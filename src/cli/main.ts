#!/usr/bin/env node
import { Command } from 'commander';
import { commands } from './commands/index.js';
import { setDebug } from './run-command.js';
import { version } from '../io/package-version.js';

const program = new Command();
program
  .name('treble')
  .description('Joint fits of galaxy power-spectrum multipoles and the tree-level bispectrum, scale-cut checks and forecasts')
  .version(version)
  .option('--debug', 'show stack traces on errors')
  .hook('preAction', (cmd) => setDebug(Boolean(cmd.optsWithGlobals().debug)))
  .showHelpAfterError('(run with --help for usage)');

for (const register of commands) register(program);

await program.parseAsync(process.argv);
