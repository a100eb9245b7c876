import type { StudySummary } from '../solver/simulate';

// Key figures of two runs side by side, the change from A to B, and which process limits flip between pass
// and fail. Works on the JSON summary (engineering units) so the server's stored summaries can fill the
// table before the worker has re-run either study.

export interface MetricDef {
  key: MetricKey;
  label: string;
  unit: string;
  /** figures the solver reports as a negative number when the event never happens (gel, vitrification) */
  negativeMeansNever?: boolean;
}

export type MetricKey =
  | 'finalCureMin'
  | 'finalTgC'
  | 'peakPartC'
  | 'peakOvershootC'
  | 'maxGradientC'
  | 'maxHeatRateCPerMin'
  | 'maxCoolRateCPerMin'
  | 'warpageMm'
  | 'springInDeg'
  | 'cycleMin'
  | 'adiabaticRiseC'
  | 'gelTimeMin'
  | 'vitrificationTimeMin';

/** The figures shown in a comparison, in reading order. */
export const METRICS: readonly MetricDef[] = [
  { key: 'finalCureMin', label: 'Final degree of cure (lowest point)', unit: '' },
  { key: 'finalTgC', label: 'Final Tg', unit: '°C' },
  { key: 'peakPartC', label: 'Peak part temperature', unit: '°C' },
  { key: 'peakOvershootC', label: 'Peak exotherm overshoot', unit: '°C' },
  { key: 'maxGradientC', label: 'Largest through-thickness temperature difference', unit: '°C' },
  { key: 'maxHeatRateCPerMin', label: 'Fastest heat-up seen by the part', unit: '°C/min' },
  { key: 'maxCoolRateCPerMin', label: 'Fastest cool-down seen by the part', unit: '°C/min' },
  { key: 'warpageMm', label: 'Strip warpage', unit: 'mm' },
  { key: 'springInDeg', label: 'Corner spring-in', unit: '°' },
  { key: 'cycleMin', label: 'Cycle time', unit: 'min' },
  { key: 'adiabaticRiseC', label: 'Adiabatic temperature rise', unit: '°C' },
  { key: 'gelTimeMin', label: 'Gel time (first point to gel)', unit: 'min', negativeMeansNever: true },
  { key: 'vitrificationTimeMin', label: 'Vitrification time (first point)', unit: 'min', negativeMeansNever: true },
];

export type SummaryForCompare = Pick<StudySummary, MetricKey | 'limits'>;

export interface MetricDelta {
  key: MetricKey;
  label: string;
  unit: string;
  /** null: not reached (gel or vitrification never happened) or missing from the summary */
  a: number | null;
  b: number | null;
  /** b − a; null when either side is null */
  delta: number | null;
  /** (b − a) / |a|; null when a is 0 or either side is null */
  relative: number | null;
}

export type LimitFlip = 'now-fails' | 'now-passes' | null;

export interface LimitSide {
  value: number;
  limit: number;
  pass: boolean;
  atTimeMin: number | null;
  atZMm: number | null;
}

export interface LimitDelta {
  key: string;
  label: string;
  unit: string;
  a: LimitSide | null;
  b: LimitSide | null;
  /** 'now-fails': passed in A, fails in B; 'now-passes': the reverse; null: same verdict or one side missing */
  flip: LimitFlip;
  /** the limit value itself changed between A and B */
  limitChanged: boolean;
}

export interface MetricComparison {
  metrics: MetricDelta[];
  limits: LimitDelta[];
  /** how many limits flip each way, for a one-line headline */
  nowFail: number;
  nowPass: number;
}

function figure(summary: SummaryForCompare, def: MetricDef): number | null {
  const v = (summary as unknown as Record<string, unknown>)[def.key];
  if (typeof v !== 'number' || !Number.isFinite(v)) return null;
  if (def.negativeMeansNever && v < 0) return null;
  return v;
}

export function metricDeltas(summaryA: SummaryForCompare, summaryB: SummaryForCompare): MetricComparison {
  const metrics = METRICS.map((def): MetricDelta => {
    const a = figure(summaryA, def);
    const b = figure(summaryB, def);
    const delta = a === null || b === null ? null : b - a;
    const relative = delta === null || a === 0 || a === null ? null : delta / Math.abs(a);
    return { key: def.key, label: def.label, unit: def.unit, a, b, delta, relative };
  });

  // Limits by key, in A's order, then any only B has.
  const byKeyA = new Map(summaryA.limits.map((l) => [l.key, l]));
  const byKeyB = new Map(summaryB.limits.map((l) => [l.key, l]));
  const keys = [...new Set([...byKeyA.keys(), ...byKeyB.keys()])];
  const side = (l: SummaryForCompare['limits'][number] | undefined): LimitSide | null =>
    l ? { value: l.value, limit: l.limit, pass: l.pass, atTimeMin: l.atTimeMin, atZMm: l.atZMm } : null;
  const limits = keys.map((key): LimitDelta => {
    const la = byKeyA.get(key);
    const lb = byKeyB.get(key);
    const a = side(la);
    const b = side(lb);
    const flip: LimitFlip = a && b && a.pass !== b.pass ? (a.pass ? 'now-fails' : 'now-passes') : null;
    return {
      key,
      label: (lb ?? la)!.label,
      unit: (lb ?? la)!.unit,
      a,
      b,
      flip,
      limitChanged: !!a && !!b && a.limit !== b.limit,
    };
  });

  return {
    metrics,
    limits,
    nowFail: limits.filter((l) => l.flip === 'now-fails').length,
    nowPass: limits.filter((l) => l.flip === 'now-passes').length,
  };
}
