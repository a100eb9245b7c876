import { BAR_PA, PSI_PA, ZERO_CELSIUS_K, fToC } from '../units/index';
import { STANDARD_ATMOSPHERE_KPA } from './limits';

// Units a run log may be written in, how each converts to SI, and how to guess one from a header or from
// the values. Series are held in SI: seconds, kelvin, pascal (gauge pressure; vacuum as depth below
// atmosphere, positive when the bag is under vacuum).

export const TIME_UNITS = ['s', 'min', 'h', 'timestamp'] as const;
export const TEMPERATURE_UNITS = ['°C', '°F', 'K'] as const;
export const PRESSURE_UNITS = ['bar', 'kPa', 'psi'] as const;
export const VACUUM_UNITS = ['kPa', 'inHg', 'mbar'] as const;
/** Vacuum gauges show either gauge pressure (depth below atmosphere) or absolute pressure in the bag. */
export const VACUUM_REFERENCES = ['gauge', 'absolute'] as const;

export type TimeUnit = (typeof TIME_UNITS)[number];
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type VacuumUnit = (typeof VACUUM_UNITS)[number];
export type VacuumReference = (typeof VACUUM_REFERENCES)[number];

/** 1 inHg (conventional, 0 °C mercury) = 3386.389 Pa (NIST SP 811, appendix B). */
export const INHG_PA = 3386.389;

const TIME_SCALE_S: Record<Exclude<TimeUnit, 'timestamp'>, number> = { s: 1, min: 60, h: 3600 };
const PRESSURE_SCALE_PA: Record<PressureUnit, number> = { bar: BAR_PA, kPa: 1e3, psi: PSI_PA };
const VACUUM_SCALE_PA: Record<VacuumUnit, number> = { kPa: 1e3, inHg: INHG_PA, mbar: 100 };

export function timeToS(value: number, unit: Exclude<TimeUnit, 'timestamp'>): number {
  return value * TIME_SCALE_S[unit];
}

export function temperatureToK(value: number, unit: TemperatureUnit): number {
  if (unit === 'K') return value;
  if (unit === '°F') return fToC(value) + ZERO_CELSIUS_K;
  return value + ZERO_CELSIUS_K;
}

export function pressureToPa(value: number, unit: PressureUnit): number {
  return value * PRESSURE_SCALE_PA[unit];
}

/**
 * Vacuum depth below atmosphere in Pa. Gauge readings are often written negative (−95 kPa) and sometimes
 * positive (28 inHg of vacuum); both mean the same depth. Absolute readings are subtracted from one
 * standard atmosphere.
 */
export function vacuumDepthPa(value: number, unit: VacuumUnit, reference: VacuumReference): number {
  const pa = value * VACUUM_SCALE_PA[unit];
  return reference === 'absolute' ? STANDARD_ATMOSPHERE_KPA * 1e3 - pa : Math.abs(pa);
}

// --- Guessing from headers ---------------------------------------------------------------------------------

/** A unit read from a header, e.g. "Air (°F)" → '°F'. Null when the header names no unit of that kind. */
export function timeUnitFromHeader(header: string): TimeUnit | null {
  const h = header.toLowerCase();
  if (/\b(date|timestamp|clock|datetime)\b/.test(h)) return 'timestamp';
  if (/[([\s_-](h|hr|hrs|hours?)[)\]\s]*$/.test(h) || /\bhours?\b/.test(h)) return 'h';
  if (/[([\s_-](min|mins|minutes?)[)\]\s]*$/.test(h) || /\bminutes?\b/.test(h)) return 'min';
  if (/[([\s_-](s|sec|secs|seconds?)[)\]\s]*$/.test(h) || /\bseconds?\b/.test(h)) return 's';
  return null;
}

export function temperatureUnitFromHeader(header: string): TemperatureUnit | null {
  const h = header.toLowerCase();
  if (/°\s*f|\bdeg\s*f\b|\bdegf\b|\bfahrenheit\b|[([]\s*f\s*[)\]]/.test(h)) return '°F';
  if (/°\s*c|\bdeg\s*c\b|\bdegc\b|\bcelsius\b|[([]\s*c\s*[)\]]/.test(h)) return '°C';
  if (/\bkelvin\b|[([]\s*k\s*[)\]]/.test(h)) return 'K';
  return null;
}

export function pressureUnitFromHeader(header: string): PressureUnit | null {
  const h = header.toLowerCase();
  if (/\bpsi[ga]?\b/.test(h)) return 'psi';
  if (/\bkpa\b/.test(h)) return 'kPa';
  if (/\bbar[ga]?\b/.test(h)) return 'bar';
  return null;
}

