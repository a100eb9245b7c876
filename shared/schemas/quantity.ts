import { z } from 'zod';

// Number fields whose error names the value and the allowed range, e.g.
// "0 °C/min is out of range: allowed > 0 and ≤ 20 °C/min". The field itself is named by the issue path.

export interface Range {
  /** inclusive lower bound */
  min?: number;
  /** exclusive lower bound */
  gt?: number;
  /** inclusive upper bound */
  max?: number;
  /** exclusive upper bound */
  lt?: number;
  int?: boolean;
  /** unit written after numbers in messages, e.g. '°C/min' */
  unit?: string;
}

/** Short, exact-enough rendering of a number for messages. */
export function formatValue(v: unknown): string {
  if (typeof v === 'number') {
    if (Number.isNaN(v)) return 'NaN';
    if (!Number.isFinite(v)) return v > 0 ? 'Infinity' : '-Infinity';
    return String(Number(v.toPrecision(6)));
  }
  if (v === undefined) return 'nothing';
  if (typeof v === 'string') return JSON.stringify(v);
  try {
    return JSON.stringify(v) ?? String(v);
  } catch {
    return String(v);
  }
}

function withUnit(v: number, unit: string | undefined): string {
  return unit ? `${formatValue(v)} ${unit}` : formatValue(v);
}

/** "> 0 and ≤ 20 °C/min" */
export function describeRange(r: Range): string {
  const parts: string[] = [];
  if (r.gt !== undefined) parts.push(`> ${withUnit(r.gt, r.unit)}`);
  if (r.min !== undefined) parts.push(`≥ ${withUnit(r.min, r.unit)}`);
  if (r.lt !== undefined) parts.push(`< ${withUnit(r.lt, r.unit)}`);
  if (r.max !== undefined) parts.push(`≤ ${withUnit(r.max, r.unit)}`);
  const bounds = parts.length ? parts.join(' and ') : 'any finite number';
  return r.int ? `a whole number ${bounds}` : bounds;
}

export function inRange(v: number, r: Range): boolean {
  if (!Number.isFinite(v)) return false;
  if (r.int && !Number.isInteger(v)) return false;
  if (r.gt !== undefined && !(v > r.gt)) return false;
  if (r.min !== undefined && !(v >= r.min)) return false;
  if (r.lt !== undefined && !(v < r.lt)) return false;
  if (r.max !== undefined && !(v <= r.max)) return false;
  return true;
}

export function outOfRangeMessage(v: unknown, r: Range): string {
  const shown = typeof v === 'number' ? withUnit(v, r.unit) : formatValue(v);
  return `${shown} is out of range: allowed ${describeRange(r)}`;
}

/** A finite number within `r`; any violation reports the value and the range. */
export function quantity(r: Range) {
  return z
    .number({
      error: (iss) =>
        iss.input === undefined
          ? `required: a number ${describeRange(r)}`
          : `expected a number ${describeRange(r)}, got ${formatValue(iss.input)}`,
    })
    .superRefine((v, ctx) => {
      if (!inRange(v, r)) ctx.addIssue({ code: 'custom', message: outOfRangeMessage(v, r), input: v });
    });
}

/** A text field: trimmed length 1..max. */
export function label(max = 120) {
  return z
    .string({ error: (iss) => `expected text, got ${formatValue(iss.input)}` })
    .trim()
    .min(1, { error: 'must not be empty' })
    .max(max, { error: (iss) => `too long (${String((iss.input as string)?.length)} characters): allowed ≤ ${max}` });
}
