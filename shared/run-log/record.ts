import { kToC, paToBar, paToKpa, paToMpa, sToMin } from '../units/index';
import type { StudyParams } from '../schemas/study';
import type { SimulationResult, StudySummary } from '../solver/simulate';
import { glassTransitionK, prepareGlassTransition } from '../solver/glass-transition';
import type { RunLogMapping, PartPosition } from './column-mapping';
import type { HygieneReport } from './hygiene';
import type { SpecReport } from './spec-check';
import { interpolate, round } from './series';
import type { RunLog } from './types';

// What the library keeps of an analysed run log (JSON, engineering units) and the pure functions that
// build it: charts thinned to a few hundred points, the replay's predictions at each thermocouple's place
// and the measured-versus-predicted differences, which are themselves a check of the model.

export const CHART_MAX_POINTS = 600;

export interface ChartSeries {
  timeMin: number[];
  /** per channel key: values in °C, bar or kPa (null where missing) */
  channels: Record<string, (number | null)[]>;
}

export interface PredictionTrace {
  timeMin: number[];
  airC: number[];
  bagC: number[];
  midC: number[];
  toolSideC: number[];
  alphaMin: number[];
  tgMidC: number[];
}

export interface PredictionAtTc {
  channel: string;
  position: PartPosition;
  /** predicted final degree of cure and Tg at the TC's place (null when its position is unknown) */
  finalCure: number | null;
  finalTgC: number | null;
  /** measured minus predicted temperature at the TC's place over the run, °C */
  rmsDifferenceC: number | null;
  maxDifferenceC: number | null;
  maxDifferenceAtMin: number | null;
}

export interface ReplayRecord {
  modelVersion: string;
  summary: StudySummary;
  /** largest |σ2| (transverse ply stress) after demould, MPa: the residual stress that cracks plies */
  maxTransverseStressMPa: number;
  predicted: PredictionTrace;
  atTcs: PredictionAtTc[];
  baseline: {
    revisionId: number;
    studyId: number;
    number: number;
    summary: StudySummary;
    /** absent in records made before it was kept */
    maxTransverseStressMPa?: number;
    predicted: PredictionTrace;
  } | null;
}

export interface RunLogRecord {
  format: 'run-log/1';
  fileName: string;
  rows: number;
  durationMin: number;
  startedAt: string | null;
  mapping: RunLogMapping;
  channels: { key: string; label: string; role: string; sourceUnit: string; position?: PartPosition }[];
  /** the study revision the run was checked against */
  checkedAgainst: { studyId: number; revisionId: number; number: number };
  hygiene: HygieneReport;
  spec: SpecReport;
  chart: ChartSeries;
  replay: ReplayRecord | null;
  /** why the replay could not run, when it could not */
  replayError: string | null;
}

/** Row indices for a chart of at most `max` points, evenly spread, first and last included. */
export function chartIndices(n: number, max = CHART_MAX_POINTS): number[] {
  if (n <= max) return Array.from({ length: n }, (_, i) => i);
  return Array.from({ length: max }, (_, k) => Math.round((k * (n - 1)) / (max - 1)));
}

/** The measured channels thinned for charts, in display units. */
export function chartSeries(log: RunLog, max = CHART_MAX_POINTS): ChartSeries {
  const idx = chartIndices(log.rows, max);
  const channels: ChartSeries['channels'] = {};
  for (const c of log.channels) {
    const show = c.role === 'pressure' ? paToBar : c.role === 'vacuum' ? paToKpa : kToC;
    channels[c.key] = idx.map((i) => (Number.isFinite(c.values[i]) ? round(show(c.values[i]), 5) : null));
  }
  return { timeMin: idx.map((i) => round(sToMin(log.timeS[i]), 6)), channels };
}

