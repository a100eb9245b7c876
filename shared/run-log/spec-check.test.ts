import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../solver/demo-cards';
import { parseStudy, type StudyParams } from '../schemas/study';
import { checkHygiene } from './hygiene';
import { checkSpec, holdsOf } from './spec-check';
import { lagged, makeLog, minutes, profile, type LogSpec } from './test-support/make-log';

// Constructed runs against one cycle: 2 °C/min to 180 °C, hold 120 min (band ±5 °C, timed from the lagging
// part TC), cool at 3 °C/min to 60 °C. Part TCs follow the air through first-order lags of 4 and 8 min.
//
// Expected hold times come from the first-order lag's ramp response (any heat-transfer text, e.g. Incropera
// & DeWitt, lumped capacitance): after a ramp at r °C/min a TC with time constant τ lags by r·τ, and after
// the air stops it closes that lag as r·τ·e^(−s/τ). The 8-min TC is 16 °C behind at the end of the ramp and
// enters the 5 °C band after s = 8·ln(16/5) = 9.31 min. Samples are 1 min apart, so times are checked to ±1 min.

function study(): StudyParams {
  return parseStudy({
    ...referenceStudy(),
    cycle: {
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 2, targetC: 180, pressureBar: 7 },
        { kind: 'hold', holdMin: 120, pressureBar: 7, start: 'lagging-part', bandC: 5 },
        { kind: 'cool', rateCPerMin: 3, targetC: 60, pressureBar: 7 },
      ],
    },
  });
}

const LAG_ENTRY_MIN = 8 * Math.log(16 / 5);

interface RunShape {
  rampRate?: number;
  holdTo?: number;
  peakC?: number;
  coolRate?: number;
  endMin?: number;
}

function run(shape: RunShape = {}) {
  const rate = shape.rampRate ?? 2;
  const peak = shape.peakC ?? 180;
  const rampEnd = (peak - 20) / rate;
  const holdTo = shape.holdTo ?? rampEnd + 120 + LAG_ENTRY_MIN;
  const coolRate = shape.coolRate ?? 3;
  const T = minutes(shape.endMin ?? holdTo + (peak - 20) / coolRate + 40);
  const air = profile(T, [
    [0, 20],
    [rampEnd, peak],
    [holdTo, peak],
    [holdTo + (peak - 20) / coolRate, 20],
  ]);
  const channels: LogSpec['channels'] = [
    { role: 'air' as const, label: 'Air', values: air },
    { role: 'part' as const, label: 'TC1', values: lagged(T, air, 4) },
    { role: 'part' as const, label: 'TC2', values: lagged(T, air, 8) },
    { role: 'pressure' as const, label: 'Pressure', values: T.map((t) => Math.min(7, t * 1.4)) },
    // a live gauge wanders a little (a constant reading is a stuck transducer, which hygiene leaves out)
    { role: 'vacuum' as const, label: 'Vacuum', values: T.map((_, i) => 95 + (i % 3) * 0.1) },
  ];
  return { T, air, channels, rampEnd, holdTo };
}

function check(r: ReturnType<typeof run>, params = study()) {
  const log = makeLog({ timeMin: r.T, channels: r.channels });
  const hygiene = checkHygiene(log);
  return checkSpec(log, params, { excluded: hygiene.excluded });
}

const rulesOf = (report: ReturnType<typeof checkSpec>) => report.findings.map((f) => `${f.rule} ${f.channel}`);

describe('holdsOf', () => {
  it('lists each hold with its temperature and where the air goes next', () => {
    expect(holdsOf(referenceStudy())).toEqual([
      { targetC: 120, bandC: 5, holdMin: 90, next: 'up', from: 'below' },
      { targetC: 180, bandC: 5, holdMin: 120, next: 'down', from: 'below' },
    ]);
  });
});

