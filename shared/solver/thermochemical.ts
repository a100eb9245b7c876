import type { StudyParams } from '../schemas/study';
import { kjPerKgToJPerKg, mmToM } from '../units';
import { glassTransitionK, prepareGlassTransition, type GlassTransitionK } from './glass-transition';
import { createHeatColumn, prepareHeatStep, solveHeatStep, storedHeat, transverseConductivity, volumetricHeatCapacity, type BoundaryHeat, type HeatColumn, type HeatLayer } from './heat-transfer';
import { ALPHA_MAX, advanceCureBatch, cureBatchSlopes, createCureBatch, cureRate, initialDegreeOfCure, prepareKinetics, type CureBatch, type PreparedKinetics } from './kinetics';

// Heat and cure coupled through the reaction heat q = ρ_r (1 − V_f) H_R dα/dt (rules in shared/solver/README.md, "Model rules").
//
// Coupling choice: Newton-type iteration inside each step, not operator splitting. Each pass integrates the
// cure over the whole step at the θ-weighted temperature T_θ = (1 − θ)Tⁿ + θTⁿ⁺¹ (the step midpoint for
// Crank–Nicolson, so the coupling keeps the scheme's second order; splitting would drop it to first) at every
// node that needs it (all at once, kinetics.advanceCureBatch), with each increment's slope S = ∂α/∂T. The
// column is then solved with the reaction heat of the linearised cure, ρ_r(1 − V_f)H_R·V·(Δα + S·δT_θ): the part
// in the new temperature moves into the matrix, so the solve already meets the cure's response to its own heat,
// and each node's α is set from the temperature that came out by the same linear expression, so the source is
// exactly the heat of the cure increments kept and the energy balance closes to rounding for any number of
// passes. A step is done when every node's neglected second-order part is under 1e-7. Otherwise the next
// pass integrates again, at the temperature that came out, only the nodes where it is not; that pass's
// change of temperature is second order, so a reacting step needs one pass, or two after a sudden change of
// the air's ramp (the first guess extrapolates the last step linearly). A node with no slope (its increment
// needed sub-steps) or with a reaction steep enough to take half its heat capacity out of the diagonal is
// iterated plainly: integrated at every pass until its increment would change by under 1e-7 with the last
// pass's change of temperature (bounded through the largest activation energy:
// δ(Δα) ≈ Δα·θ·(E_max/RT² + C|α_CT|)·δT). If the passes do not settle (a step far too long for a runaway
// exotherm), the step is split in halves internally, so the caller never sees an unconverged state.

/** What the coupled column needs from a study (a structural subset of StudyParams, engineering units). */
export type ThermochemicalParams = Pick<StudyParams, 'resin' | 'fibre' | 'fibreVolumeFraction' | 'layup' | 'tool' | 'heatTransfer' | 'mesh'>;

export interface ThermochemicalOptions {
  /** uniform start temperature of part and tool; also the air on both sides at t = 0, K */
  initialK: number;
  /** time scheme of the heat equation: Crank–Nicolson (default, second order) or backward Euler (first order, L-stable) */
  scheme?: 'crank-nicolson' | 'backward-euler';
  /** intervals through the tool plate (default: one per 0.5 mm, between 4 and 24) */
  toolIntervals?: number;
  /** the cure integrator's tolerance on α per node and step (default kinetics.DEFAULT_CURE_TOLERANCE) */
  cureTolerance?: number;
}

/** Energy bookkeeping per unit area since the start, J/m². */
export interface EnergyBalance {
  /** heat in through the bag-side face */
  bagInJPerM2: number;
  /** heat in through the tool-side face (the tool's back face, or the laminate's bottom face without a tool) */
  toolInJPerM2: number;
  /** heat released by the cure, from the α field: ρ_r(1 − V_f)H_R ∫(α − α₀) dz */
  reactionJPerM2: number;
  /** change of stored heat, from the temperature field: Σ C_i (T_i − T_i⁰) */
  storedChangeJPerM2: number;
  /** |stored change − (heat in + reaction)| / (gross boundary heat + reaction); < 0.005 is the acceptance */
  relativeError: number;
  /** sum of |heat in| over every step and face, the scale of the error above */
  grossBoundaryJPerM2: number;
}

