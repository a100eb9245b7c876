import { barToPa, cToK, kToC, paToBar, paToKpa, sToMin } from '../units/index';
import type { StudyParams } from '../schemas/study';
import { HOLD_TOLERANCE, MIN_VACUUM_DEPTH_KPA, PRESSURE_TOLERANCE_BAR, RATE_WINDOW_MIN } from './limits';
import { usableValues } from './hygiene';
import { envelope, episodes, round, windowRatePerMin, type Episode } from './series';
import type { Finding, RunLog, RunLogChannel } from './types';

// The spec check: a run log against the study's process limits and cure cycle. Part temperatures come from
// the part thermocouples hygiene kept; the leading TC is the hottest while the air heats, the lagging the
// coldest. Holds are timed from the moment the lagging TC enters the hold band (the usual way a cure
// specification times a dwell, common practice, no source) until the leading TC leaves it after the air has
// moved on to the next segment.

export interface SpecCheckOptions {
  /** channel keys hygiene left out */
  excluded?: string[];
  holdTolerance?: { min: number; fraction: number };
  pressureToleranceBar?: number;
  minVacuumDepthKpa?: number;
}

export interface HoldReport {
  /** 1-based index of the hold among the cycle's holds */
  hold: number;
  targetC: number;
  bandC: number;
  specifiedMin: number;
  /** the hold time allowed either way, min */
  allowanceMin?: number;
  /** when the lagging TC entered the band and when the leading TC left it (min from the first row) */
  startMin: number | null;
  endMin: number | null;
  measuredMin: number | null;
  /** coldest and hottest part reading while the hold lasted, °C */
  minC?: number | null;
  maxC?: number | null;
}

/** A pressure or vacuum channel against its window, in bar (pressure) or kPa below atmosphere (vacuum). */
export interface WindowReport {
  channel: string;
  /** lowest and highest reading while the window applied (from reaching it until the part cooled to demould) */
  min: number | null;
  max: number | null;
  /** the window: null where it has no bound */
  low: number | null;
  high: number | null;
  unit: string;
  reached: boolean;
}

export interface SpecReport {
  findings: Finding[];
  leadingTc: string | null;
  laggingTc: string | null;
  holds: HoldReport[];
  /** worst rates seen by each part TC, °C/min */
  rates: { channel: string; maxHeatCPerMin: number | null; maxCoolCPerMin: number | null }[];
  maxPartC: number | null;
  durationMin: number;
  /** the limits the figures above were held against (absent in records made before they were kept) */
  limits?: { maxHeatCPerMin: number; maxCoolCPerMin: number; maxTemperatureC: number; maxCycleMin: number };
  /** null when there was no channel to check (a finding says so) */
  pressure?: WindowReport | null;
  vacuum?: WindowReport | null;
}

interface Hold {
  targetC: number;
  bandC: number;
  holdMin: number;
  /** which way the air goes after the hold: up (a ramp), down (a cool) or nowhere (end of cycle) */
  next: 'up' | 'down' | 'end';
  /** which way the part comes into the hold: from below (after a ramp) or from above (after a cool) */
  from: 'below' | 'above';
}

/** The holds of a segment cycle with the temperature each holds at. */
export function holdsOf(params: StudyParams): Hold[] {
  if (params.cycle.kind !== 'segments') return [];
  const holds: Hold[] = [];
  let current = params.cycle.startC;
  let from: Hold['from'] = 'below';
  const segs = params.cycle.segments;
  segs.forEach((seg, i) => {
    if (seg.kind === 'hold') {
      const after = segs.slice(i + 1).find((s) => s.kind !== 'hold');
      const next = after ? (after.kind === 'ramp' ? 'up' : 'down') : 'end';
      holds.push({ targetC: current, bandC: seg.bandC, holdMin: seg.holdMin, next, from });
    } else {
      current = seg.targetC;
      from = seg.kind === 'ramp' ? 'below' : 'above';
    }
  });
  return holds;
}

