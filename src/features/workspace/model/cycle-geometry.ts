/**
 * The set-point schedule as a line in (minutes, °C), and the arithmetic of
 * dragging its handles. Pure functions: the editor turns pixels into minutes
 * and degrees, these turn minutes and degrees into segment fields.
 *
 * A hold that starts when the lagging part point enters its band is drawn at
 * its clock length; the solved history shows when it really started.
 */
import type { CycleSegment } from '../../../../shared/schemas/study';

export type SegmentSpan = {
  index: number;
  kind: CycleSegment['kind'];
  startMin: number;
  endMin: number;
  startC: number;
  endC: number;
};

/** Minutes a ramp or cool takes at its rate; 0 when the rate is not positive (the schema reports it). */
export function rampMinutes(fromC: number, toC: number, rateCPerMin: number): number {
  return rateCPerMin > 0 && Number.isFinite(rateCPerMin) ? Math.abs(toC - fromC) / rateCPerMin : 0;
}

export function cycleSpans(startC: number, segments: readonly CycleSegment[]): SegmentSpan[] {
  const spans: SegmentSpan[] = [];
  let t = 0;
  let temp = startC;
  segments.forEach((seg, index) => {
    if (seg.kind === 'hold') {
      const length = Math.max(0, seg.holdMin);
      spans.push({ index, kind: 'hold', startMin: t, endMin: t + length, startC: temp, endC: temp });
      t += length;
    } else {
      const length = rampMinutes(temp, seg.targetC, seg.rateCPerMin);
      spans.push({ index, kind: seg.kind, startMin: t, endMin: t + length, startC: temp, endC: seg.targetC });
      t += length;
      temp = seg.targetC;
    }
  });
  return spans;
}

export function cycleEndMin(spans: readonly SegmentSpan[]): number {
  return spans.length ? spans[spans.length - 1].endMin : 0;
}

/** Vertices of the set-point line, starting at t = 0. */
export function cycleVertices(startC: number, spans: readonly SegmentSpan[]): { timeMin: number; tempC: number }[] {
  return [{ timeMin: 0, tempC: startC }, ...spans.map((s) => ({ timeMin: s.endMin, tempC: s.endC }))];
}

// Resolution of dragged values: what an engineer would type.
export const roundTempC = (v: number) => Math.round(v);
export const roundRate = (v: number) => Math.round(v * 10) / 10;
export const roundMinutes = (v: number) => Math.round(v);

export type DragResult<T> = { ok: true; value: T } | { ok: false; reason: string };

/** Moving a ramp's (or cool's) end vertically: same rate, new target. */
export function dragRampTarget(originalTargetC: number, deltaC: number): DragResult<number> {
  return { ok: true, value: roundTempC(originalTargetC + deltaC) };
}

/** Moving a ramp's (or cool's) end horizontally: same target, reached sooner or later, so a new rate. */
export function dragRampRate(span: SegmentSpan, deltaMin: number): DragResult<number> {
  const rise = Math.abs(span.endC - span.startC);
  const minutes = span.endMin - span.startMin + deltaMin;
  if (rise === 0) return { ok: false, reason: 'a ramp with no temperature change has no rate to drag; set its target first' };
  if (!(minutes > 0)) return { ok: false, reason: 'the ramp would end before it starts' };
  const rate = roundRate(rise / minutes);
  if (!(rate > 0)) return { ok: false, reason: `the ramp would take ${roundMinutes(minutes)} min: its rate would round to 0 °C/min` };
  return { ok: true, value: rate };
}

/**
 * A ramp's (or cool's) rate stepped by the keyboard: ±0.1 °C/min per key (±1 with Shift). Stepping the
 * rate itself, not the end's time: a 1-min step changes a slow ramp's rate by less than the 0.1 °C/min it
 * is rounded to (60 min at 1.5 °C/min → 61 min is 1.477, which rounds back to 1.5), so the key did nothing.
 */
export function stepRampRate(rateCPerMin: number, stepCPerMin: number): DragResult<number> {
  const rate = roundRate(rateCPerMin + stepCPerMin);
  if (!(rate > 0)) return { ok: false, reason: `the rate would be ${rate} °C/min: allowed > 0 °C/min` };
  return { ok: true, value: rate };
}

/** Moving a dwell's right edge: a new length. */
export function dragHoldLength(originalHoldMin: number, deltaMin: number): DragResult<number> {
  const value = roundMinutes(originalHoldMin + deltaMin);
  if (!(value > 0)) return { ok: false, reason: `a dwell of ${value} min is not a dwell: allowed > 0 min` };
  return { ok: true, value };
}

/**
 * Which field sets a dwell's temperature: the target of the ramp or cool before
 * it, or the cycle's start temperature when the dwell comes first.
 */
export function dwellTemperatureOwner(
  segments: readonly CycleSegment[],
  holdIndex: number,
): { kind: 'start' } | { kind: 'segment'; index: number } {
  for (let i = holdIndex - 1; i >= 0; i--) {
    if (segments[i].kind !== 'hold') return { kind: 'segment', index: i };
  }
  return { kind: 'start' };
}

/** Split a segment into two halves that together draw the same line. */
export function splitSegment(seg: CycleSegment, startC: number): [CycleSegment, CycleSegment] {
  if (seg.kind === 'hold') {
    const first = Math.max(1, roundMinutes(seg.holdMin / 2));
    return [
      { ...seg, holdMin: first },
      { ...seg, holdMin: Math.max(1, seg.holdMin - first) },
    ];
  }
  const mid = roundTempC((startC + seg.targetC) / 2);
  return [{ ...seg, targetC: mid }, { ...seg }];
}

/** A new segment that fits after one ending at `atC` (a sensible start for the engineer to edit). */
export function newSegment(kind: CycleSegment['kind'], atC: number, pressureBar: number): CycleSegment {
  if (kind === 'hold') return { kind, holdMin: 30, pressureBar, start: 'clock', bandC: 5 };
  if (kind === 'ramp') return { kind, rateCPerMin: 2, targetC: roundTempC(atC + 20), pressureBar };
  return { kind, rateCPerMin: 3, targetC: Math.max(20, roundTempC(atC - 40)), pressureBar };
}