export interface ThermochemicalState {
  // Laminate nodes, bottom (tool side, z = 0) to top (bag side); all the same length.
  /** node height above the laminate bottom, m */
  readonly zM: Float64Array;
  /** temperatures of the laminate nodes, K (a view into allTK) */
  readonly TK: Float64Array;
  /** degree of cure at the laminate nodes */
  readonly alpha: Float64Array;
  /** Tg(α) at the laminate nodes, K */
  readonly tgK: Float64Array;
  /** ply that owns each node: its bottom face and interior nodes; the bag surface node belongs to the top ply */
  readonly nodePly: Int32Array;
  /** laminate node index of each ply's bottom and top face (2 per ply, bottom then top, bottom ply first) */
  readonly plyPointNode: Int32Array;
  /** z of those points, m */
  readonly plyPointZM: Float64Array;
  // The whole column including the tool plate (tool nodes first, z < 0).
  readonly allZM: Float64Array;
  readonly allTK: Float64Array;
  /** index of laminate node 0 in the column arrays */
  readonly laminateStart: number;
  readonly column: HeatColumn;
  readonly kinetics: PreparedKinetics;
  readonly glassTransition: GlassTransitionK;
  readonly gelPoint: number;
  /** heat of reaction per unit laminate volume at full cure, ρ_r(1 − V_f)H_R, J/m³ */
  readonly reactionEnergyJPerM3: number;
  /** laminate (resin-bearing) thickness inside each laminate node's control volume, m */
  readonly nodeLaminateM: Float64Array;
  readonly theta: number;
  /** time reached, s, and the air on each side at that time, K */
  timeS: number;
  airK: number;
  toolAirK: number;
  readonly energy: EnergyBalance;
  /** what the last call did: coupling passes of its final sub-step, internal halvings, largest Δα and ΔT */
  readonly lastStep: { passes: number; splits: number; maxDeltaAlpha: number; maxDeltaTK: number };
  // work arrays (allocated once)
  readonly work: {
    TOld: Float64Array; TNew: Float64Array; TGuess: Float64Array; TPrev: Float64Array; source: Float64Array;
    alphaOld: Float64Array; alphaNew: Float64Array; TKin: Float64Array; alpha0: Float64Array; T0: Float64Array;
    heat: BoundaryHeat; prevDtS: number;
    /** laminate nodes whose cure a pass integrates, and the batch integrator's scratch */
    cureNodes: Int32Array; cureBatch: CureBatch;
    /** per laminate node: kinetic temperature and result of its last full cure integration, and ∂α/∂T there */
    TFull: Float64Array; alphaFull: Float64Array; slope: Float64Array;
    /** per laminate node: the slope the coupled solve linearises its cure with (0: iterated plainly) */
    linear: Float64Array;
    /** per column node: the part of the reaction heat proportional to the new temperature, J/(m²·K) */
    sourcePerK: Float64Array;
    /** per laminate node: the bound on ∂ln(Δα)/∂T at its kinetic temperature this pass */
    sensitivity: Float64Array;
    /** stored heat of the start field T0, J/m² */
    storedHeat0: number;
  };
}

/** Adiabatic temperature rise of the laminate, ΔT_ad = (1 − V_f) ρ_r H_R / (ρc)_laminate, K. */
export function adiabaticTemperatureRiseK(p: Pick<ThermochemicalParams, 'resin' | 'fibre' | 'fibreVolumeFraction'>): number {
  const vf = p.fibreVolumeFraction;
  const rhoC = volumetricHeatCapacity(p.fibre.densityKgM3, p.fibre.specificHeatJPerKgK, p.resin.densityKgM3, p.resin.specificHeatJPerKgK, vf);
  return ((1 - vf) * p.resin.densityKgM3 * kjPerKgToJPerKg(p.resin.heatOfReactionKJPerKg)) / rhoC;
}

