/**
 * What each handle on the cycle line edits. A handle edit is computed from the
 * study as it was when the drag began plus the total pointer travel, so a drag
 * of many small moves lands exactly where one big move would.
 */
import type { Draft } from 'immer';
import type { StudyParams } from '../../../../shared/schemas/study';
import { segmentNames } from '../../../../shared/compare/segment-names';
import { cycleSpans, dragHoldLength, dragRampRate, dragRampTarget, dwellTemperatureOwner, roundTempC, stepRampRate } from './cycle-geometry';

export type CycleHandle =
  | { kind: 'ramp-end'; index: number }
  | { kind: 'dwell-level'; index: number }
  | { kind: 'dwell-end'; index: number };

/**
 * Pointer travel in minutes and degrees, on the axis the gesture moves along. A key on a ramp's end sets
 * `rateStepCPerMin` instead: the rate changes by that much, whatever the travel.
 */
export type HandleDelta = { minutes: number; celsius: number; axis: 'x' | 'y'; rateStepCPerMin?: number };

export type HandleEdit =
  | { ok: true; label: string; recipe: (draft: Draft<StudyParams>) => void }
  | { ok: false; reason: string };

export function handleId(h: CycleHandle): string {
  return `${h.kind}-${h.index}`;
}

export function handleEdit(original: StudyParams, handle: CycleHandle, delta: HandleDelta): HandleEdit {
  if (original.cycle.kind !== 'segments') return { ok: false, reason: 'a recorded cycle is edited in its table' };
  const { startC, segments } = original.cycle;
  const seg = segments[handle.index];
  if (!seg) return { ok: false, reason: 'that segment no longer exists' };
  const name = segmentNames(segments)[handle.index];
  const span = cycleSpans(startC, segments)[handle.index];

  if (handle.kind === 'ramp-end') {
    if (seg.kind === 'hold') return { ok: false, reason: `${name} is a dwell` };
    if (delta.axis === 'y') {
      const r = dragRampTarget(seg.targetC, delta.celsius);
      if (!r.ok) return r;
      return {
        ok: true,
        label: `${name} target ${r.value} °C`,
        recipe: (d) => {
          if (d.cycle.kind === 'segments') (d.cycle.segments[handle.index] as { targetC: number }).targetC = r.value;
        },
      };
    }
    const r = delta.rateStepCPerMin !== undefined ? stepRampRate(seg.rateCPerMin, delta.rateStepCPerMin) : dragRampRate(span, delta.minutes);
    if (!r.ok) return { ok: false, reason: `${name}: ${r.reason}` };
    return {
      ok: true,
      label: `${name} rate ${r.value} °C/min`,
      recipe: (d) => {
        if (d.cycle.kind === 'segments') (d.cycle.segments[handle.index] as { rateCPerMin: number }).rateCPerMin = r.value;
      },
    };
  }

  if (seg.kind !== 'hold') return { ok: false, reason: `${name} is not a dwell` };

  if (handle.kind === 'dwell-end') {
    const r = dragHoldLength(seg.holdMin, delta.minutes);
    if (!r.ok) return { ok: false, reason: `${name}: ${r.reason}` };
    return {
      ok: true,
      label: `${name} length ${r.value} min`,
      recipe: (d) => {
        if (d.cycle.kind === 'segments') (d.cycle.segments[handle.index] as { holdMin: number }).holdMin = r.value;
      },
    };
  }

  // dwell-level: the dwell sits at the temperature the segment before it reached.
  const owner = dwellTemperatureOwner(segments, handle.index);
  const from = owner.kind === 'start' ? startC : (segments[owner.index] as { targetC: number }).targetC;
  const value = roundTempC(from + delta.celsius);
  return {
    ok: true,
    label: `${name} temperature ${value} °C`,
    recipe: (d) => {
      if (d.cycle.kind !== 'segments') return;
      if (owner.kind === 'start') d.cycle.startC = value;
      else (d.cycle.segments[owner.index] as { targetC: number }).targetC = value;
    },
  };
}
