import type { Cycle } from '../schemas/study';
import { barToPa, cPerMinToKPerS, cToK, minToS } from '../units';

// The cure cycle as a small state machine that the time loop advances. Segment cycles (ramp/hold/cool) have
// holds whose clock may start only when the lagging part point has entered the hold band, so the schedule
// depends on the simulation state: the loop asks for the air at t, for the next event to land on, and after
// each accepted step tells the machine the part's coldest and hottest temperatures. Measured records are
// interpolated linearly. All functions are pure over plain objects (state is mutated in place, allocated once).

/** Longest a lagging-part hold waits for the part before its clock starts anyway (a flagged event). */
export const MAX_LAGGING_WAIT_S = 24 * 3600;
/** Times closer than this are the same instant (floating-point slack when landing on events). */
export const TIME_EPS_S = 1e-6;

export interface PreparedSegment {
  kind: 'ramp' | 'hold' | 'cool';
  /** air set point at the segment start and end, K */
  fromK: number;
  toK: number;
  /** signed air rate, K/s (0 for holds) */
  rateKPerS: number;
  /** ramp/cool: scheduled duration; hold: hold time once its clock runs, s */
  durationS: number;
  pressurePa: number;
  lagging: boolean;
  bandK: number;
  /** +1 if the part approaches the hold from below (lagging point = coldest), −1 from above, 0 unknown */
  approach: number;
}

export interface SegmentProgram {
  kind: 'segments';
  startK: number;
  segments: PreparedSegment[];
}

export interface RecordProgram {
  kind: 'record';
  /** seconds from the first record point */
  timeS: Float64Array;
  airK: Float64Array;
  /** NaN-free: equals airK where the record has no tool column */
  toolK: Float64Array;
  pressurePa: Float64Array;
}

export type CycleProgram = SegmentProgram | RecordProgram;

export interface CycleState {
  /** segment index (segments) or interval index (record) */
  index: number;
  /** when the current segment began, s */
  segmentStartS: number;
  /** for holds: when the hold clock started, s; −1 while waiting for the lagging part */
  clockStartS: number;
  /** true once the last segment has ended (demould) */
  done: boolean;
  /** segment start times, then the demould time; grows as the loop advances */
  boundsS: number[];
  /** lagging-part holds whose clock started only because the wait cap ran out */
  waitTimeouts: number[];
  /** the previous accepted step: time and part extremes (to place a hold's clock start inside the step) */
  lastTimeS: number;
  lastMinK: number;
  lastMaxK: number;
}

export interface AirConditions {
  airK: number;
  /** tool-side air (the measured tool column of a record, else the air) */
  toolAirK: number;
  pressurePa: number;
  /** controller set point: what the air is meant to be; for records, the recorded air */
  setpointK: number;
}

/** Convert the study's cycle once to SI. */
export function prepareCycle(cycle: Cycle): CycleProgram {
  if (cycle.kind === 'record') {
    const n = cycle.points.length;
    const t0 = cycle.points[0].timeMin;
    const timeS = new Float64Array(n);
    const airK = new Float64Array(n);
    const toolK = new Float64Array(n);
    const pressurePa = new Float64Array(n);
    let lastPressure = 0;
    cycle.points.forEach((p, i) => {
      timeS[i] = minToS(p.timeMin - t0);
      airK[i] = cToK(p.airC);
      toolK[i] = p.toolC === undefined ? airK[i] : cToK(p.toolC);
      // A missing pressure repeats the last recorded one (0 gauge before the first).
      lastPressure = p.pressureBar === undefined ? lastPressure : barToPa(p.pressureBar);
      pressurePa[i] = lastPressure;
    });
    return { kind: 'record', timeS, airK, toolK, pressurePa };
  }
  let currentK = cToK(cycle.startC);
  let lastDirection = 0;
  const segments = cycle.segments.map((seg): PreparedSegment => {
    const fromK = currentK;
    if (seg.kind === 'hold') {
      return {
        kind: 'hold',
        fromK,
        toK: fromK,
        rateKPerS: 0,
        durationS: minToS(seg.holdMin),
        pressurePa: barToPa(seg.pressureBar),
        lagging: seg.start === 'lagging-part',
        bandK: seg.bandC,
        approach: lastDirection,
      };
    }
    const toK = cToK(seg.targetC);
    const rate = cPerMinToKPerS(seg.rateCPerMin);
    const sign = seg.kind === 'ramp' ? 1 : -1;
    currentK = toK;
    lastDirection = sign;
    return {
      kind: seg.kind,
      fromK,
      toK,
      rateKPerS: sign * rate,
      durationS: Math.abs(toK - fromK) / rate,
      pressurePa: barToPa(seg.pressureBar),
      lagging: false,
      bandK: 0,
      approach: sign,
    };
  });
  return { kind: 'segments', startK: cToK(cycle.startC), segments };
}

