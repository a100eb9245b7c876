/** Decimals a figure is shown with, by unit: enough to see a change that matters, no more. */
const DECIMALS: Record<string, number> = { '': 3, '°C': 1, '°C/min': 2, mm: 3, '°': 2, min: 0 };

function decimals(unit: string): number {
  return DECIMALS[unit] ?? 2;
}

function withUnit(text: string, unit: string): string {
  if (!unit) return text;
  return unit === '°' ? `${text}°` : `${text} ${unit}`;
}

/** "182.4 °C"; "not reached" for null. */
export function formatFigure(v: number | null, unit: string): string {
  if (v === null) return 'not reached';
  return withUnit(v.toFixed(decimals(unit)).replace(/^-/, '−'), unit);
}

/** The number alone, with the decimals of its unit (for a column whose header or neighbour names the unit). */
export function formatNumber(v: number, unit: string): string {
  return v.toFixed(decimals(unit)).replace(/^-/, '−');
}

/** "+3.1 °C", "−0.012", "±0 min" */
export function formatChange(delta: number | null, unit: string): string {
  if (delta === null) return '—';
  const text = Math.abs(delta).toFixed(decimals(unit));
  if (Number(text) === 0) return withUnit(`±${text}`, unit);
  return withUnit(`${delta < 0 ? '−' : '+'}${text}`, unit);
}