const MAX_EPISODES_REPORTED = 5;

function f(x: Omit<Finding, 'untilMin'> & { untilMin?: number | null }): Finding {
  return { untilMin: null, ...x };
}

export function checkSpec(log: RunLog, params: StudyParams, options: SpecCheckOptions = {}): SpecReport {
  const excluded = new Set(options.excluded ?? []);
  const n = log.rows;
  const t = log.timeS;
  const minAt = (i: number) => round(sToMin(t[i]));
  const findings: Finding[] = [];
  const limits = params.limits;
  const durationMin = round(sToMin(t[n - 1] - t[0]));

  const airCh = log.channels.find((c) => c.role === 'air' && !excluded.has(c.key));
  const air = airCh ? usableValues(airCh) : null;
  let parts = log.channels.filter((c) => c.role === 'part' && !excluded.has(c.key));
  if (parts.length === 0) {
    findings.push(
      f({
        rule: 'spec.no-part-tc',
        severity: 'warning',
        channel: 'record',
        atMin: 0,
        value: null,
        limit: null,
        unit: '',
        message: 'no usable part thermocouple: rates, holds and temperatures are checked on the air instead, which says little about the part',
      }),
    );
    parts = airCh ? [airCh] : [];
  }
  if (parts.length === 0) return { findings, leadingTc: null, laggingTc: null, holds: [], rates: [], maxPartC: null, durationMin, pressure: null, vacuum: null };
  const partValues = parts.map(usableValues);
  const { max: hottest, min: coldest } = envelope(partValues, n);

  // Leading and lagging TC: highest and lowest mean while the air heats.
  const airRate = air ? windowRatePerMin(t, air, RATE_WINDOW_MIN * 60) : null;
  const means = partValues.map((v) => {
    let sum = 0;
    let count = 0;
    for (let i = 0; i < n; i++) {
      if (airRate && !(airRate[i] > 0.2)) continue;
      if (v[i] === v[i]) {
        sum += v[i];
        count++;
      }
    }
    return count ? sum / count : -Infinity;
  });
  const leadIdx = means.indexOf(Math.max(...means));
  const lagIdx = means.indexOf(Math.min(...means));

  // Rates seen by every part TC (the leading one usually sets the heat-up maximum, the lagging one the cool).
  const rates = parts.map((c, k) => {
    const r = windowRatePerMin(t, partValues[k], RATE_WINDOW_MIN * 60);
    let maxHeat = -Infinity;
    let maxCool = -Infinity;
    for (let i = 0; i < n; i++) {
      if (r[i] > maxHeat) maxHeat = r[i];
      if (-r[i] > maxCool) maxCool = -r[i];
    }
    rateFindings(findings, c, r, 'heat', limits.maxHeatRateCPerMin, t);
    rateFindings(findings, c, r, 'cool', limits.maxCoolRateCPerMin, t);
    return {
      channel: c.label,
      maxHeatCPerMin: Number.isFinite(maxHeat) ? round(maxHeat) : null,
      maxCoolCPerMin: Number.isFinite(maxCool) ? round(maxCool) : null,
    };
  });

  // Holds.
  const tol = options.holdTolerance ?? HOLD_TOLERANCE;
  const holdReports: HoldReport[] = [];
  let cursor = 0;
  let lastHoldEnd = 0;
  for (const [h, hold] of holdsOf(params).entries()) {
    const lo = cToK(hold.targetC - hold.bandC);
    const hi = cToK(hold.targetC + hold.bandC);
    const allowance = Math.max(tol.min, tol.fraction * hold.holdMin);
    const report: HoldReport = {
      hold: h + 1,
      targetC: hold.targetC,
      bandC: hold.bandC,
      specifiedMin: hold.holdMin,
      allowanceMin: round(allowance),
      startMin: null,
      endMin: null,
      measuredMin: null,
      minC: null,
      maxC: null,
    };
    holdReports.push(report);
    // Start: the lagging TC (coldest coming up, hottest coming down) enters the band.
    const lagging = hold.from === 'below' ? coldest : hottest;
    const inBand = (v: number) => (hold.from === 'below' ? v >= lo : v <= hi);
    let start = -1;
    for (let i = cursor; i < n; i++) {
      if (inBand(lagging[i])) {
        start = i;
        break;
      }
    }
    if (start < 0) {
      const sign = hold.from === 'below' ? 1 : -1;
      let closest = cursor;
      for (let i = cursor; i < n; i++) if (sign * lagging[i] > sign * lagging[closest] || !(lagging[closest] === lagging[closest])) closest = i;
      const edgeC = round(hold.from === 'below' ? hold.targetC - hold.bandC : hold.targetC + hold.bandC);
      findings.push(
        f({
          rule: 'spec.hold-not-reached',
          severity: 'violation',
          channel: parts[lagIdx].label,
          atMin: minAt(closest),
          value: round(kToC(lagging[closest])),
          limit: edgeC,
          unit: '°C',
          message: `hold ${h + 1} at ${hold.targetC} °C never started: the lagging part TC came only to ${round(kToC(lagging[closest]))} °C, short of the band edge ${edgeC} °C`,
        }),
      );
      break;
    }
    // End: the air leaves the band towards the next segment; the hold ended when the air last sat at the
    // hold temperature before that (the controller's segment end, within a quarter band).
    let end = n - 1;
    if (hold.next !== 'end') {
      const driver = air ?? (hold.next === 'up' ? hottest : coldest);
      const sign = hold.next === 'up' ? 1 : -1;
      const targetK = cToK(hold.targetC);
      for (let i = start + 1; i < n; i++) {
        if (sign * (driver[i] - targetK) > hold.bandC) {
          end = i;
          const settle = Math.min(1, hold.bandC / 4);
          while (end > start && !(sign * (driver[end] - targetK) <= settle)) end--;
          break;
        }
      }
    }
    const measured = sToMin(t[end] - t[start]);
    report.startMin = minAt(start);
    report.endMin = minAt(end);
    report.measuredMin = round(measured);
    let lowK = Infinity;
    let highK = -Infinity;
    for (let i = start; i <= end; i++) {
      if (coldest[i] < lowK) lowK = coldest[i];
      if (hottest[i] > highK) highK = hottest[i];
    }
    report.minC = Number.isFinite(lowK) ? round(kToC(lowK)) : null;
    report.maxC = Number.isFinite(highK) ? round(kToC(highK)) : null;
    if (measured < hold.holdMin - allowance || measured > hold.holdMin + allowance) {
      const long = measured > hold.holdMin;
      findings.push(
        f({
          rule: long ? 'spec.hold-long' : 'spec.hold-short',
          severity: 'violation',
          channel: parts[lagIdx].label,
          atMin: minAt(start),
          untilMin: minAt(end),
          value: round(measured),
          limit: round(long ? hold.holdMin + allowance : hold.holdMin - allowance),
          unit: 'min',
          message: `hold ${h + 1} at ${hold.targetC} °C lasted ${round(measured, 3)} min from the lagging TC entering the band: specified ${hold.holdMin} min ± ${round(allowance, 3)} min`,
        }),
      );
    }
    // Band: every part TC within target ± band while the hold lasts.
    parts.forEach((c, k) => {
      const v = partValues[k];
      const runs = episodes(start, end, (i) => v[i] < lo || v[i] > hi, (i) => Math.max(lo - v[i], v[i] - hi));
      reportEpisodes(findings, runs, t, (e) => {
        const above = v[e.worst] > hi;
        return {
          rule: 'spec.hold-band',
          severity: 'violation',
          channel: c.label,
          value: round(kToC(v[e.worst])),
          limit: round(above ? hold.targetC + hold.bandC : hold.targetC - hold.bandC),
          unit: '°C',
          message: `left the hold ${h + 1} band ${hold.targetC} ± ${hold.bandC} °C, reaching ${round(kToC(v[e.worst]))} °C`,
        };
      });
    });
    cursor = end;
    lastHoldEnd = end;
  }

  // Maximum temperature: no part point above the highest cycle temperature plus the allowed overshoot.
  const maxTargetC =
    params.cycle.kind === 'segments'
      ? Math.max(params.cycle.startC, ...params.cycle.segments.map((s) => ('targetC' in s ? s.targetC : -Infinity)))
      : Math.max(...params.cycle.points.map((p) => p.airC));
  const ceilingK = cToK(maxTargetC + limits.maxOvershootC);
  let maxPart = -Infinity;
  parts.forEach((c, k) => {
    const v = partValues[k];
    for (let i = 0; i < n; i++) if (v[i] > maxPart) maxPart = v[i];
    const runs = episodes(0, n, (i) => v[i] > ceilingK, (i) => v[i]);
    reportEpisodes(findings, runs, t, (e) => ({
      rule: 'spec.max-temperature',
      severity: 'violation',
      channel: c.label,
      value: round(kToC(v[e.worst])),
      limit: round(maxTargetC + limits.maxOvershootC),
      unit: '°C',
      message: `reached ${round(kToC(v[e.worst]))} °C: allowed ≤ ${round(maxTargetC + limits.maxOvershootC)} °C (cycle maximum ${maxTargetC} °C + overshoot ${limits.maxOvershootC} °C)`,
    }));
  });

  // The end of the pressure and vacuum windows: when the lagging TC has cooled to the demould temperature.
  const lastSegment = params.cycle.kind === 'segments' ? params.cycle.segments[params.cycle.segments.length - 1] : null;
  const demouldC = lastSegment && lastSegment.kind !== 'hold' ? lastSegment.targetC : null;
  let windowEnd = n;
  if (demouldC !== null) {
    // search after the last hold and after the hottest moment (a run that never reached its holds cools too)
    let peakIdx = 0;
    for (let i = 0; i < n; i++) if (hottest[i] > hottest[peakIdx] || !(hottest[peakIdx] === hottest[peakIdx])) peakIdx = i;
    for (let i = Math.max(lastHoldEnd, peakIdx); i < n; i++) {
      if (hottest[i] < cToK(demouldC)) {
        windowEnd = i;
        break;
      }
    }
  }
  const pressure = pressureWindow(findings, log, params, windowEnd, options.pressureToleranceBar ?? PRESSURE_TOLERANCE_BAR, excluded);
  const vacuum = vacuumWindow(findings, log, windowEnd, options.minVacuumDepthKpa ?? MIN_VACUUM_DEPTH_KPA, excluded);

  if (durationMin > limits.maxCycleMin) {
    findings.push(
      f({
        rule: 'spec.cycle-time',
        severity: 'violation',
        channel: 'record',
        atMin: durationMin,
        value: durationMin,
        limit: limits.maxCycleMin,
        unit: 'min',
        message: `the run lasted ${durationMin} min: allowed ≤ ${limits.maxCycleMin} min`,
      }),
    );
  }

  return {
    findings,
    leadingTc: parts[leadIdx].label,
    laggingTc: parts[lagIdx].label,
    holds: holdReports,
    rates,
    maxPartC: Number.isFinite(maxPart) ? round(kToC(maxPart)) : null,
    durationMin,
    limits: {
      maxHeatCPerMin: limits.maxHeatRateCPerMin,
      maxCoolCPerMin: limits.maxCoolRateCPerMin,
      maxTemperatureC: round(maxTargetC + limits.maxOvershootC),
      maxCycleMin: limits.maxCycleMin,
    },
    pressure,
    vacuum,
  };
}