export function createCycleState(program: CycleProgram): CycleState {
  // The part starts uniform at the starting air temperature.
  const startK = program.kind === 'record' ? program.airK[0] : program.startK;
  const state: CycleState = {
    index: 0, segmentStartS: 0, clockStartS: -1, done: false, boundsS: [0], waitTimeouts: [],
    lastTimeS: 0, lastMinK: startK, lastMaxK: startK,
  };
  enterSegment(program, state, 0);
  return state;
}

function enterSegment(program: CycleProgram, state: CycleState, tS: number): void {
  if (program.kind === 'record') return;
  const seg = program.segments[state.index];
  state.segmentStartS = tS;
  state.clockStartS = seg.kind === 'hold' && seg.lagging ? -1 : tS;
}

/** Air, tool-side air, pressure and set point at time t within the current segment (written into `out` if given). */
export function airAt(program: CycleProgram, state: CycleState, tS: number, out?: AirConditions): AirConditions {
  const o = out ?? { airK: 0, toolAirK: 0, pressurePa: 0, setpointK: 0 };
  if (program.kind === 'record') {
    const { timeS, airK, toolK, pressurePa } = program;
    const last = timeS.length - 1;
    let i = Math.min(state.index, last - 1);
    while (i < last - 1 && tS > timeS[i + 1]) i++;
    while (i > 0 && tS < timeS[i]) i--;
    const span = timeS[i + 1] - timeS[i];
    const f = Math.min(1, Math.max(0, (tS - timeS[i]) / span));
    const air = airK[i] + f * (airK[i + 1] - airK[i]);
    return fill(o, air, toolK[i] + f * (toolK[i + 1] - toolK[i]), pressurePa[i] + f * (pressurePa[i + 1] - pressurePa[i]), air);
  }
  const seg = program.segments[Math.min(state.index, program.segments.length - 1)];
  if (state.done) return fill(o, seg.toK, seg.toK, seg.pressurePa, seg.toK);
  let air: number;
  if (seg.kind === 'hold') air = seg.toK;
  else {
    air = seg.fromK + seg.rateKPerS * (tS - state.segmentStartS);
    // Clamp on the target: the loop lands on the end, but never overshoot through rounding.
    air = seg.rateKPerS > 0 ? Math.min(air, seg.toK) : Math.max(air, seg.toK);
  }
  return fill(o, air, air, seg.pressurePa, air);
}

function fill(o: AirConditions, airK: number, toolAirK: number, pressurePa: number, setpointK: number): AirConditions {
  o.airK = airK;
  o.toolAirK = toolAirK;
  o.pressurePa = pressurePa;
  o.setpointK = setpointK;
  return o;
}

/** |d(air)/dt| in the current segment, K/s (for the step limit on the air change). */
export function airRateKPerS(program: CycleProgram, state: CycleState): number {
  if (program.kind === 'record') {
    const { timeS, airK, toolK } = program;
    const i = Math.min(state.index, timeS.length - 2);
    const span = timeS[i + 1] - timeS[i];
    return Math.max(Math.abs(airK[i + 1] - airK[i]), Math.abs(toolK[i + 1] - toolK[i])) / span;
  }
  if (state.done) return 0;
  return Math.abs(program.segments[state.index].rateKPerS);
}

/**
 * The next instant the loop must land on exactly: end of a ramp/cool, end of a running hold, the next record
 * point. Infinity while a lagging-part hold waits for the part (the loop's step cap bounds that wait).
 */
export function nextEventS(program: CycleProgram, state: CycleState): number {
  if (state.done) return Infinity;
  if (program.kind === 'record') return program.timeS[state.index + 1];
  const seg = program.segments[state.index];
  if (seg.kind === 'hold') {
    if (state.clockStartS < 0) return state.segmentStartS + MAX_LAGGING_WAIT_S;
    return state.clockStartS + seg.durationS;
  }
  return state.segmentStartS + seg.durationS;
}

/**
 * How far the lagging part point is inside the band of a hold, K (≥ 0 inside): the coldest point if the part
 * was heated into the hold, the hottest if it was cooled into it.
 */
export function laggingPartMargin(seg: PreparedSegment, partMinK: number, partMaxK: number): number {
  if (seg.approach < 0) return seg.toK + seg.bandK - partMaxK;
  return partMinK - (seg.toK - seg.bandK);
}

export function laggingPartInBand(seg: PreparedSegment, partMinK: number, partMaxK: number): boolean {
  return laggingPartMargin(seg, partMinK, partMaxK) >= 0;
}

/**
 * Tell the machine a step was accepted at time t with these part extremes. Starts lagging-hold clocks,
 * moves past segments whose end has been reached (several if they end together), marks demould.
 * Returns true if a segment boundary was crossed.
 */
