import { cToK, kToC, paToBar, paToKpa, sToMin } from '../units/index';
import {
  AIR_HEATING_K_PER_MIN,
  DEAD_FRACTION,
  FLAT_AIR_SPAN_K,
  FLAT_SPAN_K,
  GAP_FACTOR,
  GAP_MIN_S,
  NOISE_LIMIT,
  PART_LEADS_AIR_K,
  PRESSURE_POSSIBLE_BAR,
  RATE_WINDOW_MIN,
  TEMPERATURE_POSSIBLE_C,
  VACUUM_POSSIBLE_KPA,
} from './limits';
import { episodes, median, round, strideOf, windowRatePerMin } from './series';
import type { Finding, RunLog, RunLogChannel } from './types';

// Data hygiene: before any check or replay uses a channel, find the channels that cannot be trusted.
// Dead, flat, noisy channels and part TCs leading the air are left out of what follows (a dead thermocouple
// reading room temperature would otherwise become the "lagging" part TC and fail every hold; a noisy one
// fakes rate violations; a TC leading the air is misplaced or mislabelled), unless the uploader kept the
// channel on purpose at the mapping step. Impossible readings are dropped one by one; gaps are flagged.

/** Rules that take a channel out of the spec check and the replay. */
export const EXCLUDING_RULES = ['hygiene.dead', 'hygiene.flat', 'hygiene.noisy', 'hygiene.part-leads-air'] as const;

/** A channel hygiene flagged with an excluding rule: left out, or kept because the uploader asked. */
export interface FlaggedChannel {
  key: string;
  label: string;
  rules: string[];
  /** why, in words, e.g. "noisy (±1.8 °C)" */
  reason: string;
  /** true: left out of the spec check and the replay; false: kept at the uploader's request */
  excluded: boolean;
}

export interface HygieneReport {
  findings: Finding[];
  /** keys of channels nothing downstream may use (flagged and not kept by the uploader) */
  excluded: string[];
  /** every channel flagged by an excluding rule, with the reason and whether it was left out */
  flagged: FlaggedChannel[];
  /** per channel: share of readings missing or impossible, and the estimated noise (display units) */
  channels: { key: string; label: string; badFraction: number; noise: number; noiseUnit: string }[];
}

const isTemperature = (c: RunLogChannel) => c.role === 'air' || c.role === 'tool' || c.role === 'part';

/** The physically possible window of a channel, in SI. */
export function possibleRange(c: RunLogChannel): { min: number; max: number } {
  if (c.role === 'pressure') return { min: PRESSURE_POSSIBLE_BAR.min * 1e5, max: PRESSURE_POSSIBLE_BAR.max * 1e5 };
  if (c.role === 'vacuum') return { min: VACUUM_POSSIBLE_KPA.min * 1e3, max: VACUUM_POSSIBLE_KPA.max * 1e3 };
  return { min: cToK(TEMPERATURE_POSSIBLE_C.min), max: cToK(TEMPERATURE_POSSIBLE_C.max) };
}

/** A reading usable downstream: present and physically possible. */
export function usable(c: RunLogChannel, v: number): boolean {
  const r = possibleRange(c);
  return v >= r.min && v <= r.max;
}

/** SI value → the unit findings are written in (°C, bar, kPa). */
export function displayValue(c: RunLogChannel, v: number): { value: number; unit: string } {
  if (c.role === 'pressure') return { value: round(paToBar(v)), unit: 'bar' };
  if (c.role === 'vacuum') return { value: round(paToKpa(v)), unit: 'kPa' };
  return { value: round(kToC(v)), unit: '°C' };
}

/** Same as displayValue for a difference (no 273.15 offset). */
function displayDifference(c: RunLogChannel, d: number): { value: number; unit: string } {
  if (c.role === 'pressure') return { value: round(paToBar(d)), unit: 'bar' };
  if (c.role === 'vacuum') return { value: round(paToKpa(d)), unit: 'kPa' };
  return { value: round(d), unit: '°C' };
}

/**
 * White-noise standard deviation estimated from second differences: for x_i = s(t_i) + e_i with a smooth
 * signal s and independent noise e of deviation σ, x_{i+1} − 2x_i + x_{i−1} has deviation √6·σ; the median
 * of its absolute value is 0.6745 of that (median absolute deviation of a normal variable, Hampel 1974).
 */
export function noiseSigma(values: Float64Array): number {
  const n = values.length;
  if (n < 5) return 0;
  const stride = strideOf(n - 2, 200_000);
  const d2: number[] = [];
  for (let i = 1; i < n - 1; i += stride) {
    const v = values[i + 1] - 2 * values[i] + values[i - 1];
    if (Number.isFinite(v)) d2.push(Math.abs(v));
  }
  const m = median(d2);
  return Number.isFinite(m) ? m / (0.6745 * Math.sqrt(6)) : 0;
}

