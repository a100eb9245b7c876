// The thermo-mechanical part of one simulation: the adapter the time loop calls with temperature, cure and Tg
// at the ply integration points (two per ply, bottom then top face, bottom ply first).
//
// Per step and point: gelled or not (before gel the resin is liquid: no stress, its free strain is not
// counted); reduced-time increment and the Prony factors (or the CHILE glassy fraction); the ply's free-strain
// increment (thermal + chemical) with free-strain coefficients for the resin's effective modulus over the
// step; then one incremental laminate step, free or held on the tool. Everything is allocated here, once.
//
// Simplification (to be stated in the UI notes): the ply has an unrelaxed and a relaxed
// stiffness from micromechanics with E_m = E_u and E_m = E∞, and the difference relaxes with the resin's
// normalised spectrum.

import type { StudyParams } from '../schemas/study';
import { cToK, degToRad, gpaToPa, microPerKToPerK, mmToM, mToMm } from '../units';
import { shopTemperatureK } from './cycle';
import { laminateEffectiveFreeStrain, springInDeg, stripWarpageM, type ThroughThicknessPly } from './distortion';
import {
  createIncrementalLaminate,
  laminateGeometry,
  laminateStep,
  plyFreeStrainToLaminate,
  plyStiffness,
  pointStress,
  rotateStiffness,
  stressToPlyAxes,
  type IncrementalLaminate,
  type LaminateGeometry,
} from './laminate';
import { freeStrainCoefficients, plyProperties, resinShrinkageStrain, type FibreSI, type PlyProperties } from './micromechanics';
import {
  apparentResinModulusPa,
  chileGlassyFraction,
  prepareResinRelaxation,
  reducedTimeIncrement,
  reducedTimeRate,
  relaxationFactors,
  type ResinRelaxation,
} from './viscoelastic';

/** The parts of a study the mechanics reads. */
export type MechanicsInput = Pick<StudyParams, 'resin' | 'fibre' | 'fibreVolumeFraction' | 'layup' | 'tool' | 'constraint' | 'geometry' | 'cycle'>;

export interface MechanicsState {
  resin: ResinRelaxation;
  gelPoint: number;
  /** total volumetric shrinkage of the resin, fraction */
  shrinkage: number;
  resinNu: number;
  resinCtePerK: number;
  fibre: FibreSI;
  fibreVolumeFraction: number;
  geometry: LaminateGeometry;
  plyAngleDeg: Float64Array;
  plyCos: Float64Array;
  plySin: Float64Array;
  /** unrelaxed (glassy) ply: the elastic state spring-in is evaluated with */
  glassyPly: PlyProperties;
  laminate: IncrementalLaminate;
  held: boolean;
  toolCtePerK: number;
  released: boolean;
  /** values at the end of the previous step, per point (T, α and Tg also give the mid-plane's resin modulus) */
  prevTK: Float64Array;
  prevAlpha: Float64Array;
  prevTgK: Float64Array;
  /** dξ/dt = 1/a at the end of the previous step */
  prevRate: Float64Array;
  /** the resin's linear shrinkage strain at the end of the previous step (kept from gel on) */
  prevShrink: Float64Array;
  gelled: Uint8Array;
  /** ply-axis free strains accumulated since gel, per point: thermal (ε1, ε2) and chemical (ε1, ε2) */
  thermalSinceGel: Float64Array;
  chemicalSinceGel: Float64Array;
  /** index of the point nearest the mid-plane */
  midPoint: number;
  coeff: Float64Array;
  /** scratch for a step that a gel crossing splits: crossing fractions and the point values at a split */
  crossings: Float64Array;
  splitTK: Float64Array;
  splitAlpha: Float64Array;
  splitTgK: Float64Array;
}

function fibreSI(f: StudyParams['fibre']): FibreSI {
  return {
    e1Pa: gpaToPa(f.e1GPa),
    e2Pa: gpaToPa(f.e2GPa),
    g12Pa: gpaToPa(f.g12GPa),
    nu12: f.nu12,
    nu23: f.nu23 ?? f.nu12,
    cte1PerK: microPerKToPerK(f.cte1MicroPerK),
    cte2PerK: microPerKToPerK(f.cte2MicroPerK),
  };
}

