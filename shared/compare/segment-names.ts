import type { CycleSegment } from '../schemas/study';
import { formatQuantity } from './field-labels';

// The words the workspace's cycle editor uses for segments, kept here so the parameter diff, the report and the
// CSV say the same: "Ramp 1", "Dwell 1", "Cool 1", and a dwell that "starts when the coldest point is in band".

const KIND_NAMES: Record<CycleSegment['kind'], string> = { ramp: 'Ramp', hold: 'Dwell', cool: 'Cool' };

/** "Ramp 1", "Dwell 1", "Ramp 2", "Dwell 2", "Cool 1": numbered per kind, as engineers talk about them. */
export function segmentNames(segments: readonly CycleSegment[]): string[] {
  const counts: Partial<Record<CycleSegment['kind'], number>> = {};
  return segments.map((s) => {
    counts[s.kind] = (counts[s.kind] ?? 0) + 1;
    return `${KIND_NAMES[s.kind]} ${counts[s.kind]}`;
  });
}

/** How a dwell's clock starts, in the words of the segment table's choice. */
export const HOLD_START_WORDS: Record<'clock' | 'lagging-part', string> = {
  clock: 'on the clock',
  'lagging-part': 'when the coldest point is in band',
};

/** "2 °C/min to 120 °C, 7 bar"; "90 min, 7 bar, starts when the coldest point is in band (±5 °C)" */
export function describeSegmentSettings(s: CycleSegment): string {
  if (s.kind !== 'hold') return `${formatQuantity(s.rateCPerMin, '°C/min')} to ${formatQuantity(s.targetC, '°C')}, ${formatQuantity(s.pressureBar, 'bar')}`;
  const start = s.start === 'lagging-part' ? `starts ${HOLD_START_WORDS['lagging-part']} (±${formatQuantity(s.bandC, '°C')})` : `starts ${HOLD_START_WORDS.clock}`;
  return `${formatQuantity(s.holdMin, 'min')}, ${formatQuantity(s.pressureBar, 'bar')}, ${start}`;
}

/** Every segment as "Ramp 1: 2 °C/min to 120 °C, 7 bar", in order. */
export function describeSegments(segments: readonly CycleSegment[]): string[] {
  const names = segmentNames(segments);
  return segments.map((s, i) => `${names[i]}: ${describeSegmentSettings(s)}`);
}
