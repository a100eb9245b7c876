import { kToC, paToBar, sToMin } from '../units/index';
import { parseStudy, ROOM_TEMPERATURE_C, type StudyParams } from '../schemas/study';
import { REPLAY_MAX_POINTS, TEMPERATURE_POSSIBLE_C } from './limits';
import { usableValues } from './hygiene';
import { interpolate, round } from './series';
import type { RunLog } from './types';

// The replay: the study re-run with the measured air (and tool, and pressure) in place of its cycle, so the
// model predicts what this run did to the part. Long logs are resampled onto a uniform grid (linear
// interpolation over missing readings); the thermal time constants of a laminate are minutes, so a few
// thousand points over a cure lose nothing the model could see.

export class ReplayInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ReplayInputError';
  }
}

export interface ReplayOptions {
  /** channel keys hygiene left out */
  excluded?: string[];
  maxPoints?: number;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/** Study params whose cycle is the measured record of this run (validated; throws when it cannot be). */
export function replayInput(log: RunLog, params: StudyParams, options: ReplayOptions = {}): StudyParams {
  const excluded = new Set(options.excluded ?? []);
  const airCh = log.channels.find((c) => c.role === 'air');
  if (!airCh || excluded.has(airCh.key)) {
    throw new ReplayInputError('the replay needs a usable air channel: the air is missing or was left out by the hygiene check');
  }
  const toolCh = log.channels.find((c) => c.role === 'tool' && !excluded.has(c.key));
  const pressureCh = log.channels.find((c) => c.role === 'pressure' && !excluded.has(c.key));
  const air = usableValues(airCh);
  const tool = toolCh ? usableValues(toolCh) : null;
  const pressure = pressureCh ? usableValues(pressureCh) : null;
  if (!air.some((v) => Number.isFinite(v))) throw new ReplayInputError('the air channel has no usable reading');

  const n = log.rows;
  const maxPoints = Math.max(2, options.maxPoints ?? REPLAY_MAX_POINTS);
  const t = log.timeS;
  const count = Math.min(n, maxPoints);
  const endS = t[n - 1];
  const points: StudyParams['cycle'] & { kind: 'record' } = { kind: 'record', points: [] };
  const { min: tMin, max: tMax } = TEMPERATURE_POSSIBLE_C;
  for (let k = 0; k < count; k++) {
    // Short logs keep their own rows; long ones go onto a uniform grid.
    const i = count === n ? k : -1;
    const ts = i >= 0 ? t[i] : (endS * k) / (count - 1);
    const at = (v: Float64Array) => (i >= 0 && Number.isFinite(v[i]) ? v[i] : interpolate(t, v, ts));
    const airC = clamp(kToC(at(air)), tMin, tMax);
    const point: { timeMin: number; airC: number; toolC?: number; pressureBar?: number } = { timeMin: sToMin(ts), airC: round(airC, 7) };
    if (tool) {
      const v = at(tool);
      if (Number.isFinite(v)) point.toolC = round(clamp(kToC(v), tMin, tMax), 7);
    }
    if (pressure) {
      const v = at(pressure);
      if (Number.isFinite(v)) point.pressureBar = round(clamp(paToBar(v), 0, 25), 6);
    }
    points.points.push(point);
  }
  const first = points.points[0];
  if (first.airC < ROOM_TEMPERATURE_C - 40) {
    throw new ReplayInputError(`the record starts with the air at ${round(first.airC, 4)} °C: check the air column's unit`);
  }
  return parseStudy({ ...params, cycle: points });
}
