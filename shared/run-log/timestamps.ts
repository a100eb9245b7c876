// Time cells written as dates or clock times, read to seconds. Only differences matter (elapsed time from
// the first row), so a date-time is read as naive UTC; a zone offset, when written, is honoured.

const ISO = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;
const DOTTED = /^(\d{1,2})\.(\d{1,2})\.(\d{4})[ T](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?$/;
const CLOCK = /^(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?$/;

export type TimestampKind = 'date-time' | 'clock';

/** Which kind of time stamp a cell holds, or null when it is not one we read. */
export function timestampKind(cell: string): TimestampKind | null {
  const c = cell.trim();
  if (ISO.test(c) || DOTTED.test(c)) return 'date-time';
  if (CLOCK.test(c)) return 'clock';
  return null;
}

function fraction(digits: string | undefined): number {
  return digits ? Number(`0.${digits}`) : 0;
}

function validClock(h: number, m: number, s: number): boolean {
  return h <= 23 && m <= 59 && s < 61;
}

/**
 * Seconds for a time stamp cell: date-times since the Unix epoch, clock times since midnight.
 * NaN when the cell is not a valid time stamp (the caller names line and column).
 */
export function timestampSeconds(cell: string): number {
  const c = cell.trim();
  let m = ISO.exec(c);
  if (m) {
    const [, y, mo, d, h, mi, s, f, zone] = m;
    if (!validClock(+h, +mi, +(s ?? 0)) || +mo < 1 || +mo > 12 || +d < 1 || +d > 31) return NaN;
    let t = Date.UTC(+y, +mo - 1, +d, +h, +mi, +(s ?? 0)) / 1000 + fraction(f);
    if (zone && zone.toUpperCase() !== 'Z') {
      const sign = zone[0] === '-' ? -1 : 1;
      const digits = zone.slice(1).replace(':', '');
      t -= sign * (Number(digits.slice(0, 2)) * 3600 + Number(digits.slice(2, 4)) * 60);
    }
    return t;
  }
  m = DOTTED.exec(c);
  if (m) {
    const [, d, mo, y, h, mi, s, f] = m;
    if (!validClock(+h, +mi, +(s ?? 0)) || +mo < 1 || +mo > 12 || +d < 1 || +d > 31) return NaN;
    return Date.UTC(+y, +mo - 1, +d, +h, +mi, +(s ?? 0)) / 1000 + fraction(f);
  }
  m = CLOCK.exec(c);
  if (m) {
    const [, h, mi, s, f] = m;
    if (!validClock(+h, +mi, +(s ?? 0))) return NaN;
    return +h * 3600 + +mi * 60 + +(s ?? 0) + fraction(f);
  }
  return NaN;
}

/** A clock time that falls back by more than 12 h crossed midnight (a logger's clock-only column). */
export const MIDNIGHT_ROLLOVER_S = 12 * 3600;
