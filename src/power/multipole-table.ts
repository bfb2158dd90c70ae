import type { PowerMultipoleModel } from './power-multipole-model.js';

/**
 * A model vector reshaped to one row per k bin: [k_eff, P_l for each multipole
 * of the model], with a CSV header "k,P0,P2,P4" (units h/Mpc and (Mpc/h)^3).
 */
export function powerMultipoleCsv(model: PowerMultipoleModel, values: Float64Array): string {
  const { binCount, multipoles, effectiveK } = model.setup.sampling;
  const lines = [['k', ...multipoles.map((l) => `P${l}`)].join(',')];
  for (let i = 0; i < binCount; i++) {
    const row = [effectiveK[i]];
    for (let m = 0; m < multipoles.length; m++) row.push(values[m * binCount + i]);
    lines.push(row.map((v) => v.toPrecision(10)).join(','));
  }
  return `${lines.join('\n')}\n`;
}