/** "Not checked" for a window whose channel is missing or was left out by hygiene: silence would read as a pass. */
function notChecked(out: Finding[], log: RunLog, role: 'pressure' | 'vacuum', excluded: Set<string>) {
  const left = log.channels.find((c) => c.role === role && excluded.has(c.key));
  const what = role === 'pressure' ? 'vessel pressure' : 'bag vacuum';
  out.push(
    f({
      rule: role === 'pressure' ? 'spec.no-pressure' : 'spec.no-vacuum',
      severity: 'warning',
      channel: left?.label ?? 'record',
      atMin: 0,
      value: null,
      limit: null,
      unit: '',
      message: left
        ? `${what} not checked: the ${role} channel was left out by the hygiene check`
        : `${what} not checked: no ${role} channel in the mapping`,
    }),
  );
}

/** Lowest and highest usable value from start (inclusive) to end (exclusive). */
function extremes(v: Float64Array, start: number, end: number): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let i = start; i < end; i++) {
    if (v[i] < min) min = v[i];
    if (v[i] > max) max = v[i];
  }
  return { min, max };
}

type EpisodeFinding = Omit<Finding, 'atMin' | 'untilMin'>;

/** One finding per episode (the first few), then a note saying how many more there were. */
function reportEpisodes(out: Finding[], runs: Episode[], t: Float64Array, make: (e: Episode) => EpisodeFinding) {
  runs.slice(0, MAX_EPISODES_REPORTED).forEach((e) => {
    const x = make(e);
    out.push({ ...x, atMin: round(sToMin(t[e.start])), untilMin: round(sToMin(t[e.end])), message: `${x.message} (${round(sToMin(t[e.start]), 4)}–${round(sToMin(t[e.end]), 4)} min)` });
  });
  if (runs.length > MAX_EPISODES_REPORTED) {
    const x = make(runs[MAX_EPISODES_REPORTED]);
    out.push({
      ...x,
      severity: 'note',
      atMin: round(sToMin(t[runs[MAX_EPISODES_REPORTED].start])),
      untilMin: round(sToMin(t[runs[runs.length - 1].end])),
      value: null,
      message: `…and ${runs.length - MAX_EPISODES_REPORTED} more time(s) like the above`,
    });
  }
}

