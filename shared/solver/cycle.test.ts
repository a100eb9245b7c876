import { describe, expect, it } from 'vitest';
import type { Cycle } from '../schemas/study';
import { parseStudy } from '../schemas/study';
import { kToC } from '../units';
import { referenceStudy } from './demo-cards';
import { MAX_LAGGING_WAIT_S, advanceCycle, airAt, airRateKPerS, createCycleState, nextEventS, plannedSchedule, prepareCycle, scheduledDurationS, type CycleProgram, type CycleState } from './cycle';

function cycleOf(cycle: unknown): Cycle {
  return parseStudy({ ...referenceStudy(), cycle }).cycle;
}

/** Step the machine to the end, landing on its events, with a step cap; returns the air trace. */
function run(program: CycleProgram, capS: number, part?: (tS: number, dtS: number, air: number, rate: number) => number) {
  const state = createCycleState(program);
  let t = 0;
  let partK = airAt(program, state, 0).airK;
  const trace: { t: number; airC: number; partC: number }[] = [{ t, airC: kToC(partK), partC: kToC(partK) }];
  while (!state.done) {
    const dt = Math.min(capS, nextEventS(program, state) - t);
    const before = airAt(program, state, t).airK;
    const rate = (airAt(program, state, t + dt).airK - before) / dt;
    partK = part ? part(t, dt, before, rate) : airAt(program, state, t + dt).airK;
    t += dt;
    const air = airAt(program, state, t).airK;
    advanceCycle(program, state, t, partK, partK);
    trace.push({ t, airC: kToC(air), partC: kToC(partK) });
  }
  return { state, trace };
}

const twoDwell = {
  kind: 'segments',
  startC: 20,
  segments: [
    { kind: 'ramp', rateCPerMin: 2, targetC: 120, pressureBar: 7 },
    { kind: 'hold', holdMin: 90, pressureBar: 7, start: 'clock', bandC: 5 },
    { kind: 'ramp', rateCPerMin: 1.5, targetC: 180, pressureBar: 7 },
    { kind: 'hold', holdMin: 120, pressureBar: 7, start: 'clock', bandC: 5 },
    { kind: 'cool', rateCPerMin: 2, targetC: 60, pressureBar: 3 },
  ],
};

