/**
 * Physical constants for the background (CODATA 2018 exact or recommended
 * values; IAU 2012 astronomical unit for the parsec).
 */
export const SPEED_OF_LIGHT_KM_S = 299792.458;
/** c / H0 in Mpc/h (H0 = 100 h km/s/Mpc). */
export const HUBBLE_DISTANCE_MPC_H = SPEED_OF_LIGHT_KM_S / 100;
export const DEFAULT_T_CMB_K = 2.7255;
/** Effective number of relativistic neutrino species in the standard model. */
export const DEFAULT_N_EFF = 3.044;
/** Omega_nu h^2 = sum m_nu / 93.14 eV (Mangano et al. 2005; Lesgourgues & Pastor 2006). */
export const NEUTRINO_EV_PER_OMEGA = 93.14;

const STEFAN_BOLTZMANN = 5.670374419e-8; // W m^-2 K^-4
const LIGHT_M_S = 299792458;
const NEWTON_G = 6.6743e-11; // m^3 kg^-1 s^-2
const MPC_M = 3.0856775814913673e22;

/** Omega_gamma h^2 of the CMB photons at temperature tCmb: rho_gamma = 4 sigma T^4 / c^3 over rho_crit/h^2. */
export function photonDensity(tCmb: number): number {
  const rhoGamma = (4 * STEFAN_BOLTZMANN * tCmb ** 4) / LIGHT_M_S ** 3; // kg m^-3
  const h100 = 1e5 / MPC_M; // 100 km/s/Mpc in s^-1
  const rhoCrit = (3 * h100 * h100) / (8 * Math.PI * NEWTON_G);
  return rhoGamma / rhoCrit;
}

/** Energy density of one massless neutrino species relative to the photons, (7/8)(4/11)^(4/3) (N_eff/3). */
export function masslessNeutrinoRatio(nEff: number): number {
  return (7 / 8) * (4 / 11) ** (4 / 3) * (nEff / 3);
}
