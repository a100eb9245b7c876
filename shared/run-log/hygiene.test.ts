import { describe, expect, it } from 'vitest';
import { expectClose } from '../solver/test-support/expect-close';
import { checkHygiene, noiseSigma, usableValues } from './hygiene';
import { lagged, makeLog, minutes, profile, type LogSpec } from './test-support/make-log';

// A clean 4-hour run: air 20 → 180 °C at 2 °C/min, 120 min hold, cool at 3 °C/min; TCs lag the air.
const T = minutes(300);
const AIR = profile(T, [
  [0, 20],
  [80, 180],
  [200, 180],
  [253.3, 20],
]);
const TC1 = lagged(T, AIR, 4);
const TC2 = lagged(T, AIR, 8);

function cleanChannels(): LogSpec['channels'] {
  return [
    { role: 'air' as const, label: 'Air', values: AIR },
    { role: 'part' as const, label: 'TC1', values: TC1 },
    { role: 'part' as const, label: 'TC2', values: TC2 },
    { role: 'pressure' as const, label: 'Pressure', values: T.map((t) => (t < 5 ? t * 1.4 : 7)) },
    { role: 'vacuum' as const, label: 'Vacuum', values: T.map((_, i) => 95 + (i % 3) * 0.1) },
  ];
}

const rules = (log: ReturnType<typeof makeLog>) => checkHygiene(log).findings.map((f) => `${f.rule} ${f.channel}`);

/** Seeded uniform noise in [−a, a] (Park & Miller minimal standard generator, CACM 31, 1988). */
function noise(seed: number) {
  let s = seed;
  return (a: number) => {
    s = (s * 16807) % 2147483647;
    return ((s - 1) / 2147483646 - 0.5) * 2 * a;
  };
}