/** Build the column (tool plate + plies), start uniform at `initialK`; allocates everything the steps will use. */
export function createThermochemical(p: ThermochemicalParams, options: ThermochemicalOptions): ThermochemicalState {
  const { initialK } = options;
  if (!(initialK > 0) || !Number.isFinite(initialK)) throw new RangeError(`initial temperature ${String(initialK)} K: allowed > 0 and finite`);
  const plies = p.layup.plies;
  if (plies.length === 0) throw new RangeError('layup.plies: 0 plies: allowed at least 1');
  const perPly = p.mesh.nodesPerPly;
  if (!Number.isInteger(perPly) || perPly < 1) throw new RangeError(`mesh.nodesPerPly: ${String(perPly)} is out of range: allowed a whole number ≥ 1`);
  const vf = p.fibreVolumeFraction;
  const kz = transverseConductivity(p.fibre.conductivityTransverseWPerMK, p.resin.conductivityWPerMK, vf);
  const rhoC = volumetricHeatCapacity(p.fibre.densityKgM3, p.fibre.specificHeatJPerKgK, p.resin.densityKgM3, p.resin.specificHeatJPerKgK, vf);
  const layers: HeatLayer[] = [];
  let toolIntervals = 0;
  if (p.tool.kind === 'plate') {
    const t = mmToM(p.tool.thicknessMm);
    toolIntervals = options.toolIntervals ?? Math.min(24, Math.max(4, Math.ceil(t / 0.0005)));
    layers.push({ thicknessM: t, intervals: toolIntervals, conductivityWPerMK: p.tool.conductivityWPerMK, volumetricHeatCapacity: p.tool.densityKgM3 * p.tool.specificHeatJPerKgK });
  }
  // Each ply gets nodesPerPly equal intervals: its bottom face and interior nodes are its own, the faces
  // between plies are shared nodes (ply top/bottom values are node values, not interpolations).
  for (const ply of plies) layers.push({ thicknessM: mmToM(ply.thicknessMm), intervals: perPly, conductivityWPerMK: kz, volumetricHeatCapacity: rhoC });
  // Without a tool the tool-side film coefficient acts on the laminate's bottom face.
  const column = createHeatColumn(layers, p.heatTransfer.toolSideWPerM2K, p.heatTransfer.bagSideWPerM2K);
  const laminateStart = toolIntervals;
  const nLam = column.nodes - laminateStart;
  const allZM = new Float64Array(column.nodes);
  const z0 = column.zM[laminateStart];
  for (let i = 0; i < column.nodes; i++) allZM[i] = column.zM[i] - z0;
  const allTK = new Float64Array(column.nodes).fill(initialK);
  const zM = allZM.subarray(laminateStart);
  const nodePly = new Int32Array(nLam);
  const nodeLaminateM = new Float64Array(nLam);
  const plyPointNode = new Int32Array(2 * plies.length);
  const plyPointZM = new Float64Array(2 * plies.length);
  plies.forEach((ply, i) => {
    const dz = mmToM(ply.thicknessMm) / perPly;
    for (let j = 0; j < perPly; j++) {
      nodePly[i * perPly + j] = i;
      nodeLaminateM[i * perPly + j] += 0.5 * dz;
      nodeLaminateM[i * perPly + j + 1] += 0.5 * dz;
    }
    plyPointNode[2 * i] = i * perPly;
    plyPointNode[2 * i + 1] = (i + 1) * perPly;
  });
  nodePly[nLam - 1] = plies.length - 1;
  for (let j = 0; j < plyPointNode.length; j++) plyPointZM[j] = zM[plyPointNode[j]];
  const kinetics = prepareKinetics(p.resin, { tolerance: options.cureTolerance });
  const glass = prepareGlassTransition(p.resin.glassTransition);
  const alpha = new Float64Array(nLam).fill(initialDegreeOfCure(kinetics));
  const tgK = new Float64Array(nLam);
  for (let i = 0; i < nLam; i++) tgK[i] = glassTransitionK(alpha[i], glass);
  const n = column.nodes;
  return {
    zM, TK: allTK.subarray(laminateStart), alpha, tgK, nodePly, plyPointNode, plyPointZM,
    allZM, allTK, laminateStart, column, kinetics, glassTransition: glass, gelPoint: p.resin.gelPoint,
    reactionEnergyJPerM3: (1 - vf) * p.resin.densityKgM3 * kjPerKgToJPerKg(p.resin.heatOfReactionKJPerKg),
    nodeLaminateM,
    theta: options.scheme === 'backward-euler' ? 1 : 0.5,
    timeS: 0, airK: initialK, toolAirK: initialK,
    energy: { bagInJPerM2: 0, toolInJPerM2: 0, reactionJPerM2: 0, storedChangeJPerM2: 0, relativeError: 0, grossBoundaryJPerM2: 0 },
    lastStep: { passes: 0, splits: 0, maxDeltaAlpha: 0, maxDeltaTK: 0 },
    work: {
      TOld: new Float64Array(n), TNew: new Float64Array(n), TGuess: new Float64Array(n), TPrev: new Float64Array(allTK),
      source: new Float64Array(n), alphaOld: new Float64Array(nLam), alphaNew: new Float64Array(nLam), TKin: new Float64Array(nLam),
      alpha0: new Float64Array(alpha), T0: new Float64Array(allTK),
      heat: { bottomJPerM2: 0, topJPerM2: 0 }, prevDtS: 0,
      cureNodes: new Int32Array(nLam), cureBatch: createCureBatch(nLam),
      TFull: new Float64Array(nLam), alphaFull: new Float64Array(nLam), slope: new Float64Array(nLam),
      linear: new Float64Array(nLam), sourcePerK: new Float64Array(n),
      sensitivity: new Float64Array(nLam), storedHeat0: storedHeat(column, allTK),
    },
  };
}

