import { BIN_AVERAGING_METHODS } from '../../bispectrum/tree-bispectrum-model.js';
import type { BundleModelOptions } from '../../inference/likelihood/bundle-models.js';
import { isJsonObject, type JsonObject } from '../../io/json-with-lines.js';


const BISPECTRUM_KEYS = ['averaging', 'volumeOrder', 'irResummation', 'velocityDispersion', 'latticeCacheDir'];

/**
 * Check the run config's `models.bispectrum` block (docs/run-config.md): known
 * keys, and values of the right kind, each problem with its key and line.
 */
export function checkBispectrumModelOptions(models: unknown, at: (key: string) => string, problems: string[]): void {
  if (!isJsonObject(models) || models.bispectrum === undefined) return;
  const b = models.bispectrum;
  if (!isJsonObject(b)) {
    problems.push(`${at('models.bispectrum')}: must be an object { ${BISPECTRUM_KEYS.join(', ')} }`);
    return;
  }
  const key = (k: string) => at(`models.bispectrum.${k}`);
  for (const k of Object.keys(b)) if (!BISPECTRUM_KEYS.includes(k)) problems.push(`${key(k)}: unknown key (known: ${BISPECTRUM_KEYS.join(', ')})`);
  if (b.averaging !== undefined && !(BIN_AVERAGING_METHODS as readonly unknown[]).includes(b.averaging)) {
    problems.push(`${key('averaging')}: must be one of ${BIN_AVERAGING_METHODS.map((m) => `"${m}"`).join(', ')}, got ${JSON.stringify(b.averaging)}`);
  }
  if (b.volumeOrder !== undefined && !(Number.isInteger(b.volumeOrder) && (b.volumeOrder as number) >= 1)) {
    problems.push(`${key('volumeOrder')}: must be a positive integer, got ${JSON.stringify(b.volumeOrder)}`);
  }
  if (b.irResummation !== undefined && typeof b.irResummation !== 'boolean' && b.irResummation !== 'angle-averaged') {
    problems.push(`${key('irResummation')}: must be true, false or "angle-averaged", got ${JSON.stringify(b.irResummation)}`);
  }
  if (b.velocityDispersion !== undefined && !(typeof b.velocityDispersion === 'number' && b.velocityDispersion >= 0)) {
    problems.push(`${key('velocityDispersion')}: must be a number >= 0 (Mpc/h), got ${JSON.stringify(b.velocityDispersion)}`);
  }
  if (b.latticeCacheDir !== undefined && (typeof b.latticeCacheDir !== 'string' || b.latticeCacheDir === '')) {
    problems.push(`${key('latticeCacheDir')}: must be a folder path`);
  }
}

/** The bispectrum half of the "model order" assumption, from the models block. */
export function describeBispectrumModel(models: BundleModelOptions | undefined): string {
  const b = models?.bispectrum ?? {};
  const ir = b.irResummation ?? true;
  const irText =
    ir === 'angle-averaged'
      ? 'IR resummation with the BAO damping averaged over the line of sight (an approximation to the per-P damping)'
      : ir
        ? 'IR resummation in each P (damping at its own angle to the line of sight)'
        : 'no IR resummation';
  const fog = b.velocityDispersion ? `, fingers-of-god damping sigma_v = ${b.velocityDispersion} Mpc/h` : '';
  return `B_l: tree level (F2, G2 kernels; bias b1, b2, bG2) with stochastic terms, ${irText}${fog}; bin average ${b.averaging ?? 'continuous'}`;
}
