import type { Command } from 'commander';
import { registerDemo } from './demo.js';
import { registerEvaluate } from './evaluate.js';
import { registerFit } from './fit.js';
import { registerMakeDemo } from './make-demo.js';
import { registerPeak } from './peak.js';
import { registerReport } from './report.js';
import { registerMockBox } from './mock-box.js';
import { registerLinearTheory } from './linear-theory.js';
import { registerPowerMultipoles } from './power-multipoles.js';
import { registerTreeBispectrum } from './tree-bispectrum.js';
import { registerForecast } from './forecast.js';
import { registerSensitivity } from './sensitivity.js';
import { registerScaleCutScan } from './scale-cut-scan.js';

/** Each command module exports a function that adds itself to the program. */
export type RegisterCommand = (program: Command) => void;

export const commands: RegisterCommand[] = [registerDemo, registerFit, registerEvaluate, registerPeak, registerReport, registerMakeDemo, registerMockBox, registerLinearTheory, registerPowerMultipoles, registerTreeBispectrum, registerForecast, registerSensitivity, registerScaleCutScan];