/**
 * Allocate the mechanics of one simulation. `plyPointZM` are the integration points' heights from the laminate
 * bottom (two per ply, bottom then top face); they must match the layup.
 */
export function createMechanics(params: MechanicsInput, plyPointZM: Float64Array): MechanicsState {
  const plies = params.layup.plies;
  const points = 2 * plies.length;
  const geometry = laminateGeometry(plies.map((p) => mmToM(p.thicknessMm)));
  if (plyPointZM.length !== points) {
    throw new RangeError(`plyPointZM: ${plyPointZM.length} points for ${plies.length} plies: allowed exactly 2 per ply (bottom and top face)`);
  }
  for (let p = 0; p < points; p++) {
    const expected = geometry.pointZM[p] + geometry.thicknessM / 2;
    if (!(Math.abs(plyPointZM[p] - expected) <= 1e-9 + 1e-6 * geometry.thicknessM)) {
      throw new RangeError(`plyPointZM[${p}]: ${plyPointZM[p]} m is out of range: allowed the ply face at ${expected} m from the laminate bottom`);
    }
  }
  const resin = prepareResinRelaxation(params.resin.modulus);
  const fibre = fibreSI(params.fibre);
  const vf = params.fibreVolumeFraction;
  const resinNu = params.resin.modulus.poisson;
  const resinCtePerK = microPerKToPerK(params.resin.cteMicroPerK);
  const glassyPly = plyProperties(fibre, { ePa: resin.unrelaxedPa, nu: resinNu, ctePerK: resinCtePerK }, vf);
  const rubberyPly = plyProperties(fibre, { ePa: resin.relaxedPa, nu: resinNu, ctePerK: resinCtePerK }, vf);
  const qGlassy = plyStiffness(glassyPly.e1Pa, glassyPly.e2Pa, glassyPly.g12Pa, glassyPly.nu12);
  const qRubbery = plyStiffness(rubberyPly.e1Pa, rubberyPly.e2Pa, rubberyPly.g12Pa, rubberyPly.nu12);
  const qRelaxed = new Float64Array(6 * plies.length);
  const qRelaxing = new Float64Array(6 * plies.length);
  const plyAngleDeg = new Float64Array(plies.length);
  const plyCos = new Float64Array(plies.length);
  const plySin = new Float64Array(plies.length);
  const glassyBar = new Float64Array(6);
  plies.forEach((p, k) => {
    plyAngleDeg[k] = p.angleDeg;
    plyCos[k] = Math.cos(degToRad(p.angleDeg));
    plySin[k] = Math.sin(degToRad(p.angleDeg));
    rotateStiffness(qRubbery, p.angleDeg, qRelaxed, 0, 6 * k);
    rotateStiffness(qGlassy, p.angleDeg, glassyBar);
    for (let j = 0; j < 6; j++) qRelaxing[6 * k + j] = glassyBar[j] - qRelaxed[6 * k + j];
  });
  const terms = resin.weights.length;
  let midPoint = 0;
  for (let p = 1; p < points; p++) if (Math.abs(geometry.pointZM[p]) < Math.abs(geometry.pointZM[midPoint]) - 1e-15) midPoint = p;
  // Until the loop says otherwise the part starts uniform at the cycle's start temperature, uncured.
  const t0 = shopTemperatureK(params.cycle);
  const tg0 = cToK(params.resin.glassTransition.tg0C);
  const state: MechanicsState = {
    resin,
    gelPoint: params.resin.gelPoint,
    shrinkage: params.resin.totalShrinkagePct / 100,
    resinNu,
    resinCtePerK,
    fibre,
    fibreVolumeFraction: vf,
    geometry,
    plyAngleDeg,
    plyCos,
    plySin,
    glassyPly,
    laminate: createIncrementalLaminate(geometry, qRelaxed, qRelaxing, terms),
    held: params.constraint === 'tool-held',
    toolCtePerK: params.tool.kind === 'plate' ? microPerKToPerK(params.tool.cteMicroPerK) : 0,
    released: false,
    prevTK: new Float64Array(points),
    prevAlpha: new Float64Array(points),
    prevTgK: new Float64Array(points).fill(tg0),
    prevRate: new Float64Array(points),
    prevShrink: new Float64Array(points),
    gelled: new Uint8Array(points),
    thermalSinceGel: new Float64Array(2 * points),
    chemicalSinceGel: new Float64Array(2 * points),
    midPoint,
    coeff: new Float64Array(4),
    crossings: new Float64Array(points),
    splitTK: new Float64Array(points),
    splitAlpha: new Float64Array(points),
    splitTgK: new Float64Array(points),
  };
  state.prevTK.fill(t0);
  state.prevRate.fill(reducedTimeRate(resin.shift, t0, tg0, 0));
  return state;
}

