/**
 * How a figure is written wherever results are shown (workspace verdicts, compare tables, report): the
 * decimals follow the unit, and a change is the difference of the figures as written, so the columns add up.
 */

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

/** The figure as it is written, as a number: what a reader would subtract. */
export function shownValue(v: number, unit: string): number {
  return Number(v.toFixed(decimals(unit)));
}

/** "+0.002" for 0.948 → 0.950 as written, whatever digits lie beyond them; "—" when either side is missing. */
export function formatChangeBetween(a: number | null, b: number | null, unit: string): string {
  return formatChange(a === null || b === null ? null : shownValue(b, unit) - shownValue(a, unit), unit);
}

/** Whether the change between two figures shows at their precision. */
export function changeShows(a: number | null, b: number | null, unit: string): boolean {
  return a !== null && b !== null && shownValue(a, unit) !== shownValue(b, unit);
}

/** A process limit with its direction: "≥ 0.900" for a lowest allowed value, "≤ 10.0 °C" for a highest. */
export function formatLimit(key: string, limit: number, unit: string): string {
  return `${key.startsWith('min') ? '≥' : '≤'} ${formatFigure(limit, unit)}`;
}