function noiseLimit(c: RunLogChannel): number {
  if (c.role === 'pressure') return NOISE_LIMIT.pressurePa;
  if (c.role === 'vacuum') return NOISE_LIMIT.vacuumPa;
  return NOISE_LIMIT.temperatureK;
}

function spanOf(c: RunLogChannel): number {
  let min = Infinity;
  let max = -Infinity;
  for (const v of c.values) {
    if (!usable(c, v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return max >= min ? max - min : 0;
}

const finding = (f: Omit<Finding, 'untilMin' | 'value' | 'limit' | 'unit'> & Partial<Finding>): Finding => ({
  untilMin: null,
  value: null,
  limit: null,
  unit: '',
  ...f,
});

/** Gaps in the record: steps much longer than the logger's usual step. */
export function timeGaps(timeS: Float64Array): Finding[] {
  const n = timeS.length;
  if (n < 3) return [];
  const steps = new Float64Array(n - 1);
  for (let i = 1; i < n; i++) steps[i - 1] = timeS[i] - timeS[i - 1];
  const stride = strideOf(steps.length, 200_000);
  const sample: number[] = [];
  for (let i = 0; i < steps.length; i += stride) sample.push(steps[i]);
  const usual = median(sample);
  const limitS = Math.max(GAP_FACTOR * usual, GAP_MIN_S);
  const out: Finding[] = [];
  for (let i = 0; i < steps.length; i++) {
    if (steps[i] <= limitS) continue;
    out.push(
      finding({
        rule: 'hygiene.gap',
        severity: 'warning',
        channel: 'record',
        atMin: round(sToMin(timeS[i])),
        untilMin: round(sToMin(timeS[i + 1])),
        value: round(sToMin(steps[i])),
        limit: round(sToMin(limitS)),
        unit: 'min',
        message: `no readings for ${round(sToMin(steps[i]), 3)} min (usual step ${round(usual, 3)} s): nothing is known of the part in that time`,
      }),
    );
  }
  return out;
}

/** Dead, flat, noisy and implausible channels, and gaps in time. */
export function checkHygiene(log: RunLog): HygieneReport {
  const n = log.rows;
  const findings: Finding[] = [...timeGaps(log.timeS)];
  // dead or flat: not even usable as a reference for the lead rule below
  const unusable: string[] = [];
  const reasons = new Map<string, { rules: string[]; reasons: string[] }>();
  const flag = (c: RunLogChannel, rule: string, reason: string) => {
    const entry = reasons.get(c.key) ?? { rules: [], reasons: [] };
    entry.rules.push(rule);
    entry.reasons.push(reason);
    reasons.set(c.key, entry);
  };
  const air = log.channels.find((c) => c.role === 'air');
  const airSpan = air ? spanOf(air) : 0;
  const channels: HygieneReport['channels'] = [];

  for (const c of log.channels) {
    let missing = 0;
    let impossible = 0;
    let firstImpossible = -1;
    let worstImpossible = NaN;
    for (let i = 0; i < n; i++) {
      const v = c.values[i];
      if (!(v === v)) {
        missing++;
        continue;
      }
      if (!usable(c, v)) {
        impossible++;
        if (firstImpossible < 0) firstImpossible = i;
        if (!(Math.abs(v) <= Math.abs(worstImpossible))) worstImpossible = v;
      }
    }
    const badFraction = (missing + impossible) / n;
    const sigma = noiseSigma(c.values);
    const noiseShown = displayDifference(c, sigma);
    channels.push({ key: c.key, label: c.label, badFraction: round(badFraction, 3), noise: noiseShown.value, noiseUnit: noiseShown.unit });

    if (impossible > 0) {
      const range = possibleRange(c);
      const shown = displayValue(c, worstImpossible);
      const lo = displayValue(c, range.min).value;
      const hi = displayValue(c, range.max).value;
      findings.push(
        finding({
          rule: 'hygiene.impossible',
          severity: 'warning',
          channel: c.label,
          atMin: round(sToMin(log.timeS[firstImpossible])),
          value: shown.value,
          limit: worstImpossible > range.max ? hi : lo,
          unit: shown.unit,
          message: `${impossible} reading(s) outside the physically possible ${lo}…${hi} ${shown.unit} (e.g. ${shown.value} ${shown.unit}): treated as missing`,
        }),
      );
    }
    if (badFraction >= DEAD_FRACTION) {
      unusable.push(c.key);
      flag(c, 'hygiene.dead', `dead (${round(badFraction * 100, 3)} % of readings missing or impossible)`);
      findings.push(
        finding({
          rule: 'hygiene.dead',
          severity: 'violation',
          channel: c.label,
          atMin: 0,
          value: round(badFraction * 100, 3),
          limit: DEAD_FRACTION * 100,
          unit: '%',
          message: `${round(badFraction * 100, 3)} % of readings missing or impossible: the channel is dead${fate(c)}`,
        }),
      );
      continue;
    }
    if (missing > 0) {
      findings.push(
        finding({
          rule: 'hygiene.missing',
          severity: 'note',
          channel: c.label,
          atMin: round(sToMin(log.timeS[c.values.findIndex((v) => !(v === v))])),
          value: missing,
          unit: 'readings',
          message: `${missing} missing reading(s); checks skip them`,
        }),
      );
    }
    const span = spanOf(c);
    const flat = isTemperature(c) ? c.role !== 'air' && airSpan >= FLAT_AIR_SPAN_K && span < FLAT_SPAN_K : n > 10 && span === 0;
    if (flat) {
      unusable.push(c.key);
      const shown = displayDifference(c, span);
      flag(c, 'hygiene.flat', isTemperature(c) ? `flat (spans only ${shown.value} °C)` : 'flat (never changes)');
      findings.push(
        finding({
          rule: 'hygiene.flat',
          severity: 'violation',
          channel: c.label,
          atMin: 0,
          value: shown.value,
          limit: isTemperature(c) ? FLAT_SPAN_K : 0,
          unit: shown.unit,
          message: isTemperature(c)
            ? `spans only ${shown.value} °C while the air spans ${round(airSpan, 3)} °C: not reading the part (detached or stuck)${fate(c)}`
            : `never changes: a stuck transducer${fate(c)}`,
        }),
      );
      continue;
    }
    if (sigma > noiseLimit(c)) {
      const limit = displayDifference(c, noiseLimit(c));
      flag(c, 'hygiene.noisy', `noisy (about ±${noiseShown.value} ${noiseShown.unit}, allowed ±${limit.value})`);
      findings.push(
        finding({
          rule: 'hygiene.noisy',
          severity: 'warning',
          channel: c.label,
          atMin: 0,
          value: noiseShown.value,
          limit: limit.value,
          unit: noiseShown.unit,
          message: `noise about ±${noiseShown.value} ${noiseShown.unit} (allowed ±${limit.value}): check wiring and grounding; rates from this channel are unreliable${fate(c)}`,
        }),
      );
    }
  }

  if (air && !unusable.includes(air.key)) {
    for (const lead of partsLeadingAir(log, air, unusable)) {
      const c = log.channels.find((x) => x.label === lead.channel)!;
      flag(c, 'hygiene.part-leads-air', `leads the air by up to ${lead.value} °C while it heats`);
      findings.push({ ...lead, message: `${lead.message}${fate(c)}` });
    }
  }
  const flagged: FlaggedChannel[] = log.channels
    .filter((c) => reasons.has(c.key))
    .map((c) => {
      const r = reasons.get(c.key)!;
      return { key: c.key, label: c.label, rules: r.rules, reason: r.reasons.join('; '), excluded: !c.keepIfFlagged };
    });
  return { findings, excluded: flagged.filter((f) => f.excluded).map((f) => f.key), flagged, channels };
}

/** What happens to a flagged channel, appended to its finding. */
function fate(c: RunLogChannel): string {
  return c.keepIfFlagged
    ? '; kept in the spec check and the replay because the uploader asked to keep it'
    : '; left out of the spec check and the replay (the uploader may keep it at the mapping step)';
}

/**
 * A part thermocouple cannot run well ahead of the air that heats it while the air is still heating (before
 * any exotherm): when it does, the TC is misplaced, swapped or mislabelled.
 */
function partsLeadingAir(log: RunLog, air: RunLogChannel, excluded: string[]): Finding[] {
  const airRate = windowRatePerMin(log.timeS, air.values, RATE_WINDOW_MIN * 60);
  const out: Finding[] = [];
  for (const c of log.channels) {
    if (c.role !== 'part' || excluded.includes(c.key)) continue;
    const lead = (i: number) => c.values[i] - air.values[i];
    const runs = episodes(
      0,
      log.rows,
      (i) => airRate[i] > AIR_HEATING_K_PER_MIN && usable(c, c.values[i]) && usable(air, air.values[i]) && lead(i) > PART_LEADS_AIR_K,
      lead,
    );
    if (runs.length === 0) continue;
    const worst = runs.reduce((a, b) => (lead(b.worst) > lead(a.worst) ? b : a));
    out.push(
      finding({
        rule: 'hygiene.part-leads-air',
        severity: 'warning',
        channel: c.label,
        atMin: round(sToMin(log.timeS[runs[0].start])),
        untilMin: round(sToMin(log.timeS[runs[runs.length - 1].end])),
        value: round(lead(worst.worst), 3),
        limit: PART_LEADS_AIR_K,
        unit: '°C',
        message: `reads up to ${round(lead(worst.worst), 3)} °C above the air while the air is heating: a part cannot lead the air that heats it; check placement and labels`,
      }),
    );
  }
  return out;
}

/** A channel's values with impossible readings turned into missing ones (NaN), for the checks and the replay. */
export function usableValues(c: RunLogChannel): Float64Array {
  const out = c.values.slice();
  for (let i = 0; i < out.length; i++) if (!usable(c, out[i])) out[i] = NaN;
  return out;
}