/**
 * Set the state the first step starts from (optional; by default the part starts uniform at the cycle's start
 * temperature with α = 0). Points already past gel become stress-free here.
 */
export function primeMechanics(state: MechanicsState, TK: Float64Array, alpha: Float64Array, tgK: Float64Array): void {
  for (let p = 0; p < state.prevTK.length; p++) {
    state.prevTK[p] = TK[p];
    state.prevAlpha[p] = alpha[p];
    state.prevTgK[p] = tgK[p];
    state.prevRate[p] = reducedTimeRate(state.resin.shift, TK[p], tgK[p], alpha[p]);
    state.prevShrink[p] = resinShrinkageStrain(alpha[p], state.shrinkage);
    state.gelled[p] = alpha[p] >= state.gelPoint ? 1 : 0;
  }
}

function checkInputs(state: MechanicsState, TK: Float64Array, alpha: Float64Array, tgK: Float64Array, dtS: number): void {
  const n = state.prevTK.length;
  if (TK.length !== n || alpha.length !== n || tgK.length !== n) {
    throw new RangeError(`mechanicsStep: arrays of ${TK.length}/${alpha.length}/${tgK.length} values: allowed ${n} (2 per ply)`);
  }
  if (!(dtS >= 0 && dtS < Infinity)) throw new RangeError(`mechanicsStep: time step ${dtS} s is out of range: allowed ≥ 0 and finite`);
}

/**
 * Advance the ply stresses and the laminate over one step of dtS ending at the given point values.
 *
 * Where points gel inside the step, the step is split at each crossing (T, α and Tg linear in time over the
 * step, the crossing found linearly in α): which points carry stress changes only at a split, so the strain
 * the laminate takes up between splits is linear in time, as the recursive update assumes. A free laminate
 * whose first points gel is very compliant, and whatever bends it in that short spell is locked in by the
 * points that gel later; rounding the crossings to whole steps made the warpage jump with the step size.
 */
export function mechanicsStep(state: MechanicsState, TK: Float64Array, alpha: Float64Array, tgK: Float64Array, dtS: number): void {
  checkInputs(state, TK, alpha, tgK, dtS);
  const points = state.prevTK.length;
  const gel = state.gelPoint;
  const cross = state.crossings;
  let count = 0;
  for (let p = 0; p < points; p++) {
    const prevA = state.prevAlpha[p];
    if (!state.gelled[p] && alpha[p] >= gel && alpha[p] > prevA) {
      const s = (gel - prevA) / (alpha[p] - prevA);
      if (s > 0 && s < 1) cross[count++] = s;
    }
  }
  if (count > 0) {
    const fractions = cross.subarray(0, count).sort();
    const { splitTK, splitAlpha, splitTgK } = state;
    let done = 0;
    for (let i = 0; i < count; i++) {
      const s = fractions[i];
      if (s <= done) continue; // the same crossing twice
      // Fractions of what is left of the step, since each split moves the start (prevTK, prevAlpha) on.
      const f = (s - done) / (1 - done);
      for (let p = 0; p < points; p++) {
        const a0 = state.prevAlpha[p];
        splitTK[p] = state.prevTK[p] + f * (TK[p] - state.prevTK[p]);
        splitAlpha[p] = a0 + f * (alpha[p] - a0);
        splitTgK[p] = state.prevTgK[p] + f * (tgK[p] - state.prevTgK[p]);
        // A point crossing exactly here gels at the split, not a rounding error before it.
        if (!state.gelled[p] && alpha[p] >= gel && alpha[p] > a0 && (gel - a0) / (alpha[p] - a0) <= f * (1 + 1e-12)) {
          splitAlpha[p] = Math.max(splitAlpha[p], gel);
        }
      }
      advanceStep(state, splitTK, splitAlpha, splitTgK, dtS * (s - done));
      done = s;
    }
    advanceStep(state, TK, alpha, tgK, dtS * (1 - done));
    return;
  }
  advanceStep(state, TK, alpha, tgK, dtS);
}

