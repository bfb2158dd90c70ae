/**
 * What every bin-averaging method averages (centres, effective wavenumbers,
 * continuous bin volume, discrete lattice of a periodic box): a vector of
 * `size` values for one triangle configuration.
 *
 * A configuration is three wavevectors k1 + k2 + k3 = 0 given by their lengths
 * and the cosines of each with the line of sight (so mu1 k1 + mu2 k2 + mu3 k3 = 0).
 * Side 1 comes from the first shell of the bin (the largest centre) and carries
 * the Legendre weight of a multipole; the averaging method applies
 * (2l + 1) L_l(mu1) itself, the integrand never does.
 *
 * Averagers return a Float64Array laid out as [bin][multipole][value]:
 * out[(bin * nMultipoles + m) * size + t].
 */
export interface TriangleIntegrand {
  readonly size: number;
  evaluate(k1: number, k2: number, k3: number, mu1: number, mu2: number, mu3: number, out: Float64Array, offset: number): void;
}
