import type { Command } from 'commander';
import { registerDemo } from './demo.js';
import { registerMockBox } from './mock-box.js';
import { registerLinearTheory } from './linear-theory.js';
import { registerPowerMultipoles } from './power-multipoles.js';
import { registerTreeBispectrum } from './tree-bispectrum.js';

/** Each command module exports a function that adds itself to the program. */
export type RegisterCommand = (program: Command) => void;

export const commands: RegisterCommand[] = [registerDemo, registerMockBox, registerLinearTheory, registerPowerMultipoles, registerTreeBispectrum];