describe('cycle state machine', () => {
  it('gives the closed-form segment times of a ramp/hold/ramp/hold/cool schedule', () => {
    // Closed form: (120−20)/2 = 50 min; +90 = 140; +(180−120)/1.5 = 180; +120 = 300; +(180−60)/2 = 360 min.
    const program = prepareCycle(cycleOf(twoDwell));
    expect(scheduledDurationS(program)).toBeCloseTo(360 * 60, 9);
    const { state } = run(program, 60);
    expect(state.boundsS.map((s) => s / 60)).toEqual([0, 50, 140, 180, 300, 360].map((m) => expect.closeTo(m, 9)));
    expect(state.done).toBe(true);
  });

  it('gives air temperature, pressure and rate inside each segment', () => {
    const program = prepareCycle(cycleOf(twoDwell));
    const state = createCycleState(program);
    // 2 °C/min from 20 °C: 25 min → 70 °C.
    expect(kToC(airAt(program, state, 25 * 60).airK)).toBeCloseTo(70, 9);
    expect(airAt(program, state, 25 * 60).pressurePa).toBe(7e5);
    expect(airRateKPerS(program, state)).toBeCloseTo(2 / 60, 12);
    // Land on the ramp end, then into the first hold.
    advanceCycle(program, state, 50 * 60, 0, 1e9);
    expect(state.index).toBe(1);
    expect(kToC(airAt(program, state, 80 * 60).airK)).toBeCloseTo(120, 9);
    expect(nextEventS(program, state)).toBeCloseTo(140 * 60, 9);
  });

  it('never overshoots a ramp target even past the scheduled end', () => {
    const program = prepareCycle(cycleOf(twoDwell));
    const state = createCycleState(program);
    expect(kToC(airAt(program, state, 51 * 60).airK)).toBeCloseTo(120, 12);
  });

  it('starts a lagging-part hold clock when the coldest point enters the band (lumped part, closed form)', () => {
    // A lumped part with time constant τ following the air (dT/dt = (T_air − T)/τ) lags a ramp of rate r by
    // rτ(1 − e^(−t/τ)); after the ramp ends at t1 the lag decays as e^(−(t−t1)/τ), so it enters a band b at
    // t1 + τ ln(rτ(1 − e^(−t1/τ))/b) (closed form of the first-order lag).
    const tau = 600;
    const r = 2 / 60;
    const band = 5;
    const cycle = cycleOf({
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 2, targetC: 120, pressureBar: 7 },
        { kind: 'hold', holdMin: 60, pressureBar: 7, start: 'lagging-part', bandC: band },
        { kind: 'cool', rateCPerMin: 3, targetC: 60, pressureBar: 0 },
      ],
    });
    let T = 293.15;
    const exact = (_t: number, dt: number, airStart: number, rate: number) => {
      // exact over a step with linear air
      const airEnd = airStart + rate * dt;
      T = airEnd - rate * tau + (T - airStart + rate * tau) * Math.exp(-dt / tau);
      return T;
    };
    const t1 = 3000;
    const enter = t1 + tau * Math.log((r * tau * (1 - Math.exp(-t1 / tau))) / band);
    expect(enter - t1).toBeCloseTo(827.7, 0);
    // Fine steps (0.5 s) and the loop's usual coarse ones (30 s): the start is placed inside the step where
    // the part crossed into the band, so even 30 s steps find it within a second.
    for (const [stepS, tolS] of [[0.5, 0.01], [30, 1]]) {
      T = 293.15;
      const { state } = run(prepareCycle(cycle), stepS, exact);
      expect(state.boundsS[1]).toBeCloseTo(t1, 9);
      expect(Math.abs(state.boundsS[2] - (enter + 3600))).toBeLessThanOrEqual(tolS);
      // the cool of 60 K at 3 °C/min follows
      expect(state.boundsS[3] - state.boundsS[2]).toBeCloseTo(1200, 6);
    }
  });

  it('after a cool the lagging point is the hottest one', () => {
    const cycle = cycleOf({
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 2, targetC: 180, pressureBar: 7 },
        { kind: 'cool', rateCPerMin: 2, targetC: 100, pressureBar: 7 },
        { kind: 'hold', holdMin: 10, pressureBar: 7, start: 'lagging-part', bandC: 5 },
        { kind: 'cool', rateCPerMin: 2, targetC: 60, pressureBar: 7 },
      ],
    });
    const program = prepareCycle(cycle);
    const state: CycleState = createCycleState(program);
    advanceCycle(program, state, 80 * 60, 0, 0); // ramp done
    advanceCycle(program, state, 120 * 60, 360, 400); // cool done, part still hot: waiting in the hold
    expect(state.index).toBe(2);
    advanceCycle(program, state, 121 * 60, 360, 380); // hottest 106.85 °C: still out of band
    expect(state.clockStartS).toBe(-1);
    advanceCycle(program, state, 122 * 60, 360, 377.5); // hottest 104.35 °C: in band
    // the margin went from −1.85 K to +0.65 K over the step: zero crossing 1.85/2.5 of the way through
    expect(state.clockStartS).toBeCloseTo(121 * 60 + 0.74 * 60, 9);
    expect(nextEventS(program, state)).toBeCloseTo(121 * 60 + 0.74 * 60 + 600, 9);
  });

  it('starts a lagging hold anyway after the 24 h wait cap, and says so', () => {
    const cycle = cycleOf({
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 2, targetC: 120, pressureBar: 7 },
        { kind: 'hold', holdMin: 10, pressureBar: 7, start: 'lagging-part', bandC: 1 },
        { kind: 'cool', rateCPerMin: 2, targetC: 60, pressureBar: 7 },
      ],
    });
    const program = prepareCycle(cycle);
    const state = createCycleState(program);
    advanceCycle(program, state, 3000, 300, 300);
    expect(nextEventS(program, state)).toBe(3000 + MAX_LAGGING_WAIT_S);
    advanceCycle(program, state, 3000 + MAX_LAGGING_WAIT_S, 300, 300); // part still 90 K short
    expect(state.clockStartS).toBe(3000 + MAX_LAGGING_WAIT_S);
    expect(state.waitTimeouts).toEqual([1]);
    expect(nextEventS(program, state)).toBe(3000 + MAX_LAGGING_WAIT_S + 600);
  });

  it('interpolates a measured record linearly, tool column and pressure included', () => {
    const cycle = cycleOf({
      kind: 'record',
      points: [
        { timeMin: 0, airC: 20, toolC: 18, pressureBar: 0 },
        { timeMin: 10, airC: 40, toolC: 30, pressureBar: 6 },
        { timeMin: 30, airC: 40 },
      ],
    });
    const program = prepareCycle(cycle);
    const state = createCycleState(program);
    const a = airAt(program, state, 5 * 60);
    expect(kToC(a.airK)).toBeCloseTo(30, 9);
    expect(kToC(a.toolAirK)).toBeCloseTo(24, 9);
    expect(a.pressurePa).toBeCloseTo(3e5, 6);
    const { state: end } = run(program, 60);
    expect(end.boundsS).toEqual([0, 1800]);
    // missing tool column falls back to the air; missing pressure repeats the last one
    const s2 = createCycleState(program);
    advanceCycle(program, s2, 600, 0, 0);
    const b = airAt(program, s2, 1200);
    expect(kToC(b.toolAirK)).toBeCloseTo(35, 9);
    expect(b.pressurePa).toBe(6e5);
  });
});

describe('planned schedule', () => {
  it('gives the corner points of the schedule (closed form: 50, 140, 180, 300, 360 min)', () => {
    const s = plannedSchedule(cycleOf(twoDwell));
    expect(s.timeMin).toEqual([0, 50, 140, 180, 300, 360].map((m) => expect.closeTo(m, 9)));
    expect(s.airC).toEqual([20, 120, 120, 180, 180, 60]);
    expect(s.pressureBar).toEqual([7, 7, 7, 7, 7, 3]);
  });
});