/** One step, or the part of a step between two gel crossings (mechanicsStep splits the step). */
function advanceStep(state: MechanicsState, TK: Float64Array, alpha: Float64Array, tgK: Float64Array, dtS: number): void {
  const lam = state.laminate;
  const resin = state.resin;
  const terms = lam.termCount;
  const prony = resin.model === 'prony';
  const range = resin.unrelaxedPa - resin.relaxedPa;
  const coeff = state.coeff;
  const points = state.prevTK.length;
  const toolPrevK = state.prevTK[0];
  // The top face of one ply and the bottom face of the next usually see identical values: the work of the
  // first is reused for the second (same resin, same step; only the ply angle differs).
  let lastPrevT = NaN;
  let lastPrevA = NaN;
  let lastPrevRate = NaN;
  let lastWasGelled = -1;
  let th1 = 0;
  let th2 = 0;
  let ch1 = 0;
  let ch2 = 0;
  let phi = 1;

  for (let p = 0; p < points; p++) {
    const T = TK[p];
    const a = alpha[p];
    const tg = tgK[p];
    if (!(T > 0 && a >= 0 && a <= 1 && tg > 0)) {
      throw new RangeError(`mechanicsStep: point ${p} has T ${T} K, α ${a}, Tg ${tg} K: allowed T > 0, 0 ≤ α ≤ 1, Tg > 0`);
    }
    const prevT = state.prevTK[p];
    const prevA = state.prevAlpha[p];
    const prevRate = state.prevRate[p];
    const wasGelled = state.gelled[p];
    const same =
      p > 0 &&
      T === TK[p - 1] &&
      a === alpha[p - 1] &&
      tg === tgK[p - 1] &&
      prevT === lastPrevT &&
      prevA === lastPrevA &&
      prevRate === lastPrevRate &&
      wasGelled === lastWasGelled;
    lastPrevT = prevT;
    lastPrevA = prevA;
    lastPrevRate = prevRate;
    lastWasGelled = wasGelled;
    const rate = same ? state.prevRate[p - 1] : prony ? reducedTimeRate(resin.shift, T, tg, a) : 1;
    state.prevTK[p] = T;
    state.prevAlpha[p] = a;
    state.prevTgK[p] = tg;
    state.prevRate[p] = rate;
    const justGelled = !wasGelled && a >= state.gelPoint;
    if (justGelled) state.gelled[p] = 1;
    const o = 3 * p;
    if (!state.gelled[p]) {
      lam.active[p] = 0;
      lam.freeStrain[o] = lam.freeStrain[o + 1] = lam.freeStrain[o + 2] = 0;
      continue;
    }
    lam.active[p] = 1;
    const termBase = p * terms;
    if (same) {
      // a loop, not copyWithin: for a handful of terms the builtin's call costs three times the copy
      for (let i = 0; i < terms; i++) {
        lam.e[termBase + i] = lam.e[termBase - terms + i];
        lam.sg[termBase + i] = lam.sg[termBase - terms + i];
      }
      state.prevShrink[p] = state.prevShrink[p - 1];
    } else {
      // A point that gels in this step does so where α crosses α_gel, found by linear interpolation in α
      // (T and 1/a are linear in time over the step, like the strain): it carries stress, relaxes and takes
      // up strain only over the part φ of the step after the crossing, and its stress-free state is the
      // crossing's temperature. mechanicsStep splits a step at its crossings, so there φ is 0 (the point gels
      // at the end of a part step) or 1; the general form keeps a direct call right too.
      phi = justGelled && a > prevA ? Math.min(1, (a - state.gelPoint) / (a - prevA)) : 1;
      let shareSum = 0;
      if (prony) {
        const rateFrom = rate + phi * (prevRate - rate);
        relaxationFactors(reducedTimeIncrement(phi * dtS, rateFrom, rate), resin.timesS, lam.e, lam.sg, termBase);
        for (let i = 0; i < terms; i++) {
          lam.sg[termBase + i] *= resin.weights[i];
          shareSum += lam.sg[termBase + i];
        }
      } else {
        // CHILE: one term of τ = ∞ (e = g = 1) whose share is the glassy fraction at the end of the step.
        shareSum = chileGlassyFraction(resin.chile, T, tg);
        lam.e[termBase] = 1;
        lam.sg[termBase] = shareSum;
      }
      // Free strain with the resin's effective modulus over the step; a point that gels in this step starts
      // from the gel point and the temperature at the crossing.
      freeStrainCoefficients(state.fibre, resin.relaxedPa + shareSum * range, state.resinNu, state.resinCtePerK, state.fibreVolumeFraction, coeff);
      const dT = phi * (T - prevT);
      const fromShrink = justGelled ? resinShrinkageStrain(state.gelPoint, state.shrinkage) : state.prevShrink[p];
      const shrink = a === prevA && !justGelled ? fromShrink : resinShrinkageStrain(a, state.shrinkage);
      state.prevShrink[p] = shrink;
      th1 = coeff[0] * dT;
      th2 = coeff[1] * dT;
      ch1 = coeff[2] * (shrink - fromShrink);
      ch2 = coeff[3] * (shrink - fromShrink);
    }
    lam.strainShare[p] = phi;
    state.thermalSinceGel[2 * p] += th1;
    state.thermalSinceGel[2 * p + 1] += th2;
    state.chemicalSinceGel[2 * p] += ch1;
    state.chemicalSinceGel[2 * p + 1] += ch2;
    const k = p >> 1;
    plyFreeStrainToLaminate(th1 + ch1, th2 + ch2, state.plyCos[k], state.plySin[k], lam.freeStrain, o);
  }

  // Held on the tool: the part's mid-plane follows the tool surface, whose temperature is the bottom face's.
  const held = state.held && !state.released;
  laminateStep(lam, held, held ? state.toolCtePerK * (TK[0] - toolPrevK) : 0);
}

