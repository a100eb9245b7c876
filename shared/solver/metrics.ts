import type { Limits } from '../schemas/study';
import { kToC, mToMm, sToMin } from '../units';
import { glassTransitionK, type GlassTransitionK } from './glass-transition';

// Process metrics gathered while the time loop runs (so no profile has to be stored to get them) and the
// summary with each limit's pass/fail and where/when it is worst. Pure functions over a plain tracker object
// allocated once per simulation.

export interface LimitCheck {
  key: keyof Limits;
  label: string;
  value: number;
  limit: number;
  unit: string;
  pass: boolean;
  atTimeMin: number | null;
  atZMm: number | null;
}

/** JSON-safe, engineering units; every number finite (−1 marks "never reached" for gel/vitrification). */
export interface StudySummary {
  finalCureMin: number;
  finalCureMinZMm: number;
  finalTgC: number;
  peakPartC: number;
  peakOvershootC: number;
  peakOvershootTimeMin: number;
  peakOvershootZMm: number;
  maxGradientC: number;
  maxGradientTimeMin: number;
  maxHeatRateCPerMin: number;
  maxCoolRateCPerMin: number;
  warpageMm: number;
  springInDeg: number;
  /** temperature at which warpage, spring-in, curvature and ply stresses are reported: the shop temperature
   * the demoulded part cools to (the cycle's start, or a record's first air point), °C */
  shapeAtC: number;
  cycleMin: number;
  adiabaticRiseC: number;
  gelTimeMin: number;
  vitrificationTimeMin: number;
  steps: number;
  limits: LimitCheck[];
  /** notes the analyst should see (e.g. a lagging-part hold that timed out); additive to the contract */
  warnings: string[];
}

export interface MetricsTracker {
  /** laminate node positions from the laminate bottom (tool side), m */
  zM: Float64Array;
  gelPoint: number;
  tg: GlassTransitionK;
  gelTimeS: Float64Array;
  vitrificationTimeS: Float64Array;
  prevT: Float64Array;
  prevAlpha: Float64Array;
  prevTimeS: number;
  peakPartK: number;
  /** highest set point so far: the reference for exotherm overshoot (a part lagging a cool-down is not an exotherm) */
  overshootRefK: number;
  peakOvershootK: number;
  peakOvershootTimeS: number;
  peakOvershootZM: number;
  maxGradientK: number;
  maxGradientTimeS: number;
  maxHeatRateKPerS: number;
  maxHeatRateTimeS: number;
  maxHeatRateZM: number;
  maxCoolRateKPerS: number;
  maxCoolRateTimeS: number;
  maxCoolRateZM: number;
}

/** Start tracking from the initial state. `TK`/`alpha` hold the laminate nodes at [offset, offset + zM.length). */
export function createMetricsTracker(
  zM: Float64Array,
  gelPoint: number,
  tg: GlassTransitionK,
  TK: Float64Array,
  alpha: Float64Array,
  offset: number,
  setpointK: number,
): MetricsTracker {
  const n = zM.length;
  const tr: MetricsTracker = {
    zM,
    gelPoint,
    tg,
    gelTimeS: new Float64Array(n).fill(-1),
    vitrificationTimeS: new Float64Array(n).fill(-1),
    prevT: new Float64Array(n),
    prevAlpha: new Float64Array(n),
    prevTimeS: 0,
    peakPartK: -Infinity,
    overshootRefK: setpointK,
    peakOvershootK: -Infinity,
    peakOvershootTimeS: 0,
    peakOvershootZM: 0,
    maxGradientK: 0,
    maxGradientTimeS: 0,
    maxHeatRateKPerS: 0,
    maxHeatRateTimeS: 0,
    maxHeatRateZM: 0,
    maxCoolRateKPerS: 0,
    maxCoolRateTimeS: 0,
    maxCoolRateZM: 0,
  };
  for (let i = 0; i < n; i++) {
    const T = TK[offset + i];
    const a = alpha[offset + i];
    tr.prevT[i] = T;
    tr.prevAlpha[i] = a;
    if (a >= gelPoint) tr.gelTimeS[i] = 0;
    if (T < glassTransitionK(a, tg)) tr.vitrificationTimeS[i] = 0;
  }
  observeExtremes(tr, 0, TK, offset, setpointK);
  return tr;
}