describe('checkSpec', () => {
  it('passes a run that follows the cycle, naming the leading and lagging TCs', () => {
    const report = check(run());
    expect(report.findings).toEqual([]);
    expect(report.leadingTc).toBe('TC1');
    expect(report.laggingTc).toBe('TC2');
    expect(report.holds).toHaveLength(1);
    expect(Math.abs(report.holds[0].measuredMin! - 120)).toBeLessThanOrEqual(1);
    expect(Math.abs(report.holds[0].startMin! - (80 + LAG_ENTRY_MIN))).toBeLessThanOrEqual(1);
    // the ramp is 2 °C/min; a lagging TC never exceeds it
    expect(report.rates[0].maxHeatCPerMin).toBeLessThanOrEqual(2.001);
  });

  it('flags a hold that ran long, timed from the lagging TC', () => {
    const r = run({ holdTo: 80 + LAG_ENTRY_MIN + 170 });
    const report = check(r);
    expect(rulesOf(report)).toEqual(['spec.hold-long TC2']);
    const f = report.findings[0];
    expect(Math.abs(f.value! - 170)).toBeLessThanOrEqual(1);
    // allowance max(5 min, 5 % of 120 min) = 6 min (our default, common practice, no source)
    expect(f.limit).toBe(126);
    expect(Math.abs(f.atMin - (80 + LAG_ENTRY_MIN))).toBeLessThanOrEqual(1);
  });

  it('flags a hold cut short', () => {
    const report = check(run({ holdTo: 80 + LAG_ENTRY_MIN + 100 }));
    expect(rulesOf(report)).toEqual(['spec.hold-short TC2']);
    expect(report.findings[0].limit).toBe(114);
  });

  it('flags heat-up faster than allowed on each part TC', () => {
    // 5 °C/min air: after a few time constants every TC heats at 5 °C/min, above the 3 °C/min limit
    // (the 8-min TC then lags 40 °C and enters the band 8·ln(40/5) min after the ramp ends)
    const report = check(run({ rampRate: 5, holdTo: 32 + 120 + 8 * Math.log(40 / 5) }));
    expect(rulesOf(report)).toEqual(['spec.heat-rate TC1', 'spec.heat-rate TC2']);
    for (const f of report.findings) {
      expect(f.value).toBeGreaterThan(3);
      expect(f.value).toBeLessThanOrEqual(5.001);
      expect(f.limit).toBe(3);
    }
  });

  it('flags cool-down faster than allowed', () => {
    const report = check(run({ coolRate: 6 }));
    expect(rulesOf(report)).toEqual(['spec.cool-rate TC1', 'spec.cool-rate TC2']);
    expect(report.findings[0].limit).toBe(4);
  });

  it('flags a part TC leaving the hold band, with time and value', () => {
    const r = run();
    const tc1 = r.channels[1].values;
    // an exotherm-like bump on TC1: 187 °C from minute 150 to 155 (band top 185 °C)
    r.channels[1].values = tc1.map((v, i) => (r.T[i] >= 150 && r.T[i] <= 155 ? 187 : v));
    const report = check(r);
    expect(rulesOf(report)).toEqual(['spec.hold-band TC1']);
    expect(report.findings[0]).toMatchObject({ atMin: 150, untilMin: 155, value: 187, limit: 185, unit: '°C' });
  });

  it('flags a part temperature above the cycle maximum plus the allowed overshoot', () => {
    const r = run();
    // a slow exotherm on TC1: up to 195 °C at minute 150 and back, at 1.5 °C/min (below the rate limit)
    r.channels[1].values = r.channels[1].values.map((v, i) => Math.max(v, 195 - 1.5 * Math.abs(r.T[i] - 150)));
    const report = check(r);
    // reference limits: overshoot ≤ 10 °C over the 180 °C maximum → 190 °C, exceeded from 146.7 to 153.3 min
    expect(rulesOf(report)).toEqual(['spec.hold-band TC1', 'spec.max-temperature TC1']);
    expect(report.findings[1]).toMatchObject({ atMin: 147, untilMin: 153, value: 195, limit: 190 });
  });

  it('flags a hold the lagging TC never reached', () => {
    const report = check(run({ peakC: 170 }));
    expect(rulesOf(report)).toEqual(['spec.hold-not-reached TC2']);
    expect(report.findings[0].limit).toBe(175);
  });

  it('flags a pressure dip before the part cooled to demould', () => {
    const r = run();
    r.channels[3].values = r.channels[3].values.map((v, i) => (r.T[i] >= 150 && r.T[i] <= 160 ? 5 : v));
    const report = check(r);
    expect(rulesOf(report)).toEqual(['spec.pressure-window Pressure']);
    expect(report.findings[0]).toMatchObject({ atMin: 150, untilMin: 160, value: 5, limit: 6.5, unit: 'bar' });
  });

  it('does not flag venting once every part TC is below the demould temperature', () => {
    const r = run();
    // TC2 (8 min lag behind an air cooling at 3 °C/min) is below 60 °C about 24 min after the air is
    const airAt60 = r.holdTo + 40;
    r.channels[3].values = r.channels[3].values.map((v, i) => (r.T[i] > airAt60 + 30 ? 0 : v));
    expect(check(r).findings).toEqual([]);
  });

  it('flags a loss of bag vacuum', () => {
    const r = run();
    r.channels[4].values = r.channels[4].values.map((v, i) => (r.T[i] >= 100 && r.T[i] < 110 ? 60 : v));
    const report = check(r);
    expect(rulesOf(report)).toEqual(['spec.vacuum-window Vacuum']);
    expect(report.findings[0]).toMatchObject({ atMin: 100, untilMin: 109, value: 60, limit: 75, unit: 'kPa' });
  });

  it('flags a run longer than the maximum cycle time', () => {
    const params = study();
    const report = check(run(), { ...params, limits: { ...params.limits, maxCycleMin: 200 } });
    expect(rulesOf(report)).toEqual(['spec.cycle-time record']);
  });

  it('does not let a detached TC that hygiene left out fail the holds', () => {
    const r = run();
    r.channels.push({ role: 'part', label: 'TC9', values: r.T.map(() => 21) });
    const log = makeLog({ timeMin: r.T, channels: r.channels });
    // without hygiene the detached TC is the "lagging" one and the hold never starts
    expect(checkSpec(log, study()).findings.map((f) => f.rule)).toContain('spec.hold-not-reached');
    expect(check(r).findings).toEqual([]);
  });

  it('says a window was not checked when its channel is missing or left out, instead of passing it silently', () => {
    const r = run();
    const noGauges = { ...r, channels: r.channels.filter((c) => c.role !== 'pressure' && c.role !== 'vacuum') };
    const report = check(noGauges);
    expect(rulesOf(report)).toEqual(['spec.no-pressure record', 'spec.no-vacuum record']);
    expect(report.findings.map((f) => f.message)).toEqual([
      'vessel pressure not checked: no pressure channel in the mapping',
      'bag vacuum not checked: no vacuum channel in the mapping',
    ]);
    expect(report.findings.every((f) => f.severity === 'warning')).toBe(true);
    expect(report.pressure).toBeNull();

    // a stuck pressure transducer: hygiene leaves it out, so the window is "not checked", not "passed"
    r.channels[3].values = r.T.map(() => 7);
    const stuck = check(r);
    expect(rulesOf(stuck)).toEqual(['spec.no-pressure Pressure']);
    expect(stuck.findings[0].message).toContain('left out by the hygiene check');
  });

  it('keeps a noisy TC flagged by hygiene out of the rates unless the uploader kept it', () => {
    const r = run();
    // ±4 °C of alternating noise fakes 8 °C steps a minute apart; over the 5-min rate window that reads as fast heating
    let s = 7;
    const rand = () => ((s = (s * 16807) % 2147483647) / 2147483647 - 0.5) * 8;
    r.channels[1].values = r.channels[1].values.map((v) => v + rand());
    const left = check(r);
    expect(left.rates.map((x) => x.channel)).toEqual(['TC2']);
    expect(left.findings.filter((f) => f.channel === 'TC1')).toEqual([]);
    r.channels[1] = { ...r.channels[1], keepIfFlagged: true };
    expect(check(r).rates.map((x) => x.channel)).toEqual(['TC1', 'TC2']);
  });

  it('reports what passed: rates, hold band and time, maximum temperature, pressure and vacuum against their limits', () => {
    const report = check(run());
    expect(report.findings).toEqual([]);
    expect(report.limits).toEqual({ maxHeatCPerMin: study().limits.maxHeatRateCPerMin, maxCoolCPerMin: study().limits.maxCoolRateCPerMin, maxTemperatureC: 180 + study().limits.maxOvershootC, maxCycleMin: study().limits.maxCycleMin });
    // a lagged TC never heats faster than the 2 °C/min air, nor cools faster than its 3 °C/min
    for (const r of report.rates) {
      expect(r.maxHeatCPerMin!).toBeLessThanOrEqual(2.001);
      expect(r.maxHeatCPerMin!).toBeGreaterThan(1.5);
      expect(r.maxCoolCPerMin!).toBeLessThanOrEqual(3.001);
    }
    const hold = report.holds[0];
    expect(hold.allowanceMin).toBe(6); // max(5 min, 5 % of 120 min)
    expect(hold.minC!).toBeGreaterThanOrEqual(175);
    expect(hold.maxC!).toBeLessThanOrEqual(180.001);
    expect(report.pressure).toEqual({ channel: 'Pressure', min: 7, max: 7, low: 6.5, high: 7.5, unit: 'bar', reached: true });
    expect(report.vacuum).toEqual({ channel: 'Vacuum', min: 95, max: 95.2, low: 75, high: null, unit: 'kPa', reached: true });
  });
});