export function advanceCycle(program: CycleProgram, state: CycleState, tS: number, partMinK: number, partMaxK: number): boolean {
  const crossed = advance(program, state, tS, partMinK, partMaxK);
  state.lastTimeS = tS;
  state.lastMinK = partMinK;
  state.lastMaxK = partMaxK;
  return crossed;
}

function advance(program: CycleProgram, state: CycleState, tS: number, partMinK: number, partMaxK: number): boolean {
  if (state.done) return false;
  if (program.kind === 'record') {
    const last = program.timeS.length - 1;
    let moved = false;
    while (state.index < last && tS >= program.timeS[state.index + 1] - TIME_EPS_S) {
      state.index++;
      moved = true;
    }
    if (state.index >= last) {
      state.index = last - 1;
      state.done = true;
      state.boundsS.push(program.timeS[last]);
    }
    return moved;
  }
  let crossed = false;
  for (;;) {
    const seg = program.segments[state.index];
    if (seg.kind === 'hold' && state.clockStartS < 0) {
      const now = laggingPartMargin(seg, partMinK, partMaxK);
      if (now >= 0) {
        // Entered the band during this step: place the start where the margin crossed zero (linear in time),
        // so the schedule moves smoothly with the inputs instead of in whole steps.
        const before = laggingPartMargin(seg, state.lastMinK, state.lastMaxK);
        const inStep = state.lastTimeS >= state.segmentStartS && before < 0 && tS > state.lastTimeS;
        state.clockStartS = inStep ? state.lastTimeS + (before / (before - now)) * (tS - state.lastTimeS) : tS;
      } else if (tS >= state.segmentStartS + MAX_LAGGING_WAIT_S - TIME_EPS_S) {
        state.clockStartS = tS;
        state.waitTimeouts.push(state.index);
      } else return crossed;
    }
    if (tS < nextEventS(program, state) - TIME_EPS_S) return crossed;
    crossed = true;
    state.boundsS.push(tS);
    if (state.index === program.segments.length - 1) {
      state.done = true;
      return crossed;
    }
    state.index++;
    enterSegment(program, state, tS);
  }
}

/** Scheduled total time if every hold started on the clock (a lower bound with lagging-part holds), s. */
export function scheduledDurationS(program: CycleProgram): number {
  if (program.kind === 'record') return program.timeS[program.timeS.length - 1];
  return program.segments.reduce((s, seg) => s + seg.durationS, 0);
}

/**
 * The planned schedule as corner points for a chart (every hold taken on the clock, so lagging-part holds show
 * their minimum length): time in minutes, air in °C, pressure in bar. Records come back as recorded.
 */
export function plannedSchedule(cycle: Cycle): { timeMin: number[]; airC: number[]; pressureBar: number[] } {
  if (cycle.kind === 'record') {
    const t0 = cycle.points[0].timeMin;
    let lastBar = 0;
    return {
      timeMin: cycle.points.map((p) => p.timeMin - t0),
      airC: cycle.points.map((p) => p.airC),
      pressureBar: cycle.points.map((p) => (lastBar = p.pressureBar ?? lastBar)),
    };
  }
  const timeMin = [0];
  const airC = [cycle.startC];
  const pressureBar = [cycle.segments[0].pressureBar];
  let t = 0;
  let c = cycle.startC;
  for (const seg of cycle.segments) {
    if (seg.kind === 'hold') t += seg.holdMin;
    else {
      t += Math.abs(seg.targetC - c) / seg.rateCPerMin;
      c = seg.targetC;
    }
    timeMin.push(t);
    airC.push(c);
    pressureBar.push(seg.pressureBar);
  }
  return { timeMin, airC, pressureBar };
}

/**
 * The shop's temperature: where the part starts (the cycle's start, or a record's first air point) and where it
 * is measured after demould.
 */
export function shopTemperatureK(cycle: Cycle): number {
  return cToK(cycle.kind === 'segments' ? cycle.startC : cycle.points[0].airC);
}

/** Assumed cooling rate of a demoulded part in shop air when no cool segment says otherwise (common practice, no source). */
const SHOP_COOL_RATE_C_PER_MIN = 2;

/**
 * How fast the demoulded part goes to the shop temperature: at the demould cool's rate for a segment cycle
 * (the last segment is always a cool), at 2 °C/min after a record. Below Tg the resin barely relaxes, so the
 * rate hardly matters; it only gives the last mechanics steps a duration.
 */
export function shopCoolRateKPerS(cycle: Cycle): number {
  const last = cycle.kind === 'segments' ? cycle.segments[cycle.segments.length - 1] : undefined;
  return cPerMinToKPerS(last && last.kind !== 'hold' ? last.rateCPerMin : SHOP_COOL_RATE_C_PER_MIN);
}
