import type { CosmologyLinearPower } from './linear-power-from-cosmology.js';

/** The headline linear-theory numbers of one cosmology at one redshift, for reports and the demo. */
export interface LinearTheorySummary {
  readonly redshift: number;
  readonly omegaMatter: number;
  readonly omegaNu: number;
  readonly hubble: number;
  readonly transverseDistance: number;
  readonly angularDiameterDistance: number;
  readonly growthFactor: number;
  readonly growthRate: number;
  readonly sigma8Cold: number;
  readonly sigma8Matter: number;
  readonly sigma8MatterToday: number;
  readonly lnAs: number;
  readonly soundHorizonDrag: number;
  readonly sigma2BAO: number;
  readonly deltaSigma2BAO: number;
}

export function summariseLinearTheory(lp: CosmologyLinearPower): LinearTheorySummary {
  const bg = lp.background;
  const z = lp.redshift;
  return {
    redshift: z,
    omegaMatter: bg.omegaMatter0,
    omegaNu: bg.omegaNu0,
    hubble: bg.hubble(z),
    transverseDistance: bg.transverseDistance(z),
    angularDiameterDistance: bg.angularDiameterDistance(z),
    growthFactor: lp.growthFactor,
    growthRate: lp.growthRateLargeScale,
    sigma8Cold: lp.sigma8,
    sigma8Matter: lp.sigma8Matter,
    sigma8MatterToday: lp.sigma8MatterToday,
    lnAs: lp.lnAs,
    soundHorizonDrag: lp.soundHorizonDrag,
    sigma2BAO: lp.sigma2BAO,
    deltaSigma2BAO: lp.deltaSigma2BAO,
  };
}

const LABELS: Record<keyof LinearTheorySummary, string> = {
  redshift: 'redshift z',
  omegaMatter: 'Omega_m (today, incl. neutrinos)',
  omegaNu: 'Omega_nu (today)',
  hubble: 'H(z) [km/s/Mpc]',
  transverseDistance: 'D_M(z) [Mpc/h]',
  angularDiameterDistance: 'D_A(z) [Mpc/h]',
  growthFactor: 'D(z) (D/a -> 1 in matter era)',
  growthRate: 'f(z) (large scales)',
  sigma8Cold: 'sigma8 cold field at z',
  sigma8Matter: 'sigma8 total matter at z',
  sigma8MatterToday: 'sigma8 total matter at z = 0',
  lnAs: 'ln(10^10 A_s)',
  soundHorizonDrag: 'r_drag (EH98 eq. 6) [Mpc/h]',
  sigma2BAO: 'Sigma^2 BAO damping [(Mpc/h)^2]',
  deltaSigma2BAO: 'delta Sigma^2 [(Mpc/h)^2]',
};

/** Aligned "label  value" lines. */
export function formatLinearTheorySummary(s: LinearTheorySummary): string {
  const keys = Object.keys(LABELS) as (keyof LinearTheorySummary)[];
  const width = Math.max(...keys.map((k) => LABELS[k].length));
  return keys.map((k) => `${LABELS[k].padEnd(width)}  ${Number(s[k].toPrecision(6))}`).join('\n');
}