function rateFindings(out: Finding[], c: RunLogChannel, rate: Float64Array, kind: 'heat' | 'cool', limit: number, t: Float64Array) {
  const sign = kind === 'heat' ? 1 : -1;
  const runs = episodes(0, rate.length, (i) => sign * rate[i] > limit, (i) => sign * rate[i]);
  reportEpisodes(out, runs, t, (e) => ({
    rule: kind === 'heat' ? 'spec.heat-rate' : 'spec.cool-rate',
    severity: 'violation',
    channel: c.label,
    value: round(sign * rate[e.worst]),
    limit,
    unit: '°C/min',
    message: `${kind === 'heat' ? 'heated' : 'cooled'} at ${round(sign * rate[e.worst], 3)} °C/min over ${RATE_WINDOW_MIN} min: allowed ≤ ${limit} °C/min`,
  }));
}

function pressureWindow(out: Finding[], log: RunLog, params: StudyParams, windowEnd: number, tolBar: number, excluded: Set<string>): WindowReport | null {
  const ch = log.channels.find((c) => c.role === 'pressure' && !excluded.has(c.key));
  const setBar =
    params.cycle.kind === 'segments'
      ? Math.max(...params.cycle.segments.map((s) => s.pressureBar))
      : Math.max(0, ...params.cycle.points.map((p) => p.pressureBar ?? 0));
  if (!(setBar > 0)) return null; // an oven or vacuum-only cure: no vessel pressure to hold
  if (!ch) {
    notChecked(out, log, 'pressure', excluded);
    return null;
  }
  const p = usableValues(ch);
  const lo = barToPa(setBar - tolBar);
  const hi = barToPa(setBar + tolBar);
  const t = log.timeS;
  let start = -1;
  for (let i = 0; i < windowEnd; i++) {
    if (p[i] >= lo) {
      start = i;
      break;
    }
  }
  if (start < 0) {
    let peak = 0;
    for (let i = 0; i < log.rows; i++) if (p[i] > p[peak] || !(p[peak] === p[peak])) peak = i;
    out.push(
      f({
        rule: 'spec.pressure-not-reached',
        severity: 'violation',
        channel: ch.label,
        atMin: round(sToMin(t[peak])),
        value: round(paToBar(p[peak])),
        limit: round(setBar - tolBar),
        unit: 'bar',
        message: `vessel pressure never reached ${setBar} − ${tolBar} bar (peak ${round(paToBar(p[peak]))} bar)`,
      }),
    );
    return { channel: ch.label, min: null, max: Number.isFinite(p[peak]) ? round(paToBar(p[peak])) : null, low: round(setBar - tolBar), high: round(setBar + tolBar), unit: 'bar', reached: false };
  }
  const seen = extremes(p, start, windowEnd);
  const runs = episodes(start, windowEnd, (i) => p[i] < lo || p[i] > hi, (i) => Math.max(lo - p[i], p[i] - hi));
  reportEpisodes(out, runs, t, (e) => ({
    rule: 'spec.pressure-window',
    severity: 'violation',
    channel: ch.label,
    value: round(paToBar(p[e.worst])),
    limit: round(p[e.worst] < lo ? setBar - tolBar : setBar + tolBar),
    unit: 'bar',
    message: `vessel pressure ${round(paToBar(p[e.worst]))} bar outside ${setBar} ± ${tolBar} bar before the part cooled to demould`,
  }));
  const shown = (x: number) => (Number.isFinite(x) ? round(paToBar(x)) : null);
  return { channel: ch.label, min: shown(seen.min), max: shown(seen.max), low: round(setBar - tolBar), high: round(setBar + tolBar), unit: 'bar', reached: true };
}

