import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { InputError, InputErrors } from '../contracts/input-error.js';
import { validateCosmology, type CosmologyParameters } from './cosmology-parameters.js';

/**
 * A linear-theory config file (JSON):
 *   { "scenario"?: string, "redshift": number, "cosmology": { ...CosmologyParameters },
 *     "powerTable"?: path of a two-column table of the cold-field P(k) at that redshift }
 */
export interface LinearTheoryConfig {
  readonly scenario: string | undefined;
  readonly redshift: number;
  readonly cosmology: CosmologyParameters;
  readonly powerTable: string | undefined;
  /** `powerTable` resolved against the directory of the config file. */
  readonly powerTablePath: string | undefined;
  readonly file: string;
}

const TOP_KEYS = ['scenario', 'redshift', 'cosmology', 'powerTable'];

/** First line (1-based) of the text that holds the quoted key. */
function keyLineFinder(text: string): (key: string) => number | undefined {
  const lines = text.split(/\r?\n/);
  return (key) => {
    const needle = `"${key}"`;
    const i = lines.findIndex((l) => l.includes(needle));
    return i < 0 ? undefined : i + 1;
  };
}

export function parseLinearTheoryConfig(text: string, file: string): LinearTheoryConfig {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (err) {
    throw new InputError(`${file}: not valid JSON (${(err as Error).message})`);
  }
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) throw new InputError(`${file}: the config must be a JSON object`);
  const obj = raw as Record<string, unknown>;
  const lineOf = keyLineFinder(text);
  const at = (key: string) => `${key} (${file}${lineOf(key) ? `:${lineOf(key)}` : ''})`;
  const problems: string[] = [];
  for (const key of Object.keys(obj)) {
    if (!TOP_KEYS.includes(key)) problems.push(`${at(key)}: unknown key; allowed keys are ${TOP_KEYS.join(', ')}`);
  }
  const z = obj.redshift;
  if (z === undefined) problems.push(`redshift (${file}): missing`);
  else if (typeof z !== 'number' || !(z >= 0 && z <= 20)) problems.push(`${at('redshift')} = ${JSON.stringify(z)} must be a number in [0, 20]`);
  if (obj.scenario !== undefined && typeof obj.scenario !== 'string') problems.push(`${at('scenario')}: must be a string`);
  if (obj.powerTable !== undefined && typeof obj.powerTable !== 'string') problems.push(`${at('powerTable')}: must be a file path`);
  let cosmology: CosmologyParameters | undefined;
  if (obj.cosmology === undefined) problems.push(`cosmology (${file}): missing`);
  else {
    try {
      cosmology = validateCosmology(obj.cosmology, { path: 'cosmology', file, lineOf });
    } catch (err) {
      if (err instanceof InputErrors) problems.push(...err.problems);
      else if (err instanceof InputError) problems.push(err.message);
      else throw err;
    }
  }
  if (problems.length > 0 || !cosmology) throw new InputErrors(problems);
  return {
    scenario: obj.scenario as string | undefined,
    redshift: z as number,
    cosmology,
    powerTable: obj.powerTable as string | undefined,
    powerTablePath: obj.powerTable === undefined ? undefined : resolve(dirname(file), obj.powerTable as string),
    file,
  };
}

export function readLinearTheoryConfig(path: string): LinearTheoryConfig {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: cannot read the config (${(err as NodeJS.ErrnoException).code ?? String(err)})`);
  }
  return parseLinearTheoryConfig(text, path);
}