describe('checkHygiene', () => {
  it('finds nothing wrong with a clean run', () => {
    expect(rules(makeLog({ timeMin: T, channels: cleanChannels() }))).toEqual([]);
  });

  it('calls a channel dead when most readings are missing, and leaves it out', () => {
    const channels = cleanChannels();
    channels[2] = { ...channels[2], values: TC2.map((v, i) => (i % 4 === 0 ? v : NaN)) };
    const report = checkHygiene(makeLog({ timeMin: T, channels }));
    expect(report.findings.map((f) => f.rule)).toEqual(['hygiene.dead']);
    // 225 of 301 rows missing = 74.75 %, shown to 3 figures
    expect(report.findings[0]).toMatchObject({ channel: 'TC2', severity: 'violation', value: 74.8, unit: '%' });
    expect(report.excluded).toEqual(['part:TC2']);
  });

  it('calls an open thermocouple reading an impossible value dead as well', () => {
    const channels = cleanChannels();
    channels[1] = { ...channels[1], values: TC1.map(() => 1372) };
    const report = checkHygiene(makeLog({ timeMin: T, channels }));
    expect(report.findings.map((f) => f.rule)).toEqual(['hygiene.impossible', 'hygiene.dead']);
    expect(report.findings[0]).toMatchObject({ channel: 'TC1', value: 1372, limit: 450, unit: '°C' });
  });

  it('flags a few impossible readings and treats them as missing', () => {
    const channels = cleanChannels();
    channels[1] = { ...channels[1], values: TC1.map((v, i) => (i === 100 ? -250 : v)) };
    const log = makeLog({ timeMin: T, channels });
    const report = checkHygiene(log);
    expect(report.findings.map((f) => f.rule)).toEqual(['hygiene.impossible']);
    expect(report.findings[0]).toMatchObject({ atMin: 100, value: -250, limit: -60 });
    expect(Number.isNaN(usableValues(log.channels[1])[100])).toBe(true);
  });

  it('calls a thermocouple flat when it does not follow a 160 °C air swing', () => {
    const channels = cleanChannels();
    channels[2] = { ...channels[2], values: T.map((_, i) => 21 + (i % 2) * 0.5) };
    const report = checkHygiene(makeLog({ timeMin: T, channels }));
    expect(report.findings.map((f) => `${f.rule} ${f.channel}`)).toEqual(['hygiene.flat TC2']);
    expect(report.excluded).toEqual(['part:TC2']);
  });

  it('calls a pressure transducer that never changes flat', () => {
    const channels = cleanChannels();
    channels[3] = { ...channels[3], values: T.map(() => 7) };
    expect(rules(makeLog({ timeMin: T, channels }))).toEqual(['hygiene.flat Pressure']);
  });

  it('estimates white noise from second differences', () => {
    // uniform noise on [−a, a] has σ = a/√3; the MAD-based estimate assumes a normal law, so allow 15 %
    const rand = noise(7);
    const a = 3;
    const values = Float64Array.from(T, (t) => 300 + t * 0.5 + rand(a));
    expectClose(noiseSigma(values), a / Math.sqrt(3), 0.15);
    // a smooth ramp has none
    expect(noiseSigma(Float64Array.from(T, (t) => 300 + t * 0.5))).toBeLessThan(1e-9);
  });

  it('flags a noisy thermocouple and leaves it out, unless the uploader kept it', () => {
    const rand = noise(11);
    const channels = cleanChannels();
    channels[1] = { ...channels[1], values: TC1.map((v) => v + rand(5)) };
    const report = checkHygiene(makeLog({ timeMin: T, channels }));
    expect(report.findings.map((f) => `${f.rule} ${f.channel}`)).toEqual(['hygiene.noisy TC1']);
    expect(report.findings[0].value).toBeGreaterThan(1);
    expect(report.findings[0].message).toContain('left out of the spec check and the replay');
    expect(report.excluded).toEqual(['part:TC1']);
    expect(report.flagged).toEqual([{ key: 'part:TC1', label: 'TC1', rules: ['hygiene.noisy'], reason: expect.stringMatching(/^noisy \(about ±/), excluded: true }]);

    channels[1] = { ...channels[1], keepIfFlagged: true };
    const kept = checkHygiene(makeLog({ timeMin: T, channels }));
    expect(kept.excluded).toEqual([]);
    expect(kept.flagged).toMatchObject([{ key: 'part:TC1', rules: ['hygiene.noisy'], excluded: false }]);
    expect(kept.findings[0].message).toContain('uploader asked to keep it');
  });

  it('leaves out dead and flat channels with their reason', () => {
    const channels = cleanChannels();
    channels[2] = { ...channels[2], values: TC2.map(() => NaN) };
    channels[3] = { ...channels[3], values: T.map(() => 7) };
    const report = checkHygiene(makeLog({ timeMin: T, channels }));
    expect(report.excluded).toEqual(['part:TC2', 'pressure']);
    expect(report.flagged.map((f) => `${f.label}: ${f.reason}`)).toEqual(['TC2: dead (100 % of readings missing or impossible)', 'Pressure: flat (never changes)']);
  });

  it('flags a part thermocouple running well ahead of the heating air', () => {
    const channels = cleanChannels();
    // TC1 wired to a hotter spot: 15 °C above the air from minute 20 on while the air still heats
    channels[1] = { ...channels[1], values: TC1.map((v, i) => (T[i] >= 20 && T[i] <= 70 ? AIR[i] + 15 : v)) };
    const report = checkHygiene(makeLog({ timeMin: T, channels }));
    expect(report.findings).toHaveLength(1);
    expect(report.findings[0]).toMatchObject({ rule: 'hygiene.part-leads-air', channel: 'TC1', atMin: 20, value: 15, limit: 10 });
    // a TC that cannot be where its label says is not used for the part's temperatures
    expect(report.excluded).toEqual(['part:TC1']);
    expect(report.flagged[0].reason).toBe('leads the air by up to 15 °C while it heats');
  });

  it('finds gaps in time', () => {
    const times = T.filter((t) => t < 100 || t > 130);
    const pick = (v: number[]) => v.filter((_, i) => T[i] < 100 || T[i] > 130);
    const channels = cleanChannels().map((c) => ({ ...c, values: pick(c.values) }));
    const report = checkHygiene(makeLog({ timeMin: times, channels }));
    expect(report.findings).toHaveLength(1);
    expect(report.findings[0]).toMatchObject({ rule: 'hygiene.gap', channel: 'record', atMin: 99, untilMin: 131, value: 32, unit: 'min' });
  });
});
