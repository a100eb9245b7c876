/**
 * Numbers for people: `significant` digits for small quantities such as a
 * warpage of a few hundredths of a millimetre (0.0731 mm, not 0.073 mm), never
 * exponent notation, never a trailing "-0".
 */
export function formatSignificant(value: number, significant = 3): string {
  if (!Number.isFinite(value)) return '–';
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, significant - 1 - magnitude);
  const text = value.toFixed(Math.min(decimals, 8));
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}