function observeExtremes(tr: MetricsTracker, tS: number, TK: Float64Array, offset: number, setpointK: number): void {
  if (setpointK > tr.overshootRefK) tr.overshootRefK = setpointK;
  let minT = Infinity;
  let maxT = -Infinity;
  let maxAt = 0;
  for (let i = 0; i < tr.zM.length; i++) {
    const T = TK[offset + i];
    if (T < minT) minT = T;
    if (T > maxT) {
      maxT = T;
      maxAt = i;
    }
  }
  if (maxT > tr.peakPartK) tr.peakPartK = maxT;
  const over = maxT - tr.overshootRefK;
  if (over > tr.peakOvershootK) {
    tr.peakOvershootK = over;
    tr.peakOvershootTimeS = tS;
    tr.peakOvershootZM = tr.zM[maxAt];
  }
  if (maxT - minT > tr.maxGradientK) {
    tr.maxGradientK = maxT - minT;
    tr.maxGradientTimeS = tS;
  }
}

/** Record one accepted step ending at tS. Gel and vitrification times are interpolated inside the step. */
export function observeStep(tr: MetricsTracker, tS: number, TK: Float64Array, alpha: Float64Array, offset: number, setpointK: number): void {
  const dt = tS - tr.prevTimeS;
  const t0 = tr.prevTimeS;
  for (let i = 0; i < tr.zM.length; i++) {
    const T = TK[offset + i];
    const a = alpha[offset + i];
    const T0 = tr.prevT[i];
    const a0 = tr.prevAlpha[i];
    if (tr.gelTimeS[i] < 0 && a >= tr.gelPoint) {
      const f = a > a0 ? (tr.gelPoint - a0) / (a - a0) : 1;
      tr.gelTimeS[i] = t0 + clamp01(f) * dt;
    }
    if (tr.vitrificationTimeS[i] < 0) {
      // margin T − Tg(α) goes from positive to ≤ 0; interpolate its zero crossing
      const m1 = T - glassTransitionK(a, tr.tg);
      if (m1 <= 0) {
        const m0 = T0 - glassTransitionK(a0, tr.tg);
        const f = m0 > m1 ? m0 / (m0 - m1) : 1;
        tr.vitrificationTimeS[i] = t0 + clamp01(f) * dt;
      }
    }
    if (dt > 0) {
      const rate = (T - T0) / dt;
      if (rate > tr.maxHeatRateKPerS) {
        tr.maxHeatRateKPerS = rate;
        tr.maxHeatRateTimeS = tS;
        tr.maxHeatRateZM = tr.zM[i];
      } else if (-rate > tr.maxCoolRateKPerS) {
        tr.maxCoolRateKPerS = -rate;
        tr.maxCoolRateTimeS = tS;
        tr.maxCoolRateZM = tr.zM[i];
      }
    }
    tr.prevT[i] = T;
    tr.prevAlpha[i] = a;
  }
  tr.prevTimeS = tS;
  observeExtremes(tr, tS, TK, offset, setpointK);
}

function clamp01(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}

export interface SummaryInputs {
  tracker: MetricsTracker;
  /** final laminate α, node order as tracker.zM */
  finalAlpha: Float64Array;
  offset: number;
  demouldS: number;
  steps: number;
  warpageMm: number;
  springInDeg: number;
  /** temperature the shape is reported at, K */
  shapeAtK: number;
  adiabaticRiseK: number;
  limits: Limits;
  warnings: string[];
}

function earliest(times: Float64Array): number {
  let best = -1;
  for (const t of times) if (t >= 0 && (best < 0 || t < best)) best = t;
  return best;
}

const finite = (x: number, fallback = 0): number => (Number.isFinite(x) ? x : fallback);
const minOrNever = (s: number): number => (s < 0 ? -1 : sToMin(s));