/**
 * Demould: a tool-held laminate is released (it springs back elastically, in a step of zero duration ending at
 * the given values); a free laminate has nothing to release.
 */
export function demould(state: MechanicsState, TK: Float64Array, alpha: Float64Array, tgK: Float64Array): void {
  if (!state.held || state.released) return;
  state.released = true;
  mechanicsStep(state, TK, alpha, tgK, 0);
}

/** Largest temperature change per step of the cool-down after demould, K (the free-strain coefficients follow
 * the resin's state per step; below Tg they barely change, so a few steps suffice). */
const SHOP_COOL_STEP_K = 10;

/**
 * After demould the part goes to the shop temperature, where it is measured: free (a tool-held part has been
 * released by `demould`), uniform at the end, no cure change, at `rateKPerS`. `TK` holds the point values at
 * demould and is overwritten (it ends uniform at `shopK`); `alpha` and `tgK` stay. Radford–Diefendorf's ΔT and
 * the curvature then run from each point's stress-free (gel) state to the shop temperature.
 */
export function coolToShopTemperature(
  state: MechanicsState, TK: Float64Array, alpha: Float64Array, tgK: Float64Array, shopK: number, rateKPerS: number,
): void {
  const start = Float64Array.from(TK);
  let span = 0;
  for (let p = 0; p < start.length; p++) span = Math.max(span, Math.abs(shopK - start[p]));
  const steps = Math.max(1, Math.ceil(span / SHOP_COOL_STEP_K));
  const dtS = span / steps / rateKPerS;
  for (let k = 1; k <= steps; k++) {
    const f = k / steps;
    for (let p = 0; p < start.length; p++) TK[p] = k === steps ? shopK : start[p] + f * (shopK - start[p]);
    mechanicsStep(state, TK, alpha, tgK, dtS);
  }
}

