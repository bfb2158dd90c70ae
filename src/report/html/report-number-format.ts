/**
 * Numbers in the report tables. A posterior quantity is printed to the
 * decimals that give its standard deviation two significant digits (common
 * practice); magnitudes outside 1e-4..1e6 switch to exponent notation.
 */
export function decimalsForUncertainty(sd: number): number {
  if (!(sd > 0) || !Number.isFinite(sd)) return 3;
  return Math.max(0, Math.min(8, 1 - Math.floor(Math.log10(sd))));
}

export function formatReportNumber(value: number, decimals: number): string {
  const abs = Math.abs(value);
  const text = abs !== 0 && (abs >= 1e6 || abs < 1e-4) ? value.toExponential(Math.min(decimals, 3)) : value.toFixed(decimals);
  return text.replace(/^-/, '\u2212');
}

/** p-values: three significant digits, exponent notation below 1e-3. */
export function formatPValue(p: number): string {
  return p !== 0 && p < 1e-3 ? p.toExponential(1) : p.toPrecision(3);
}
