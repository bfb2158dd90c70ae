import { Command } from 'commander';
import { vi } from 'vitest';
import type { RegisterCommand } from '../../src/cli/commands/index.js';

/** Run CLI commands in-process with stdout and stderr captured into one string (restore with vi.restoreAllMocks). */
export async function runCliCaptured(registers: readonly RegisterCommand[], args: readonly string[]): Promise<string> {
  let out = '';
  vi.spyOn(process.stdout, 'write').mockImplementation((s) => ((out += String(s)), true));
  vi.spyOn(process.stderr, 'write').mockImplementation((s) => ((out += String(s)), true));
  const program = new Command().exitOverride();
  for (const register of registers) register(program);
  await program.parseAsync(['node', 'treble', ...args]);
  return out;
}