export function vacuumUnitFromHeader(header: string): VacuumUnit | null {
  const h = header.toLowerCase();
  if (/\binhg\b|\bin\.?\s*hg\b|"hg/.test(h)) return 'inHg';
  if (/\bmbar[ga]?\b/.test(h)) return 'mbar';
  if (/\bkpa\b/.test(h)) return 'kPa';
  return null;
}

// --- Guessing from values ----------------------------------------------------------------------------------

export interface ValueRange {
  min: number;
  max: number;
  first: number;
}

export interface UnitGuess<U> {
  unit: U;
  /** why this unit: from the header, or which value range suggested it */
  reason: string;
  fromHeader: boolean;
}

/**
 * Temperature unit from values when the header is silent. A cure record starts near room temperature:
 * about 15–35 in °C, 60–95 in °F, 290–310 in K; cures of thermosets top out below ≈ 260 °C (500 °F).
 * Common practice, no source.
 */
export function guessTemperatureUnit(r: ValueRange): UnitGuess<TemperatureUnit> {
  if (r.min >= 230) return { unit: 'K', reason: `values ${fmt(r.min)}–${fmt(r.max)} are only plausible in kelvin`, fromHeader: false };
  if (r.max > 260 || (r.first >= 50 && r.first <= 100 && r.max > 150)) {
    return { unit: '°F', reason: `values ${fmt(r.min)}–${fmt(r.max)} (starting at ${fmt(r.first)}) read as °F`, fromHeader: false };
  }
  return { unit: '°C', reason: `values ${fmt(r.min)}–${fmt(r.max)} read as °C`, fromHeader: false };
}

/** Autoclave gauge pressure rarely exceeds 20 bar (≈ 300 psi, 2000 kPa). Common practice, no source. */
export function guessPressureUnit(r: ValueRange): UnitGuess<PressureUnit> {
  const peak = Math.max(Math.abs(r.min), Math.abs(r.max));
  if (peak <= 25) return { unit: 'bar', reason: `peak ${fmt(peak)} reads as bar`, fromHeader: false };
  if (peak <= 400) return { unit: 'psi', reason: `peak ${fmt(peak)} reads as psi`, fromHeader: false };
  return { unit: 'kPa', reason: `peak ${fmt(peak)} reads as kPa`, fromHeader: false };
}

/** Bag vacuum: ≤ 30 in inHg, ≤ 101 in kPa, up to 1013 in mbar. Common practice, no source. */
export function guessVacuumUnit(r: ValueRange): UnitGuess<VacuumUnit> {
  const peak = Math.max(Math.abs(r.min), Math.abs(r.max));
  if (peak <= 30.5) return { unit: 'inHg', reason: `peak ${fmt(peak)} reads as inHg`, fromHeader: false };
  if (peak <= 105) return { unit: 'kPa', reason: `peak ${fmt(peak)} reads as kPa`, fromHeader: false };
  return { unit: 'mbar', reason: `peak ${fmt(peak)} reads as mbar`, fromHeader: false };
}

/**
 * Gauge or absolute: a header saying "abs" decides; otherwise negative readings are gauge, and small
 * positive mbar/kPa readings (a good bag holds a few tens of mbar absolute) are absolute.
 */
export function guessVacuumReference(header: string, unit: VacuumUnit, r: ValueRange): VacuumReference {
  if (/\babs(olute)?\b|\b(mbar|kpa)a\b/i.test(header)) return 'absolute';
  if (/\bgauge\b|\bgage\b|\b(mbar|kpa|psi)g\b/i.test(header)) return 'gauge';
  if (r.max <= 0) return 'gauge';
  if (unit === 'mbar' && r.min >= 0 && r.max <= 300) return 'absolute';
  if (unit === 'kPa' && r.min >= 0 && r.max <= 30) return 'absolute';
  return 'gauge';
}

/** Time unit from values when the header is silent: a cure lasts hours, so the span says the unit. */
export function guessTimeUnit(r: ValueRange): UnitGuess<Exclude<TimeUnit, 'timestamp'>> {
  const span = r.max - r.min;
  if (span > 2000) return { unit: 's', reason: `span ${fmt(span)} reads as seconds`, fromHeader: false };
  if (span > 30) return { unit: 'min', reason: `span ${fmt(span)} reads as minutes`, fromHeader: false };
  return { unit: 'h', reason: `span ${fmt(span)} reads as hours`, fromHeader: false };
}

function fmt(v: number): string {
  return String(Number(v.toPrecision(4)));
}
