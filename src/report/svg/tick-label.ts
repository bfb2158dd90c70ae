/**
 * Tick labels as rich-text markup (see rich-text.ts). Linear axes print as many
 * decimals as the step needs; very large or small magnitudes use a×10^n.
 */
export function linearTickLabel(value: number, step: number): string {
  if (value === 0) return '0';
  const magnitude = Math.max(Math.abs(value), step);
  if (magnitude >= 1e5 || magnitude < 1e-3) return scientificLabel(value, step);
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  return minusSign(value.toFixed(decimals));
}

export function logTickLabel(value: number): string {
  const exponent = Math.floor(Math.log10(value) + 1e-9);
  const mantissa = value / 10 ** exponent;
  if (Math.abs(mantissa - 1) < 1e-9) {
    if (exponent >= -2 && exponent <= 3) return minusSign(String(Number(value.toPrecision(6))));
    return `10^{${minusSign(String(exponent))}}`;
  }
  if (exponent >= -2 && exponent <= 3) return String(Number(value.toPrecision(6)));
  return `${Number(mantissa.toPrecision(3))}×10^{${minusSign(String(exponent))}}`;
}

function scientificLabel(value: number, step: number): string {
  const exponent = Math.floor(Math.log10(Math.abs(value)));
  const digits = Math.max(0, exponent - Math.floor(Math.log10(step) + 1e-9));
  const mantissa = (value / 10 ** exponent).toFixed(Math.min(digits, 6));
  return `${minusSign(mantissa)}×10^{${minusSign(String(exponent))}}`;
}

/** Typographic minus for negative numbers. */
function minusSign(text: string): string {
  return text.replace(/^-/, '\u2212');
}
