/** Rich-text plot labels (src/report markup) for the parameter names of docs/conventions.md. */
const LABELS: Readonly<Record<string, string>> = {
  alphaPar: 'α_∥',
  alphaPerp: 'α_⊥',
  fsigma8: 'fσ_8',
  sigma8: 'σ_8',
  sigma8Cold: 'σ_{8,cb}',
  templateAmplitude: 'q_{σ8}',
  b1: 'b_1',
  b2: 'b_2',
  bG2: 'b_{G2}',
  f: 'f',
  omegaCdm: 'ω_{cdm}',
  omegaB: 'ω_b',
  mNu: 'Σm_ν',
  ns: 'n_s',
  lnAs: 'ln(10^{10}A_s)',
};

export function parameterLabel(name: string): string {
  return LABELS[name] ?? name;
}
