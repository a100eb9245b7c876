import { MAX_LAMINATE_NODES, MAX_NODES_PER_PLY, StudyInputError, validateStudy, type StudyParamsInput } from '../schemas/study';
import { glassTransitionK } from './glass-transition';
import { advanceCycle, airAt, airRateKPerS, createCycleState, nextEventS, prepareCycle, scheduledDurationS, shopCoolRateKPerS, shopTemperatureK, TIME_EPS_S } from './cycle';
import { coolToShopTemperature, createMechanics, demould, mechanicsResult, mechanicsStep, primeMechanics, resinModulusPa } from './mechanics';
import { createMetricsTracker, observeStep, summarize } from './metrics';
import { DEFAULT_STEP_LIMITS, type SimulateOptions, type SimulationResult, type StepLimits } from './simulation-result';
import { cureRate, MAX_CURE_TOLERANCE } from './kinetics';
import { adiabaticTemperatureRiseK, advanceThermochemical, createThermochemical, maxCureRate } from './thermochemical';

export type { LimitCheck, SimulateOptions, SimulationHistory, SimulationResult, StepLimits, StudySummary } from './simulation-result';
export { DEFAULT_STEP_LIMITS, PREVIEW_OPTIONS } from './simulation-result';

// The adaptive time loop (step rule in shared/solver/README.md, "Time step"): cycle → heat and cure through the thickness → ply stresses and
// laminate equilibrium, step by step, with histories recorded and metrics tracked on the way. Everything is
// allocated once per simulation (history buffers grow by doubling, a handful of times per run), never per step.

export const MODEL_VERSION = 'dwellform-solver 1.3.0'; // 1.1: shape at the shop temperature; 1.2: step limits and cure tolerance sized by an accuracy budget; 1.3: α limit relaxed away from the gel front, thermal limits relaxed while the cure is quiet, cure tolerance 1e-7

/** Far more steps than any valid study needs; reaching it means the step control has failed. */
const MAX_STEPS = 5_000_000;
/**
 * While the gel front is out of reach the α limit is this many times larger. The tight limit is there to place
 * the gel front smoothly (warpage follows a dragged ramp without steps); away from it, cure moves the reaction
 * heat, Tg and stiffness only, which the accuracy budget shows the larger limit paces well.
 */
const RELAXED_CURE_FACTOR = 2;
/**
 * While the cure is quiet (the last step moved no laminate node's α by more than QUIET_CURE_CHANGE: the part
 * is still cold, or vitrified) the air and part temperature limits are QUIET_THERMAL_FACTOR times larger: the
 * reaction heat of such a step is under 0.02 K even without any loss, and the heat and stress steps are then
 * linear in the air; the accuracy budget holds as before (README, "Time step").
 */
const QUIET_CURE_CHANGE = 1e-4;
const QUIET_THERMAL_FACTOR = 2;
/** "Out of reach": no node still below the gel point is within this many relaxed α steps of it. */
const GEL_REACH_STEPS = 2;

/** True when no laminate node below the gel point has α within `window` of it (all gelled counts as far). */
function gelFrontFar(alpha: Float64Array, gelPoint: number, window: number): boolean {
  for (let j = 0; j < alpha.length; j++) {
    const a = alpha[j];
    if (a < gelPoint && a >= gelPoint - window) return false;
  }
  return true;
}
/** Energy-balance residual above which the summary warns (the model accepts < 0.5 %). */
const ENERGY_WARNING = 0.005;

const HISTORY_KEYS = [
  'timeS', 'airK', 'pressurePa', 'toolK', 'bagSurfaceK', 'midPlaneK', 'toolSideSurfaceK',
  'alphaMin', 'alphaMax', 'tgMidK', 'resinModulusMidPa', 'setpointK',
] as const;
type HistoryKey = (typeof HISTORY_KEYS)[number];

/** Growable column store: one Float64Array per series, doubled when full. */
interface Recorder {
  length: number;
  capacity: number;
  series: Record<HistoryKey, Float64Array>;
  /** profile rows (laminate nodes), or width 0 when not recorded */
  width: number;
  profileT: Float64Array;
  profileAlpha: Float64Array;
}

function createRecorder(capacity: number, width: number): Recorder {
  const series = {} as Record<HistoryKey, Float64Array>;
  for (const k of HISTORY_KEYS) series[k] = new Float64Array(capacity);
  return { length: 0, capacity, series, width, profileT: new Float64Array(capacity * width), profileAlpha: new Float64Array(capacity * width) };
}

