/**
 * Child process of the kill-and-resume tests: one ensemble run of a slow
 * Gaussian, written to the stem given as argv[2]. Run with
 *   node --import tsx kill-resume-run.ts <stem> <busyMs>
 * Prints the stop reason and step count as JSON when it ends normally.
 */
import { sampleEnsemble } from '../../../../src/inference/sampling/sample-ensemble.js';
import { killResumeSettings } from './kill-resume-settings.js';

const [stem, busyMs] = process.argv.slice(2);
const r = await sampleEnsemble({ ...killResumeSettings(Number(busyMs)), output: stem, resume: true });
process.stdout.write(`${JSON.stringify({ stopReason: r.stopReason, steps: r.steps })}\n`);