function vacuumWindow(out: Finding[], log: RunLog, windowEnd: number, minDepthKpa: number, excluded: Set<string>): WindowReport | null {
  const ch = log.channels.find((c) => c.role === 'vacuum' && !excluded.has(c.key));
  if (!ch) {
    notChecked(out, log, 'vacuum', excluded);
    return null;
  }
  const v = usableValues(ch);
  const min = minDepthKpa * 1e3;
  const t = log.timeS;
  let start = -1;
  for (let i = 0; i < windowEnd; i++) {
    if (v[i] >= min) {
      start = i;
      break;
    }
  }
  if (start < 0) {
    out.push(
      f({
        rule: 'spec.vacuum-not-reached',
        severity: 'violation',
        channel: ch.label,
        atMin: 0,
        value: null,
        limit: minDepthKpa,
        unit: 'kPa',
        message: `bag vacuum never reached ${minDepthKpa} kPa below atmosphere`,
      }),
    );
    const deepest = extremes(v, 0, log.rows).max;
    return { channel: ch.label, min: null, max: Number.isFinite(deepest) ? round(paToKpa(deepest)) : null, low: minDepthKpa, high: null, unit: 'kPa', reached: false };
  }
  const seen = extremes(v, start, windowEnd);
  const runs = episodes(start, windowEnd, (i) => v[i] < min, (i) => min - v[i]);
  reportEpisodes(out, runs, t, (e) => ({
    rule: 'spec.vacuum-window',
    severity: 'violation',
    channel: ch.label,
    value: round(paToKpa(v[e.worst])),
    limit: minDepthKpa,
    unit: 'kPa',
    message: `bag vacuum fell to ${round(paToKpa(v[e.worst]))} kPa below atmosphere: allowed ≥ ${minDepthKpa} kPa until the part cooled to demould (a bag leak?)`,
  }));
  const shown = (x: number) => (Number.isFinite(x) ? round(paToKpa(x)) : null);
  return { channel: ch.label, min: shown(seen.min), max: shown(seen.max), low: minDepthKpa, high: null, unit: 'kPa', reached: true };
}
