import type { Background } from '../../cosmology/background.js';

/**
 * Alcock–Paczynski dilations of a cosmology relative to the fiducial one that
 * turned redshifts into distances, with distances in Mpc/h (so h cancels):
 *   alphaPar = [c / H(z)] / [c / H_fid(z)] = E_fid(z) / E(z),
 *   alphaPerp = D_M(z) / D_M,fid(z)
 * (common practice; e.g. Ballinger, Peacock & Heavens 1996, MNRAS 282, 877).
 */
export function apDilations(cosmology: Background, fiducial: Background, z: number): { alphaPar: number; alphaPerp: number } {
  if (z === 0) return { alphaPar: 1, alphaPerp: 1 };
  return { alphaPar: fiducial.e(z) / cosmology.e(z), alphaPerp: cosmology.transverseDistance(z) / fiducial.transverseDistance(z) };
}