function grow(a: Float64Array, size: number): Float64Array {
  const b = new Float64Array(size);
  b.set(a);
  return b;
}

/** Append a row; returns its index. */
function nextRow(r: Recorder): number {
  if (r.length === r.capacity) {
    r.capacity *= 2;
    for (const k of HISTORY_KEYS) r.series[k] = grow(r.series[k], r.capacity);
    if (r.width > 0) {
      r.profileT = grow(r.profileT, r.capacity * r.width);
      r.profileAlpha = grow(r.profileAlpha, r.capacity * r.width);
    }
  }
  return r.length++;
}

/**
 * Run one study. Accepts a parsed study or one with defaults still left out (hold start and band); throws
 * StudyInputError (fields, values, allowed ranges) on invalid input.
 */
export function simulate(input: StudyParamsInput, options: SimulateOptions = {}): SimulationResult {
  const checked = validateStudy(input);
  if (!checked.ok) throw new StudyInputError(checked.issues);
  const perPly = options.nodesPerPly;
  const plies = checked.params.layup.plies.length;
  const finest = Math.min(MAX_NODES_PER_PLY, Math.floor(MAX_LAMINATE_NODES / plies));
  if (perPly !== undefined && !(Number.isInteger(perPly) && perPly >= 1 && perPly <= finest)) {
    throw new StudyInputError([{ path: 'options.nodesPerPly', message: `${String(perPly)} is out of range: allowed a whole number ≥ 1 and ≤ ${finest} (${plies} plies, ≤ ${MAX_LAMINATE_NODES} laminate nodes)` }]);
  }
  const params = perPly === undefined ? checked.params : { ...checked.params, mesh: { nodesPerPly: perPly } };
  const limits: StepLimits = { ...DEFAULT_STEP_LIMITS, ...options.stepLimits };
  for (const [k, v] of Object.entries(limits)) {
    if (!(v > 0) || !Number.isFinite(v)) throw new StudyInputError([{ path: `options.stepLimits.${k}`, message: `${String(v)} is out of range: allowed > 0 and finite` }]);
  }

  const tol = options.cureTolerance;
  if (tol !== undefined && !(tol > 0 && tol <= MAX_CURE_TOLERANCE)) {
    throw new StudyInputError([{ path: 'options.cureTolerance', message: `${String(tol)} is out of range: allowed > 0 and ≤ ${MAX_CURE_TOLERANCE.toExponential()}` }]);
  }

  // --- set-up (all allocation happens here) ---
  const program = prepareCycle(params.cycle);
  const cycle = createCycleState(program);
  const air0 = airAt(program, cycle, 0);
  const tc = createThermochemical(params, { initialK: air0.airK, cureTolerance: options.cureTolerance });
  tc.toolAirK = air0.toolAirK;
  const nodes = tc.zM.length;
  const last = nodes - 1;
  const thicknessM = tc.zM[last];
  const hasTool = params.tool.kind === 'plate';

  // Mid-plane: between the two laminate nodes around half the thickness.
  let mid = 0;
  while (mid < last - 1 && tc.zM[mid + 1] < thicknessM / 2) mid++;
  const midW = (thicknessM / 2 - tc.zM[mid]) / (tc.zM[mid + 1] - tc.zM[mid] || 1);

  // Ply integration points (bottom and top face of each ply) are laminate nodes of the thermal mesh.
  const points = tc.plyPointNode.length;
  const pointT = new Float64Array(points);
  const pointAlpha = new Float64Array(points);
  const pointTg = new Float64Array(points);
  const gatherPoints = () => {
    for (let p = 0; p < points; p++) {
      const j = tc.plyPointNode[p];
      pointT[p] = tc.TK[j];
      pointAlpha[p] = tc.alpha[j];
      pointTg[p] = tc.tgK[j];
    }
  };
  const mech = createMechanics(params, tc.plyPointZM);
  gatherPoints();
  primeMechanics(mech, pointT, pointAlpha, pointTg);

  const tracker = createMetricsTracker(tc.zM, params.resin.gelPoint, tc.glassTransition, tc.TK, tc.alpha, 0, air0.setpointK);
  const expectedSteps = Math.ceil(scheduledDurationS(program) / Math.min(limits.maxStepS, 30)) + 64;
  const rec = createRecorder(expectedSteps, options.recordProfiles ? nodes : 0);

  const record = (tS: number, airK: number, toolAirK: number, pressurePa: number, setpointK: number) => {
    const i = nextRow(rec);
    const s = rec.series;
    const T = tc.TK;
    const a = tc.alpha;
    let aMin = a[0];
    let aMax = a[0];
    for (let j = 1; j < nodes; j++) {
      if (a[j] < aMin) aMin = a[j];
      if (a[j] > aMax) aMax = a[j];
    }
    const midT = T[mid] + midW * (T[mid + 1] - T[mid]);
    const midAlpha = a[mid] + midW * (a[mid + 1] - a[mid]);
    const midTg = glassTransitionK(midAlpha, tc.glassTransition);
    s.timeS[i] = tS;
    s.airK[i] = airK;
    s.pressurePa[i] = pressurePa;
    s.toolK[i] = hasTool ? tc.allTK[0] : toolAirK;
    s.bagSurfaceK[i] = T[last];
    s.midPlaneK[i] = midT;
    s.toolSideSurfaceK[i] = T[0];
    s.alphaMin[i] = aMin;
    s.alphaMax[i] = aMax;
    s.tgMidK[i] = midTg;
    s.resinModulusMidPa[i] = resinModulusPa(mech, midT, midAlpha, midTg);
    s.setpointK[i] = setpointK;
    if (rec.width > 0) {
      rec.profileT.set(T, i * nodes);
      rec.profileAlpha.set(a, i * nodes);
    }
  };
  record(0, air0.airK, air0.toolAirK, air0.pressurePa, air0.setpointK);

  // --- the loop ---
  const airNow = { ...air0 };
  let t = 0;
  let steps = 0;
  let naturalDt = limits.maxStepS;
  let partRate = 0; // fastest part temperature change of the last step, K/s
  let fastNode = -1; // laminate node whose α moved most in the last step
  let lastCureRate = 0; // that node's mean cure rate over the last step, 1/s
  // The α limit relaxes while the gel front is out of reach (README, "Time step").
  const gelWindow = GEL_REACH_STEPS * RELAXED_CURE_FACTOR * limits.maxCureChange;
  let gelFar = gelFrontFar(tc.alpha, params.resin.gelPoint, gelWindow);
  while (!cycle.done) {
    if (steps >= MAX_STEPS) throw new Error(`simulate: gave up after ${MAX_STEPS} steps at t = ${t} s (step control failed)`);
    // Predict the step from the limits (shared/solver/README.md, "Time step"); a step may at most double the last unclipped one.
    let dt = Math.min(limits.maxStepS, 2 * naturalDt);
    const thermal = steps > 0 && tc.lastStep.maxDeltaAlpha <= QUIET_CURE_CHANGE ? QUIET_THERMAL_FACTOR : 1;
    const airRate = airRateKPerS(program, cycle);
    if (airRate > 0) dt = Math.min(dt, (thermal * limits.maxAirChangeK) / airRate);
    // Fastest cure rate now: evaluated at the node that cured fastest in the last step (one rate evaluation
    // instead of one per node), never below that node's mean rate over the last step.
    const rate = fastNode < 0 ? maxCureRate(tc) : Math.max(lastCureRate, cureRate(tc.kinetics, tc.alpha[fastNode], tc.TK[fastNode]));
    if (rate > 0) dt = Math.min(dt, (gelFar ? RELAXED_CURE_FACTOR * limits.maxCureChange : limits.maxCureChange) / rate);
    if (partRate > 0) dt = Math.min(dt, (thermal * limits.maxPartChangeK) / partRate);
    naturalDt = dt;
    // Land exactly on the next event; avoid leaving a sliver just before it.
    const event = nextEventS(program, cycle);
    const remaining = event - t;
    let tNext: number;
    if (dt >= remaining - TIME_EPS_S) {
      dt = remaining;
      tNext = event;
    } else {
      if (dt > 0.5 * remaining) dt = 0.5 * remaining;
      tNext = t + dt;
    }
    const air = airAt(program, cycle, tNext, airNow);
    advanceThermochemical(tc, dt, air.airK, air.toolAirK);
    t = tNext;
    steps++;
    partRate = tc.lastStep.maxDeltaTK / dt;

    gatherPoints();
    mechanicsStep(mech, pointT, pointAlpha, pointTg, dt);

    let minT = tc.TK[0];
    let maxT = tc.TK[0];
    let maxDAlpha = -1;
    for (let j = 0; j < nodes; j++) {
      const T = tc.TK[j];
      if (T < minT) minT = T;
      if (T > maxT) maxT = T;
      const dAlpha = tc.alpha[j] - tracker.prevAlpha[j];
      if (dAlpha > maxDAlpha) {
        maxDAlpha = dAlpha;
        fastNode = j;
      }
    }
    lastCureRate = maxDAlpha / dt;
    gelFar = gelFrontFar(tc.alpha, params.resin.gelPoint, gelWindow);
    observeStep(tracker, t, tc.TK, tc.alpha, 0, air.setpointK);
    record(t, air.airK, air.toolAirK, air.pressurePa, air.setpointK);
    advanceCycle(program, cycle, t, minT, maxT);
  }

  // --- demould, cool to the shop temperature, results ---
  // The cycle ends at demould; the shape is measured later, on the shop floor: the released part cools to the
  // shop temperature first, and that last ΔT bends an unsymmetric part and closes a corner further.
  demould(mech, pointT, pointAlpha, pointTg);
  const shopK = shopTemperatureK(params.cycle);
  coolToShopTemperature(mech, pointT, pointAlpha, pointTg, shopK, shopCoolRateKPerS(params.cycle));
  const mr = mechanicsResult(mech, params);
  const warnings: string[] = [];
  if (program.kind === 'segments') {
    for (const i of cycle.waitTimeouts) {
      const seg = program.segments[i];
      warnings.push(
        `cycle.segments.${i}: the part did not enter the ±${seg.bandK} °C hold band within 24 h; the hold clock started anyway`,
      );
    }
  }
  if (tc.energy.relativeError > ENERGY_WARNING) {
    warnings.push(`energy balance closes to ${(100 * tc.energy.relativeError).toFixed(2)} % only (accepted: < 0.5 %)`);
  }
  const summary = summarize({
    tracker,
    finalAlpha: tc.alpha,
    offset: 0,
    demouldS: t,
    steps,
    warpageMm: mr.warpageMm,
    springInDeg: mr.springInDeg,
    shapeAtK: shopK,
    adiabaticRiseK: adiabaticTemperatureRiseK(params),
    limits: params.limits,
    warnings,
  });

  const n = rec.length;
  const history = {} as SimulationResult['history'];
  for (const k of HISTORY_KEYS) history[k] = rec.series[k].slice(0, n);
  const result: SimulationResult = {
    modelVersion: MODEL_VERSION,
    steps,
    history,
    profiles: {
      zM: new Float64Array(tc.zM),
      temperatureK: rec.profileT.slice(0, n * rec.width),
      alpha: rec.profileAlpha.slice(0, n * rec.width),
    },
    nodes: { zM: new Float64Array(tc.zM), gelTimeS: tracker.gelTimeS, vitrificationTimeS: tracker.vitrificationTimeS },
    plyStresses: mr.plyStresses,
    curvature: mr.curvature,
    segmentBoundsS: Float64Array.from(cycle.boundsS),
    summary,
  };
  assertFinite(result);
  return result;
}

/** The loop must never hand back NaN or Infinity silently: say which output went wrong. */
function assertFinite(r: SimulationResult): void {
  const check = (name: string, a: ArrayLike<number>) => {
    for (let i = 0; i < a.length; i++) {
      if (!Number.isFinite(a[i])) throw new Error(`simulate: ${name}[${i}] is ${String(a[i])} (a solver fault, please report the study)`);
    }
  };
  for (const k of HISTORY_KEYS) check(`history.${k}`, r.history[k]);
  check('plyStresses.sigma1Pa', r.plyStresses.sigma1Pa);
  check('plyStresses.sigma2Pa', r.plyStresses.sigma2Pa);
  check('plyStresses.tau12Pa', r.plyStresses.tau12Pa);
  check('curvature', [r.curvature.kx, r.curvature.ky, r.curvature.kxy]);
  const s = r.summary as unknown as Record<string, unknown>;
  for (const [k, v] of Object.entries(s)) if (typeof v === 'number') check(`summary.${k}`, [v]);
  for (const l of r.summary.limits) check(`summary.limits.${l.key}`, [l.value, l.limit, l.atTimeMin ?? 0, l.atZMm ?? 0]);
}