/** Resin modulus for the history plot at one point's state (see apparentResinModulusPa). */
export function resinModulusPa(state: MechanicsState, TK: number, alpha: number, tgK: number): number {
  return apparentResinModulusPa(state.resin, state.gelPoint, TK, alpha, tgK);
}

export interface MechanicsResult {
  plyStresses: { zM: Float64Array; plyIndex: Int32Array; sigma1Pa: Float64Array; sigma2Pa: Float64Array; tau12Pa: Float64Array };
  /** 1/m */
  curvature: { kx: number; ky: number; kxy: number };
  /** mid-span deflection of a strip along x (the 0° direction) of the study's span, magnitude, mm */
  warpageMm: number;
  /** closing of the study's corner (bend line along y), degrees; positive closes the angle */
  springInDeg: number;
  resinModulusMidPa: number;
}

/** Spring-in from the free strains each point accumulated since it gelled (glassy ply, elastic laminate). */
function springInFromHistory(state: MechanicsState, cornerAngleDeg: number): number {
  const n = state.geometry.plyCount;
  const ply = state.glassyPly;
  const plies: ThroughThicknessPly[] = [];
  const thermal = new Float64Array(2 * n);
  const chemical = new Float64Array(2 * n);
  for (let k = 0; k < n; k++) {
    plies.push({
      angleDeg: state.plyAngleDeg[k],
      thicknessM: state.geometry.zTopM[k] - state.geometry.zBottomM[k],
      e1Pa: ply.e1Pa,
      e2Pa: ply.e2Pa,
      g12Pa: ply.g12Pa,
      nu12: ply.nu12,
      nu23: ply.nu23,
    });
    // A ply's free strain: the mean of its two faces.
    for (let j = 0; j < 2; j++) {
      thermal[2 * k + j] = 0.5 * (state.thermalSinceGel[4 * k + j] + state.thermalSinceGel[4 * k + 2 + j]);
      chemical[2 * k + j] = 0.5 * (state.chemicalSinceGel[4 * k + j] + state.chemicalSinceGel[4 * k + 2 + j]);
    }
  }
  const th = laminateEffectiveFreeStrain(plies, thermal);
  const ch = laminateEffectiveFreeStrain(plies, chemical);
  return springInDeg(cornerAngleDeg, th.inPlane[0], th.throughThickness, ch.inPlane[0], ch.throughThickness);
}

/** Final ply stresses (ply axes), curvature, warpage and spring-in. Fresh arrays on every call. */
export function mechanicsResult(state: MechanicsState, params: Pick<StudyParams, 'geometry'>): MechanicsResult {
  const lam = state.laminate;
  const g = state.geometry;
  const points = 2 * g.plyCount;
  const out = {
    zM: new Float64Array(points),
    plyIndex: new Int32Array(points),
    sigma1Pa: new Float64Array(points),
    sigma2Pa: new Float64Array(points),
    tau12Pa: new Float64Array(points),
  };
  const s = new Float64Array(3);
  const s12 = new Float64Array(3);
  for (let p = 0; p < points; p++) {
    const k = p >> 1;
    out.zM[p] = g.pointZM[p] + g.thicknessM / 2;
    out.plyIndex[p] = k;
    pointStress(lam, p, s);
    stressToPlyAxes(s[0], s[1], s[2], state.plyAngleDeg[k], s12);
    out.sigma1Pa[p] = s12[0];
    out.sigma2Pa[p] = s12[1];
    out.tau12Pa[p] = s12[2];
  }
  const [kx, ky, kxy] = lam.curvature;
  return {
    plyStresses: out,
    curvature: { kx, ky, kxy },
    warpageMm: Math.abs(mToMm(stripWarpageM(kx, mmToM(params.geometry.stripSpanMm)))),
    springInDeg: springInFromHistory(state, params.geometry.cornerAngleDeg),
    resinModulusMidPa: apparentResinModulusPa(state.resin, state.gelPoint, state.prevTK[state.midPoint], state.prevAlpha[state.midPoint], state.prevTgK[state.midPoint]),
  };
}