/** A module-private copy (a hot loop compares with it; kinetics.ts says why). */
const CURE_CAP = ALPHA_MAX;
/** Largest change of a plainly iterated node's cure increment that the coupling passes may leave unresolved. */
const COUPLING_ALPHA_TOL = 1e-7;
/**
 * Largest second-order error a pass may leave in a linearised node's cure increment (see tryStep): the size of
 * the cure integrator's own tolerance per step (kinetics.DEFAULT_CURE_TOLERANCE), as every other per-step error
 * in α here. A tenth of it moved no result of the accuracy budget and cost 10 % more time.
 */
const LINEAR_ALPHA_TOL = COUPLING_ALPHA_TOL;
const MAX_PASSES = 12;
const MAX_SPLIT_DEPTH = 12;

/**
 * Advance the coupled column by dtS to time + dtS, with the air at the new time on the bag side (airK) and
 * the tool side (toolAirK); the air in between is linear from the values at the current time. Updates T, α,
 * Tg and the energy bookkeeping in place.
 */
export function advanceThermochemical(s: ThermochemicalState, dtS: number, airK: number, toolAirK: number): void {
  if (!(dtS > 0) || !Number.isFinite(dtS)) throw new RangeError(`thermo-chemical step ${String(dtS)} s: allowed > 0 and finite`);
  if (!(airK > 0) || !Number.isFinite(airK)) throw new RangeError(`air temperature ${String(airK)} K: allowed > 0 and finite`);
  if (!(toolAirK > 0) || !Number.isFinite(toolAirK)) throw new RangeError(`tool-side air temperature ${String(toolAirK)} K: allowed > 0 and finite`);
  s.lastStep.splits = 0;
  s.lastStep.maxDeltaAlpha = 0;
  s.lastStep.maxDeltaTK = 0;
  advanceSplitting(s, dtS, airK, toolAirK, 0);
  updateEnergyBalance(s);
}

function advanceSplitting(s: ThermochemicalState, dtS: number, airK: number, toolAirK: number, depth: number): void {
  if (tryStep(s, dtS, airK, toolAirK)) return;
  if (depth >= MAX_SPLIT_DEPTH) {
    throw new Error(`thermo-chemical step did not converge after ${MAX_SPLIT_DEPTH} halvings at t = ${s.timeS} s (dt ${dtS} s)`);
  }
  s.lastStep.splits++;
  const airMid = 0.5 * (s.airK + airK);
  const toolMid = 0.5 * (s.toolAirK + toolAirK);
  advanceSplitting(s, dtS / 2, airMid, toolMid, depth + 1);
  advanceSplitting(s, dtS / 2, airK, toolAirK, depth + 1);
}

/**
 * The neglected second-order part of a node's cure increment carried linearly from its full integration,
 * α(T_full + δ) ≈ α_full + Sδ (kinetic temperatures, δ in K; dA = α_full − α_old): ½(Sδ)²/dA for an
 * Arrhenius-like exponential growth plus ½κδ²dA for the curvature κ of ln(rate) in T (the Arrhenius curvature,
 * the spread between two Arrhenius terms, the diffusion factor's logistic).
 */
function linearRemainder(S: number, dA: number, Tk: number, delta: number, eMaxOverR: number, eSpreadOverR: number, diffusionSens: number): number {
  const invT2 = 1 / (Tk * Tk);
  const spread = eSpreadOverR * invT2;
  const kappa = (2 * eMaxOverR * invT2) / Tk + 0.25 * spread * spread + 0.25 * diffusionSens * diffusionSens;
  const change = S * delta;
  return (dA > 0 ? (0.5 * change * change) / dA : change === 0 ? 0 : Infinity) + 0.5 * kappa * delta * delta * dA;
}