/** A simulation's history thinned for charts, in °C and degree of cure. */
export function predictionTrace(result: SimulationResult, max = CHART_MAX_POINTS): PredictionTrace {
  const h = result.history;
  const idx = chartIndices(h.timeS.length, max);
  const pick = (a: Float64Array, f: (v: number) => number = kToC) => idx.map((i) => round(f(a[i]), 5));
  return {
    timeMin: idx.map((i) => round(sToMin(h.timeS[i]), 6)),
    airC: pick(h.airK),
    bagC: pick(h.bagSurfaceK),
    midC: pick(h.midPlaneK),
    toolSideC: pick(h.toolSideSurfaceK),
    alphaMin: pick(h.alphaMin, (v) => v),
    tgMidC: pick(h.tgMidK),
  };
}

function historyAt(result: SimulationResult, position: PartPosition): Float64Array | null {
  if (position === 'bag-side') return result.history.bagSurfaceK;
  if (position === 'mid-plane') return result.history.midPlaneK;
  if (position === 'tool-side') return result.history.toolSideSurfaceK;
  return null;
}

/** Index of the laminate node at a TC's place: tool side is z = 0, bag side the top. */
function nodeAt(zM: Float64Array, position: PartPosition): number {
  const top = zM.length - 1;
  if (position === 'tool-side') return 0;
  if (position === 'bag-side') return top;
  const mid = (zM[0] + zM[top]) / 2;
  let best = 0;
  for (let i = 1; i < zM.length; i++) if (Math.abs(zM[i] - mid) < Math.abs(zM[best] - mid)) best = i;
  return best;
}

/**
 * Predictions at each part TC's place (final cure and Tg from the last stored cure profile and the
 * DiBenedetto relation of the resin card) and how far the measured trace is from the predicted one.
 * `result` must come from simulate(..., { recordProfiles: true }) for cure at a place; without profiles
 * the cure columns stay null.
 */
export function predictionsAtTcs(log: RunLog, result: SimulationResult, params: StudyParams): PredictionAtTc[] {
  const tg = prepareGlassTransition(params.resin.glassTransition);
  const { zM, alpha } = result.profiles;
  const nodes = zM.length;
  const steps = nodes > 0 ? alpha.length / nodes : 0;
  const t = result.history.timeS;
  return log.channels
    .filter((c) => c.role === 'part')
    .map((c) => {
      const position = c.position ?? 'unknown';
      const predicted = historyAt(result, position);
      let finalCure: number | null = null;
      let finalTgC: number | null = null;
      if (position !== 'unknown' && steps > 0) {
        const a = alpha[(steps - 1) * nodes + nodeAt(zM, position)];
        finalCure = round(a, 4);
        finalTgC = round(kToC(glassTransitionK(a, tg)), 4);
      }
      if (!predicted) return { channel: c.label, position, finalCure, finalTgC, rmsDifferenceC: null, maxDifferenceC: null, maxDifferenceAtMin: null };
      let sum = 0;
      let count = 0;
      let worst = 0;
      let worstAt = 0;
      for (let i = 0; i < log.rows; i++) {
        const m = c.values[i];
        if (!Number.isFinite(m) || log.timeS[i] > t[t.length - 1]) continue;
        const d = m - interpolate(t, predicted, log.timeS[i]);
        sum += d * d;
        count++;
        if (Math.abs(d) > Math.abs(worst)) {
          worst = d;
          worstAt = log.timeS[i];
        }
      }
      return {
        channel: c.label,
        position,
        finalCure,
        finalTgC,
        rmsDifferenceC: count ? round(Math.sqrt(sum / count), 4) : null,
        maxDifferenceC: count ? round(worst, 4) : null,
        maxDifferenceAtMin: count ? round(sToMin(worstAt), 5) : null,
      };
    });
}

/** Largest |σ2| over the ply points after demould, MPa. */
export function maxTransverseStressMPa(result: SimulationResult): number {
  let worst = 0;
  for (const s of result.plyStresses.sigma2Pa) if (Math.abs(s) > Math.abs(worst)) worst = s;
  return round(paToMpa(worst), 4);
}