/** Build the JSON-safe summary: every number finite, engineering units. */
export function summarize(s: SummaryInputs): StudySummary {
  const tr = s.tracker;
  let aMin = Infinity;
  let aMinAt = 0;
  for (let i = 0; i < tr.zM.length; i++) {
    const a = s.finalAlpha[s.offset + i];
    if (a < aMin) {
      aMin = a;
      aMinAt = i;
    }
  }
  const finalTgK = glassTransitionK(aMin, tr.tg);
  const demouldMin = sToMin(s.demouldS);
  const overshootK = Math.max(0, finite(tr.peakOvershootK));
  const summary: Omit<StudySummary, 'limits'> = {
    finalCureMin: finite(aMin),
    finalCureMinZMm: mToMm(tr.zM[aMinAt]),
    finalTgC: kToC(finalTgK),
    peakPartC: kToC(finite(tr.peakPartK, 0)),
    peakOvershootC: overshootK,
    peakOvershootTimeMin: sToMin(tr.peakOvershootTimeS),
    peakOvershootZMm: mToMm(tr.peakOvershootZM),
    maxGradientC: tr.maxGradientK,
    maxGradientTimeMin: sToMin(tr.maxGradientTimeS),
    maxHeatRateCPerMin: tr.maxHeatRateKPerS * 60,
    maxCoolRateCPerMin: tr.maxCoolRateKPerS * 60,
    warpageMm: finite(s.warpageMm),
    springInDeg: finite(s.springInDeg),
    shapeAtC: kToC(s.shapeAtK),
    cycleMin: demouldMin,
    adiabaticRiseC: finite(s.adiabaticRiseK),
    gelTimeMin: minOrNever(earliest(tr.gelTimeS)),
    vitrificationTimeMin: minOrNever(earliest(tr.vitrificationTimeS)),
    steps: s.steps,
    warnings: s.warnings,
  };
  const L = s.limits;
  const limits: LimitCheck[] = [
    {
      key: 'minFinalCure', label: 'Final degree of cure, lowest point', value: summary.finalCureMin, limit: L.minFinalCure,
      unit: '', pass: summary.finalCureMin >= L.minFinalCure, atTimeMin: demouldMin, atZMm: summary.finalCureMinZMm,
    },
    {
      key: 'maxOvershootC', label: 'Exotherm overshoot above set point', value: overshootK, limit: L.maxOvershootC,
      // never above the set point: no place or time to point at
      unit: '°C', pass: overshootK <= L.maxOvershootC,
      atTimeMin: overshootK > 0 ? summary.peakOvershootTimeMin : null, atZMm: overshootK > 0 ? summary.peakOvershootZMm : null,
    },
    {
      key: 'maxGradientC', label: 'Through-thickness temperature difference', value: tr.maxGradientK, limit: L.maxGradientC,
      unit: '°C', pass: tr.maxGradientK <= L.maxGradientC, atTimeMin: summary.maxGradientTimeMin, atZMm: null,
    },
    {
      key: 'maxHeatRateCPerMin', label: 'Heat-up rate seen by the part', value: summary.maxHeatRateCPerMin, limit: L.maxHeatRateCPerMin,
      unit: '°C/min', pass: summary.maxHeatRateCPerMin <= L.maxHeatRateCPerMin,
      atTimeMin: sToMin(tr.maxHeatRateTimeS), atZMm: mToMm(tr.maxHeatRateZM),
    },
    {
      key: 'maxCoolRateCPerMin', label: 'Cool-down rate seen by the part', value: summary.maxCoolRateCPerMin, limit: L.maxCoolRateCPerMin,
      unit: '°C/min', pass: summary.maxCoolRateCPerMin <= L.maxCoolRateCPerMin,
      atTimeMin: sToMin(tr.maxCoolRateTimeS), atZMm: mToMm(tr.maxCoolRateZM),
    },
    {
      key: 'maxWarpageMm', label: 'Warpage over the strip span', value: Math.abs(summary.warpageMm), limit: L.maxWarpageMm,
      unit: 'mm', pass: Math.abs(summary.warpageMm) <= L.maxWarpageMm, atTimeMin: demouldMin, atZMm: null,
    },
    {
      key: 'maxSpringInDeg', label: 'Corner spring-in', value: Math.abs(summary.springInDeg), limit: L.maxSpringInDeg,
      unit: '°', pass: Math.abs(summary.springInDeg) <= L.maxSpringInDeg, atTimeMin: demouldMin, atZMm: null,
    },
    {
      key: 'maxCycleMin', label: 'Cycle time to demould', value: demouldMin, limit: L.maxCycleMin,
      unit: 'min', pass: demouldMin <= L.maxCycleMin, atTimeMin: demouldMin, atZMm: null,
    },
  ];
  return { ...summary, limits };
}