// One step with coupling passes; commits and returns true when converged, leaves the state untouched otherwise.
function tryStep(s: ThermochemicalState, dtS: number, airK: number, toolAirK: number): boolean {
  const { column, kinetics: k, theta, alpha, nodeLaminateM, laminateStart: off, allTK } = s;
  const { TOld, TNew, TGuess, TPrev, source, sourcePerK, alphaOld, alphaNew, TKin, heat, cureNodes, cureBatch, TFull, alphaFull, slope, linear, sensitivity } = s.work;
  const n = column.nodes;
  const nLam = alpha.length;
  TOld.set(allTK);
  alphaOld.set(alpha);
  // First guess: linear extrapolation of the last step (its rate of change), or "no change" at the start.
  const w = s.work.prevDtS > 0 ? dtS / s.work.prevDtS : 0;
  for (let i = 0; i < n; i++) TGuess[i] = TOld[i] + w * (TOld[i] - TPrev[i]);
  const qPerAlpha = s.reactionEnergyJPerM3;
  const capacity = column.capacity;
  // d ln(Δα)/dT bound per kelvin, without the 1/T² of the Arrhenius part (applied per node).
  const eMaxOverR = Math.max(k.a1 !== 0 ? k.e1OverR : 0, k.a2 !== 0 ? k.e2OverR : 0, k.a3 !== 0 ? k.e3OverR : 0);
  const diffusionSens = k.hasDiffusion ? k.diffusionC * Math.abs(k.diffusionAlphaCTPerK) : 0;
  // for linearRemainder: the spread between the Arrhenius terms
  const eMinOverR = Math.min(k.a1 !== 0 ? k.e1OverR : Infinity, k.a2 !== 0 ? k.e2OverR : Infinity, k.a3 !== 0 ? k.e3OverR : Infinity);
  const eSpreadOverR = Number.isFinite(eMinOverR) ? eMaxOverR - eMinOverR : 0;
  prepareHeatStep(column, TOld, dtS, theta, s.toolAirK, toolAirK, s.airK, airK);
  let passes = 1;
  let converged = false;
  for (; passes <= MAX_PASSES; passes++) {
    // 1. The cure at this pass's kinetic temperature: integrated in full where the linearisation about the
    //    node's last full integration would leave more than LINEAR_ALPHA_TOL (or the node has none).
    let count = 0;
    for (let j = 0; j < nLam; j++) {
      const Tk = (1 - theta) * TOld[off + j] + theta * TGuess[off + j];
      TKin[j] = Tk;
      sensitivity[j] = eMaxOverR / (Tk * Tk) + diffusionSens;
      if (passes > 1) {
        const delta = Tk - TFull[j];
        const dA = alphaFull[j] - alphaOld[j];
        if (delta === 0 || (linear[j] !== 0 && linearRemainder(linear[j], dA, Tk, delta, eMaxOverR, eSpreadOverR, diffusionSens) <= LINEAR_ALPHA_TOL)) continue;
      }
      cureNodes[count++] = j;
    }
    advanceCureBatch(k, alphaOld, TKin, dtS, alphaNew, cureNodes, count, cureBatch);
    cureBatchSlopes(k, cureBatch, cureNodes, count, dtS, slope);
    for (let i = 0; i < count; i++) {
      const j = cureNodes[i];
      TFull[j] = TKin[j];
      alphaFull[j] = alphaNew[j];
      // Linearise in the node's temperature (Newton coupling) unless there is no slope (a sub-stepped node) or
      // the reaction heat would take half the node's heat capacity out of the diagonal (a runaway in the
      // step; such a node is iterated plainly, and the step halved if that does not settle).
      const S = slope[j];
      const qL = qPerAlpha * nodeLaminateM[j];
      linear[j] = Number.isFinite(S) && qL * S * theta < 0.5 * capacity[off + j] ? S : 0;
    }
    // 2. The column with the reaction heat of α_j(T) = α_full + S(T_θ − T_full): the part in the new
    //    temperature moves into the matrix, so the solve meets the cure's response to its own heat.
    for (let j = 0; j < nLam; j++) {
      const qL = qPerAlpha * nodeLaminateM[j];
      const L = linear[j];
      source[off + j] = qL * (alphaFull[j] - alphaOld[j] + L * ((1 - theta) * TOld[off + j] - TFull[j]));
      sourcePerK[off + j] = qL * L * theta;
    }
    solveHeatStep(column, TOld, TNew, source, heat, sourcePerK);
    // 3. Each node's cure at the temperature that came out, the same expression the source used; converged
    //    when every linearised node is inside LINEAR_ALPHA_TOL and every other node's increment would move by
    //    less than COUPLING_ALPHA_TOL with the temperature change of this pass.
    let settled = true;
    let finite = true;
    for (let j = 0; j < nLam; j++) {
      const i = off + j;
      const dA = alphaFull[j] - alphaOld[j];
      const L = linear[j];
      if (L !== 0) {
        const Tk = (1 - theta) * TOld[i] + theta * TNew[i];
        const delta = Tk - TFull[j];
        const a = alphaFull[j] + L * delta;
        alphaNew[j] = a;
        if (!(a >= alphaOld[j] && a <= CURE_CAP && linearRemainder(L, dA, Tk, delta, eMaxOverR, eSpreadOverR, diffusionSens) <= LINEAR_ALPHA_TOL)) settled = false;
      } else {
        alphaNew[j] = alphaFull[j];
        if (!(theta * Math.abs(TNew[i] - TGuess[i]) * sensitivity[j] * dA < COUPLING_ALPHA_TOL)) settled = false;
      }
    }
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(TNew[i])) finite = false;
      TGuess[i] = TNew[i];
    }
    if (!finite) break;
    if (settled) {
      converged = true;
      break;
    }
  }
  if (!converged) return false;
  // Commit. TNew is consistent with the α used (the source came from them), which is what the balance needs.
  let maxDA = s.lastStep.maxDeltaAlpha;
  let maxDT = s.lastStep.maxDeltaTK;
  for (let i = 0; i < n; i++) {
    const d = Math.abs(TNew[i] - TOld[i]);
    if (d > maxDT) maxDT = d;
  }
  for (let j = 0; j < nLam; j++) {
    const d = alphaNew[j] - alphaOld[j];
    if (d > maxDA) maxDA = d;
    alpha[j] = alphaNew[j];
    s.tgK[j] = glassTransitionK(alphaNew[j], s.glassTransition);
  }
  TPrev.set(TOld);
  allTK.set(TNew);
  s.work.prevDtS = dtS;
  s.timeS += dtS;
  s.airK = airK;
  s.toolAirK = toolAirK;
  s.energy.toolInJPerM2 += heat.bottomJPerM2;
  s.energy.bagInJPerM2 += heat.topJPerM2;
  s.energy.grossBoundaryJPerM2 += Math.abs(heat.bottomJPerM2) + Math.abs(heat.topJPerM2);
  s.lastStep.passes = passes;
  s.lastStep.maxDeltaAlpha = maxDA;
  s.lastStep.maxDeltaTK = maxDT;
  return true;
}

// Stored heat and reaction heat come from the fields themselves (not from accumulating step sources), so the
// balance compares three independently obtained numbers.
function updateEnergyBalance(s: ThermochemicalState): void {
  const e = s.energy;
  e.storedChangeJPerM2 = storedHeat(s.column, s.allTK) - s.work.storedHeat0;
  let cured = 0;
  for (let j = 0; j < s.alpha.length; j++) cured += s.nodeLaminateM[j] * (s.alpha[j] - s.work.alpha0[j]);
  e.reactionJPerM2 = s.reactionEnergyJPerM3 * cured;
  const residual = e.storedChangeJPerM2 - (e.bagInJPerM2 + e.toolInJPerM2 + e.reactionJPerM2);
  const scale = e.grossBoundaryJPerM2 + Math.abs(e.reactionJPerM2);
  e.relativeError = scale > 0 ? Math.abs(residual) / scale : 0;
}

/** Fastest cure rate over the laminate nodes at the current state, 1/s (for choosing the next step). */
export function maxCureRate(s: ThermochemicalState): number {
  let m = 0;
  for (let j = 0; j < s.alpha.length; j++) {
    const r = cureRate(s.kinetics, s.alpha[j], s.TK[j]);
    if (r > m) m = r;
  }
  return m;
}
