import { cToK } from '../../units/index';
import type { ChannelRole } from '../column-mapping';
import type { RunLog } from '../types';

/** A run log built in code: time in minutes, temperatures in °C, pressure in bar, vacuum in kPa. */
export interface LogSpec {
  timeMin: number[];
  channels: { role: ChannelRole; label: string; values: number[]; keepIfFlagged?: boolean }[];
}

export function makeLog(spec: LogSpec): RunLog {
  return {
    timeS: Float64Array.from(spec.timeMin, (m) => m * 60),
    rows: spec.timeMin.length,
    startedAt: null,
    channels: spec.channels.map((c, i) => ({
      key: c.role === 'part' ? `part:${c.label}` : c.role,
      role: c.role,
      label: c.label,
      column: i + 1,
      header: c.label,
      ...(c.keepIfFlagged ? { keepIfFlagged: true } : {}),
      sourceUnit: c.role === 'pressure' ? 'bar' : c.role === 'vacuum' ? 'kPa gauge' : '°C',
      values: Float64Array.from(c.values, (v) =>
        c.role === 'pressure' ? v * 1e5 : c.role === 'vacuum' ? v * 1e3 : Number.isNaN(v) ? NaN : cToK(v),
      ),
    })),
  };
}

/** Minutes 0, step, 2·step … up to and including `endMin`. */
export function minutes(endMin: number, stepMin = 1): number[] {
  const out: number[] = [];
  for (let t = 0; t <= endMin + 1e-9; t += stepMin) out.push(Number(t.toFixed(9)));
  return out;
}

/** Piecewise-linear profile through (time, value) corners, sampled at `times`. */
export function profile(times: number[], corners: [number, number][]): number[] {
  return times.map((t) => {
    if (t <= corners[0][0]) return corners[0][1];
    for (let k = 1; k < corners.length; k++) {
      const [t0, v0] = corners[k - 1];
      const [t1, v1] = corners[k];
      if (t <= t1) return v0 + ((v1 - v0) * (t - t0)) / (t1 - t0);
    }
    return corners[corners.length - 1][1];
  });
}

/** Lagged copy of a profile: first-order lag with time constant tauMin (explicit, small steps). */
export function lagged(times: number[], driver: number[], tauMin: number): number[] {
  const out = [driver[0]];
  for (let i = 1; i < times.length; i++) {
    const dt = times[i] - times[i - 1];
    const sub = Math.max(1, Math.ceil(dt / (tauMin / 20)));
    let v = out[i - 1];
    for (let s = 1; s <= sub; s++) {
      const a = driver[i - 1] + ((driver[i] - driver[i - 1]) * s) / sub;
      v += ((a - v) * (dt / sub)) / tauMin;
    }
    out.push(v);
  }
  return out;
}
