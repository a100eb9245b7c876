import type { ResinCard } from '../schemas/study';
import { LLS_SWITCH_ALPHA } from '../schemas/study';
import { perMinToPerS } from '../units';

// Cure kinetics: dα/dt as a function of degree of cure α and temperature T (kelvin), and a step integrator
// that advances α over a time step at a fixed temperature. Forms:
//   nth order:             dα/dt = A e^(−E/RT) (1−α)^n
//   Kamal–Sourour:         dα/dt = (k1 + k2 α^m)(1−α)^n            (Kamal & Sourour, Polym. Eng. Sci. 13, 1973)
//   Lee–Loos–Springer:     α < 0.3: (K1 + K2 α)(1−α)(B−α);  α ≥ 0.3: K3 (1−α)   (J. Compos. Mater. 16, 1982)
// optionally times the diffusion factor f_d = 1/(1 + exp(C(α − (α_C0 + α_CT T))))
// (Chern & Poehlein 1987; Cole, Hechler & Noël 1991).

/**
 * Gas constant in J/(mol·K), to the four figures the cure-kinetics literature fits its constants with.
 * The published Lee–Loos–Springer constants reproduce their reference curves with this value; the CODATA
 * 8.314462618 shifts the 177 °C half-life from 13.08 to 13.07 min.
 */
export const GAS_CONSTANT = 8.314;
/** A pure autocatalytic term α^m never starts from α = 0: it sees at least this seed. */
export const ALPHA_SEED = 1e-6;
// The hot paths read module-private copies of the exported constants: an exported binding of an ES module
// lives in a cell that an optimising compiler does not fold, and `x < LIMIT ? x : LIMIT` with such a binding
// boxes x into a heap number on every evaluation (V8).
const SEED = ALPHA_SEED;
/** α stays below 1 so (1 − α)^n and its derivatives stay finite. */
export const ALPHA_MAX = 1 - 1e-9;
const CAP = ALPHA_MAX;
/**
 * Default tolerance on α per call of advanceCure (shared/solver/README.md, "Cure kinetics", says why this
 * size): absolute, except for a law that grows from its seed, where it shrinks with α (see toleranceFloor).
 */
export const DEFAULT_CURE_TOLERANCE = 1e-7;
/** The loosest tolerance a caller may ask for. */
export const MAX_CURE_TOLERANCE = 1e-3;
/**
 * A purely autocatalytic law grows from its seed and amplifies an early relative error into the whole curve,
 * so its tolerance is tolerance·(α + SEEDED_TOLERANCE_FLOOR); with an α-independent term an early error stays
 * as small as it was, and the absolute tolerance holds throughout.
 */
const SEEDED_TOLERANCE_FLOOR = 1e-3;

// A module-private copy of an imported constant, for the reason given at SEED (and CommonJS interop wraps
// an import in a getter).
const SWITCH_ALPHA = LLS_SWITCH_ALPHA;

const NTH_ORDER = 0;
const KAMAL_SOUROUR = 1;
const LEE_LOOS_SPRINGER = 2;

/** Kinetics in SI with the Arrhenius exponents stored as E/R (kelvin); a plain object for the hot loop. */
export interface PreparedKinetics {
  readonly form: 'nth-order' | 'kamal-sourour' | 'lee-loos-springer';
  /** 0 nth order, 1 Kamal–Sourour, 2 Lee–Loos–Springer */
  readonly formCode: number;
  /** pre-exponential factors in 1/s (a2 may be negative for Lee–Loos–Springer) */
  readonly a1: number;
  readonly a2: number;
  readonly a3: number;
  /** activation energies over R, in K */
  readonly e1OverR: number;
  readonly e2OverR: number;
  readonly e3OverR: number;
  readonly m: number;
  readonly n: number;
  /** how x^m and x^n are evaluated (exponentKind), fixed once here */
  readonly mKind: number;
  readonly nKind: number;
  readonly b: number;
  readonly hasDiffusion: boolean;
  readonly diffusionC: number;
  readonly diffusionAlphaC0: number;
  readonly diffusionAlphaCTPerK: number;
  /** absolute tolerance on α per advanceCure call */
  readonly tolerance: number;
  /** the tolerance at α is tolerance·min(1, α + toleranceFloor): 1 (absolute) unless the law starts from the seed */
  readonly toleranceFloor: number;
}

export type KineticsInput = Pick<ResinCard, 'kinetics' | 'diffusion'>;

function requireFinite(value: number, field: string, rule: string, ok: boolean): void {
  if (!Number.isFinite(value) || !ok) {
    throw new RangeError(`${field}: ${String(value)} is out of range: allowed ${rule}`);
  }
}

/**
 * Convert a resin card's kinetics (and optional diffusion factor) to SI once, at the entry of a simulation.
 * Lee–Loos–Springer constants are given per minute, as published, and are converted to per second here.
 */
export function prepareKinetics(card: KineticsInput, options: { tolerance?: number } = {}): PreparedKinetics {
  const kin = card.kinetics;
  const tolerance = options.tolerance ?? DEFAULT_CURE_TOLERANCE;
  requireFinite(tolerance, 'tolerance', `> 0 and ≤ ${MAX_CURE_TOLERANCE.toExponential()}`, tolerance > 0 && tolerance <= MAX_CURE_TOLERANCE);
  const base = {
    a1: 0, a2: 0, a3: 0, e1OverR: 0, e2OverR: 0, e3OverR: 0, m: 0, n: 1, b: 1,
  };
  let form: PreparedKinetics['form'];
  let formCode: number;
  switch (kin.form) {
    case 'nth-order':
      requireFinite(kin.aPerS, 'kinetics.aPerS', '> 0 (1/s)', kin.aPerS > 0);
      requireFinite(kin.eJPerMol, 'kinetics.eJPerMol', '≥ 0 J/mol', kin.eJPerMol >= 0);
      requireFinite(kin.n, 'kinetics.n', '≥ 0', kin.n >= 0);
      form = kin.form;
      formCode = NTH_ORDER;
      base.a1 = kin.aPerS;
      base.e1OverR = kin.eJPerMol / GAS_CONSTANT;
      base.n = kin.n;
      break;
    case 'kamal-sourour':
      requireFinite(kin.a1PerS, 'kinetics.a1PerS', '≥ 0 (1/s)', kin.a1PerS >= 0);
      requireFinite(kin.a2PerS, 'kinetics.a2PerS', '≥ 0 (1/s)', kin.a2PerS >= 0);
      requireFinite(kin.a1PerS + kin.a2PerS, 'kinetics.a1PerS + a2PerS', '> 0 (1/s)', kin.a1PerS + kin.a2PerS > 0);
      requireFinite(kin.e1JPerMol, 'kinetics.e1JPerMol', '≥ 0 J/mol', kin.e1JPerMol >= 0);
      requireFinite(kin.e2JPerMol, 'kinetics.e2JPerMol', '≥ 0 J/mol', kin.e2JPerMol >= 0);
      requireFinite(kin.m, 'kinetics.m', '≥ 0', kin.m >= 0);
      requireFinite(kin.n, 'kinetics.n', '≥ 0', kin.n >= 0);
      form = kin.form;
      formCode = KAMAL_SOUROUR;
      base.a1 = kin.a1PerS;
      base.a2 = kin.a2PerS;
      base.e1OverR = kin.e1JPerMol / GAS_CONSTANT;
      base.e2OverR = kin.e2JPerMol / GAS_CONSTANT;
      base.m = kin.m;
      base.n = kin.n;
      break;
    case 'lee-loos-springer':
      requireFinite(kin.a1PerMin, 'kinetics.a1PerMin', '≥ 0 (1/min)', kin.a1PerMin >= 0);
      requireFinite(kin.a2PerMin, 'kinetics.a2PerMin', 'a finite number (1/min)', true);
      requireFinite(kin.a3PerMin, 'kinetics.a3PerMin', '> 0 (1/min)', kin.a3PerMin > 0);
      requireFinite(kin.e1JPerMol, 'kinetics.e1JPerMol', '≥ 0 J/mol', kin.e1JPerMol >= 0);
      requireFinite(kin.e2JPerMol, 'kinetics.e2JPerMol', '≥ 0 J/mol', kin.e2JPerMol >= 0);
      requireFinite(kin.e3JPerMol, 'kinetics.e3JPerMol', '≥ 0 J/mol', kin.e3JPerMol >= 0);
      // B − α must stay positive below the switch, or the low-cure branch stalls before reaching it.
      requireFinite(kin.b, 'kinetics.b', `> ${SWITCH_ALPHA}`, kin.b > SWITCH_ALPHA);
      form = kin.form;
      formCode = LEE_LOOS_SPRINGER;
      base.a1 = perMinToPerS(kin.a1PerMin);
      base.a2 = perMinToPerS(kin.a2PerMin);
      base.a3 = perMinToPerS(kin.a3PerMin);
      base.e1OverR = kin.e1JPerMol / GAS_CONSTANT;
      base.e2OverR = kin.e2JPerMol / GAS_CONSTANT;
      base.e3OverR = kin.e3JPerMol / GAS_CONSTANT;
      base.b = kin.b;
      break;
    default: {
      const unknownForm = (kin as { form?: unknown }).form;
      throw new RangeError(
        `kinetics.form: unknown form ${JSON.stringify(unknownForm)}: allowed 'nth-order', 'kamal-sourour', 'lee-loos-springer'`,
      );
    }
  }
  const d = card.diffusion;
  if (d) {
    requireFinite(d.c, 'diffusion.c', '> 0', d.c > 0);
    requireFinite(d.alphaC0, 'diffusion.alphaC0', 'a finite number', true);
    requireFinite(d.alphaCTPerK, 'diffusion.alphaCTPerK', 'a finite number (1/K)', true);
  }
  return {
    form,
    formCode,
    ...base,
    mKind: exponentKind(base.m),
    nKind: exponentKind(base.n),
    hasDiffusion: d !== undefined,
    diffusionC: d?.c ?? 0,
    diffusionAlphaC0: d?.alphaC0 ?? 0,
    diffusionAlphaCTPerK: d?.alphaCTPerK ?? 0,
    tolerance,
    toleranceFloor: formCode === KAMAL_SOUROUR && base.a1 === 0 ? SEEDED_TOLERANCE_FLOOR : 1,
  };
}

/** Diffusion factor f_d (Chern & Poehlein 1987): 1 while the resin is rubbery, → 0 as it vitrifies. */
export function diffusionFactor(k: PreparedKinetics, alpha: number, TK: number): number {
  if (!k.hasDiffusion) return 1;
  return 1 / (1 + Math.exp(k.diffusionC * (alpha - (k.diffusionAlphaC0 + k.diffusionAlphaCTPerK * TK))));
}

// x^p for x ≥ 0 on the hot path: the exponents of fitted cure laws are often whole or half numbers, which
// need no transcendental call; otherwise exp(p ln x), markedly cheaper than Math.pow for a general p. The kind
// of exponent is decided once per card (exponentKind), so a rate evaluation does one dispatch, not a chain of
// comparisons.
const POWER_GENERAL = 0;
const POWER_HALF = 1;
const POWER_THREE_HALVES = 2;
const POWER_ONE = 3;
const POWER_TWO = 4;
const POWER_ZERO = 5;

function exponentKind(p: number): number {
  if (p === 0.5) return POWER_HALF;
  if (p === 1.5) return POWER_THREE_HALVES;
  if (p === 1) return POWER_ONE;
  if (p === 2) return POWER_TWO;
  if (p === 0) return POWER_ZERO;
  return POWER_GENERAL;
}

function powerOfKind(x: number, p: number, kind: number): number {
  switch (kind) {
    case POWER_HALF:
      return Math.sqrt(x);
    case POWER_THREE_HALVES:
      return x * Math.sqrt(x);
    case POWER_ONE:
      return x;
    case POWER_TWO:
      return x * x;
    case POWER_ZERO:
      return 1;
    default:
      return x <= 0 ? 0 : Math.exp(p * Math.log(x));
  }
}

// The rate for rate constants already evaluated at the temperature (K1..K3) and the diffusion centre
// α_C0 + α_CT·T; `upper` selects the Lee–Loos–Springer branch. Never negative (a negative K1 + K2α at low
// temperature means no reaction, not un-curing), never NaN. `from` is the α the integration step started
// from and `expFrom` = e^(C(from − centre)) there (see diffusionExp).
function rateAt(k: PreparedKinetics, K1: number, K2: number, K3: number, centre: number, alpha: number, upper: boolean, from: number, expFrom: number): number {
  return withDiffusion(k, chemicalRate(k, K1, K2, K3, alpha, upper), centre, alpha, from, expFrom);
}

/** A chemical rate r (any sign) times the diffusion factor at α; 0 unless r > 0. */
function withDiffusion(k: PreparedKinetics, r: number, centre: number, alpha: number, from: number, expFrom: number): number {
  if (!(r > 0)) return 0;
  if (k.hasDiffusion) {
    // Below −40 the exponential is under 1e-17 of 1: f_d is 1 to double precision, skip it.
    const x = k.diffusionC * (alpha - centre);
    if (x > -40) return r / (1 + diffusionExp(k.diffusionC, alpha, centre, from, expFrom));
  }
  return r;
}

/** Half-width of the span of C(α − from) over which diffusionExp uses its series. */
const SERIES_SPAN = 0.5;
// 1/k! for the series
const I2 = 1 / 2, I3 = 1 / 6, I4 = 1 / 24, I5 = 1 / 120, I6 = 1 / 720, I7 = 1 / 5040, I8 = 1 / 40320;
const I9 = 1 / 362880, I10 = 1 / 3628800, I11 = 1 / 39916800, I12 = 1 / 479001600;

/**
 * e^(C(α − centre)) for the diffusion factor at a stage of an integration step that started from α = from,
 * where expFrom = e^(C(from − centre)): expFrom·e^(C(α − from)), the second factor by its Taylor series to
 * the 12th power while |C(α − from)| ≤ ½ (relative error under 3.2e-14; a stage sits within the step's Δα of
 * its start), e^(C(α − centre)) itself otherwise. One exponential per step instead of one per stage.
 */
function diffusionExp(c: number, alpha: number, centre: number, from: number, expFrom: number): number {
  const u = c * (alpha - from);
  if (u >= -SERIES_SPAN && u <= SERIES_SPAN) {
    // Estrin's grouping of the same sum: its products are independent, so they overlap.
    const u2 = u * u;
    const u4 = u2 * u2;
    const low = 1 + u + u2 * (I2 + u * I3) + u4 * (I4 + u * I5 + u2 * (I6 + u * I7));
    const high = I8 + u * I9 + u2 * (I10 + u * I11) + u4 * I12;
    return expFrom * (low + u4 * u4 * high);
  }
  return Math.exp(c * (alpha - centre));
}

/** e^(C(α − centre)) at the start of an integration step (0 without a diffusion factor: never read then). */
function expAtStart(k: PreparedKinetics, alpha: number, centre: number): number {
  return k.hasDiffusion ? Math.exp(k.diffusionC * (alpha - centre)) : 0;
}

/** The rate before the diffusion factor (may be ≤ 0 or NaN: rateAt turns that into 0). */
function chemicalRate(k: PreparedKinetics, K1: number, K2: number, K3: number, alpha: number, upper: boolean): number {
  if (k.formCode === NTH_ORDER) return nthOrderRate(k, K1, alpha);
  if (k.formCode === KAMAL_SOUROUR) return kamalSourourRate(k, K1, K2, alpha);
  return leeLoosSpringerRate(k, K1, K2, K3, alpha, upper);
}

function nthOrderRate(k: PreparedKinetics, K1: number, alpha: number): number {
  return K1 * powerOfKind(alpha < 1 ? 1 - alpha : 0, k.n, k.nKind);
}

function kamalSourourRate(k: PreparedKinetics, K1: number, K2: number, alpha: number): number {
  const seeded = alpha > SEED ? alpha : SEED;
  return (K1 + K2 * powerOfKind(seeded, k.m, k.mKind)) * powerOfKind(alpha < 1 ? 1 - alpha : 0, k.n, k.nKind);
}

function leeLoosSpringerRate(k: PreparedKinetics, K1: number, K2: number, K3: number, alpha: number, upper: boolean): number {
  const free = alpha < 1 ? 1 - alpha : 0;
  return upper ? K3 * free : (K1 + K2 * alpha) * free * (k.b - alpha);
}

/** A e^(−E/RT), skipping the exponential for a term the form does not use. */
function arrhenius(a: number, eOverR: number, TK: number): number {
  return a === 0 ? 0 : a * Math.exp(-eOverR / TK);
}

/** Lee–Loos–Springer upper branch from the switch on: the switch value itself belongs to the upper branch, so a
 *  node that has landed on it moves on at the upper rate. */
function isUpperBranch(k: PreparedKinetics, alpha: number): boolean {
  return k.formCode === LEE_LOOS_SPRINGER && alpha >= SWITCH_ALPHA;
}

/** Cure rate dα/dt in 1/s at degree of cure α and temperature TK (kelvin); ≥ 0 and finite. */
export function cureRate(k: PreparedKinetics, alpha: number, TK: number): number {
  const K1 = arrhenius(k.a1, k.e1OverR, TK);
  const K2 = arrhenius(k.a2, k.e2OverR, TK);
  const K3 = arrhenius(k.a3, k.e3OverR, TK);
  const centre = k.diffusionAlphaC0 + k.diffusionAlphaCTPerK * TK;
  return rateAt(k, K1, K2, K3, centre, alpha, isUpperBranch(k, alpha), alpha, expAtStart(k, alpha, centre));
}

// Dormand–Prince 5(4) (Dormand & Prince, J. Comput. Appl. Math. 6, 1980): embedded pair with FSAL.
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const B1 = 35 / 384, B3 = 500 / 1113, B4 = 125 / 192, B5 = -2187 / 6784, B6 = 11 / 84;
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;

/** Scratch for one Dormand–Prince step: the 5th-order value, its error estimate and the end rate (FSAL). */
interface StepResult {
  alpha: number;
  error: number;
  endRate: number;
}
const step: StepResult = { alpha: 0, error: 0, endRate: 0 };

function dormandPrince(
  k: PreparedKinetics, K1: number, K2: number, K3: number, centre: number, upper: boolean,
  a: number, ea: number, f1: number, h: number, out: StepResult,
): void {
  const f2 = rateAt(k, K1, K2, K3, centre, a + h * (A21 * f1), upper, a, ea);
  const f3 = rateAt(k, K1, K2, K3, centre, a + h * (A31 * f1 + A32 * f2), upper, a, ea);
  const f4 = rateAt(k, K1, K2, K3, centre, a + h * (A41 * f1 + A42 * f2 + A43 * f3), upper, a, ea);
  const f5 = rateAt(k, K1, K2, K3, centre, a + h * (A51 * f1 + A52 * f2 + A53 * f3 + A54 * f4), upper, a, ea);
  const f6 = rateAt(k, K1, K2, K3, centre, a + h * (A61 * f1 + A62 * f2 + A63 * f3 + A64 * f4 + A65 * f5), upper, a, ea);
  const a5 = a + h * (B1 * f1 + B3 * f3 + B4 * f4 + B5 * f5 + B6 * f6);
  const f7 = rateAt(k, K1, K2, K3, centre, a5, upper, a, ea);
  out.alpha = a5;
  out.endRate = f7;
  out.error = stepError(h, f1, f3, f4, f5, f6, f7);
}

/** The Dormand–Prince error estimate of a step of length h from its stage rates (f2 does not enter it). */
function stepError(h: number, f1: number, f3: number, f4: number, f5: number, f6: number, f7: number): number {
  return Math.abs(h * (E1 * f1 + E3 * f3 + E4 * f4 + E5 * f5 + E6 * f6 + E7 * f7));
}

const MAX_SUBSTEPS = 100_000;

/**
 * Advance the degree of cure over dtS seconds at the fixed temperature TK. Sub-stepped Dormand–Prince 5(4)
 * with error control on α (tolerance k.tolerance per call). The Lee–Loos–Springer switch at α = 0.3 is
 * landed on exactly (the step that would cross it is shortened by Newton iteration on its length), then the
 * upper branch takes over: the rate jump never sits inside a step. Returns α in [alpha, ALPHA_MAX].
 */
export function advanceCure(k: PreparedKinetics, alpha: number, TK: number, dtS: number): number {
  if (!(dtS >= 0) || !Number.isFinite(dtS)) throw new RangeError(`advanceCure: time step ${String(dtS)} s: allowed ≥ 0 and finite`);
  if (!(TK > 0) || !Number.isFinite(TK)) throw new RangeError(`advanceCure: temperature ${String(TK)} K: allowed > 0 and finite`);
  if (!(alpha >= 0 && alpha <= 1)) throw new RangeError(`advanceCure: degree of cure ${String(alpha)}: allowed 0..1`);
  let a = alpha < CAP ? alpha : CAP;
  if (dtS === 0) return a;
  const K1 = arrhenius(k.a1, k.e1OverR, TK);
  const K2 = arrhenius(k.a2, k.e2OverR, TK);
  const K3 = arrhenius(k.a3, k.e3OverR, TK);
  const centre = k.diffusionAlphaC0 + k.diffusionAlphaCTPerK * TK;
  const lls = k.formCode === LEE_LOOS_SPRINGER;
  let upper = isUpperBranch(k, a);
  let ea = expAtStart(k, a, centre); // e^(C(a − centre)), renewed whenever a moves (diffusionExp)
  let f = rateAt(k, K1, K2, K3, centre, a, upper, a, ea);
  let t = 0;
  let h = dtS;
  for (let i = 0; i < MAX_SUBSTEPS; i++) {
    // At a fixed temperature the equation is autonomous: a zero rate is an equilibrium.
    if (f === 0) return a;
    const remaining = dtS - t;
    if (h > remaining) h = remaining;
    // An explicit step should not leap most of the way to the end of the reaction in one go.
    const room = (lls && !upper ? k.b : 1) - a;
    if (h * f > 0.5 * room) h = (0.5 * room) / f;
    dormandPrince(k, K1, K2, K3, centre, upper, a, ea, f, h, step);
    const tol = toleranceAt(k, a);
    const err = step.error;
    if (err <= tol) {
      if (lls && !upper && step.alpha >= SWITCH_ALPHA) {
        t += landOnSwitch(k, K1, K2, K3, centre, a, ea, f, h, (SWITCH_ALPHA - a) / (step.alpha - a));
        a = SWITCH_ALPHA;
        upper = true;
        ea = expAtStart(k, a, centre);
        f = rateAt(k, K1, K2, K3, centre, a, true, a, ea);
      } else {
        const next = step.alpha < CAP ? step.alpha : CAP;
        if (next > a) a = next;
        ea = expAtStart(k, a, centre);
        f = step.endRate;
        t += h;
      }
      if (t >= dtS * (1 - 1e-14)) return a;
    }
    h *= stepFactor(err, tol);
  }
  throw new Error(`advanceCure: no convergence within ${MAX_SUBSTEPS} sub-steps (α ${a}, T ${TK} K, dt ${dtS} s)`);
}

/** The tolerance on a step from α: absolute, relative while α is tiny for a law that grows from its seed. */
function toleranceAt(k: PreparedKinetics, alpha: number): number {
  return k.tolerance * Math.min(1, alpha + k.toleranceFloor);
}

/** Standard step-size control for a 5th-order method (Hairer, Nørsett & Wanner, Solving ODEs I, §II.4). */
function stepFactor(err: number, tol: number): number {
  const factor = err === 0 ? 5 : 0.9 * Math.pow(tol / err, 0.2);
  return factor > 5 ? 5 : factor < 0.2 ? 0.2 : factor;
}

// Length of the step from α (< 0.3) that ends exactly on the switch: Newton on g(s) = Φ(s) − 0.3 with
// g'(s) = f(Φ(s)), where Φ is the Dormand–Prince step map of the lower branch (smooth across 0.3).
function landOnSwitch(
  k: PreparedKinetics, K1: number, K2: number, K3: number, centre: number,
  a: number, ea: number, f: number, hMax: number, fraction: number,
): number {
  let s = hMax * Math.min(Math.max(fraction, 0), 1);
  for (let it = 0; it < 20; it++) {
    dormandPrince(k, K1, K2, K3, centre, false, a, ea, f, s, step);
    const g = step.alpha - SWITCH_ALPHA;
    if (Math.abs(g) < 1e-14 || step.endRate <= 0) break;
    let next = s - g / step.endRate;
    if (next <= 0) next = s / 2;
    if (next > hMax) next = hMax;
    s = next;
  }
  return s;
}

/** Work arrays for advancing many nodes at once; allocated once per column, reused every step. */
export interface CureBatch {
  readonly size: number;
  /** per listed node: start α, rate constants at its temperature, diffusion centre */
  readonly a: Float64Array;
  readonly K1: Float64Array;
  readonly K2: Float64Array;
  readonly K3: Float64Array;
  readonly centre: Float64Array;
  /** e^(C(a − centre)) per listed node (diffusionExp) */
  readonly ea: Float64Array;
  /** the stage rates f1..f7 of the Dormand–Prince step */
  readonly f: readonly Float64Array[];
  /** the α each stage evaluates the rate at (the 5th-order end value after the last stage) */
  readonly x: Float64Array;
  /** temperature, and ∂ln f/∂T at the start and the end of the step */
  readonly T: Float64Array;
  readonly g0: Float64Array;
  readonly g1: Float64Array;
  /** 1 where the node was finished by the batch's own step (so the stage values describe it), 0 otherwise */
  readonly own: Uint8Array;
  /** per listed node: the trial step, s */
  readonly h: Float64Array;
  /** the nodes still sub-stepping (continueCureBatch): time reached, s, and where they sit in the list */
  readonly t: Float64Array;
  readonly at: Int32Array;
  /** scratch of the same shape for those nodes (a batch has one, its own has none) */
  readonly retry: CureBatch | null;
}

export function createCureBatch(size: number, withRetry = true): CureBatch {
  const a = () => new Float64Array(size);
  return {
    size, a: a(), K1: a(), K2: a(), K3: a(), centre: a(), ea: a(), f: [a(), a(), a(), a(), a(), a(), a()], x: a(), T: a(), g0: a(), g1: a(),
    own: new Uint8Array(size), h: a(), t: a(), at: new Int32Array(size), retry: withRetry ? createCureBatch(size, false) : null,
  };
}

// The batch works stage by stage over arrays. Its loops call the rate helpers above with plain numbers, which
// stays cheap only while they are inlined: in V8 a floating-point number crossing a call that is not inlined
// is boxed (a heap allocation per number). Hence one call site per helper and loop (the form is chosen
// outside the loop), and module-private constants (see SEED).

// rateAt at x[i] for the listed nodes into out[i]: the chemical rate, then the diffusion factor in a loop of
// its own (withDiffusion(), written out: as a call it was not inlined and boxed its three numbers).
function stageRates(k: PreparedKinetics, w: CureBatch, count: number, out: Float64Array): void {
  const { a, K1, K2, K3, centre, ea, x } = w;
  if (k.formCode === KAMAL_SOUROUR) {
    for (let i = 0; i < count; i++) out[i] = kamalSourourRate(k, K1[i], K2[i], x[i]);
  } else if (k.formCode === NTH_ORDER) {
    for (let i = 0; i < count; i++) out[i] = nthOrderRate(k, K1[i], x[i]);
  } else {
    for (let i = 0; i < count; i++) out[i] = leeLoosSpringerRate(k, K1[i], K2[i], K3[i], x[i], a[i] >= SWITCH_ALPHA);
  }
  const c = k.diffusionC;
  const diffusion = k.hasDiffusion;
  for (let i = 0; i < count; i++) {
    const r = out[i];
    if (!(r > 0)) out[i] = 0;
    else if (diffusion) {
      // Below −40 the exponential is under 1e-17 of 1: f_d is 1 to double precision (as in withDiffusion).
      const y = c * (x[i] - centre[i]);
      if (y > -40) out[i] = r / (1 + diffusionExp(c, x[i], centre[i], a[i], ea[i]));
    }
  }
}

// The rate constants at each node's temperature.
function stageConstants(k: PreparedKinetics, w: CureBatch, count: number): void {
  const { T, centre } = w;
  for (let term = 0; term < 3; term++) {
    const out = term === 0 ? w.K1 : term === 1 ? w.K2 : w.K3;
    const a = term === 0 ? k.a1 : term === 1 ? k.a2 : k.a3;
    const eOverR = term === 0 ? k.e1OverR : term === 1 ? k.e2OverR : k.e3OverR;
    // arrhenius(), written out
    for (let i = 0; i < count; i++) out[i] = a === 0 ? 0 : a * Math.exp(-eOverR / T[i]);
  }
  for (let i = 0; i < count; i++) centre[i] = k.diffusionAlphaC0 + k.diffusionAlphaCTPerK * T[i];
}

// ∂ln f/∂T at the start (α₀, rate f1) and the end (x, rate f7) of the step, where the rate is > 0: each
// Arrhenius term contributes its E/RT² weighted by its share of the rate, the diffusion factor C·α_CT·(1 − f_d).
function stageSlopes(k: PreparedKinetics, w: CureBatch, count: number): void {
  const { a, K1, K2, T, centre, ea } = w;
  const c = k.diffusionC;
  const diffusionSlope = k.hasDiffusion ? c * k.diffusionAlphaCTPerK : 0;
  for (let end = 0; end < 2; end++) {
    const alpha = end === 0 ? a : w.x;
    const rate = end === 0 ? w.f[0] : w.f[6];
    const out = end === 0 ? w.g0 : w.g1;
    for (let i = 0; i < count; i++) {
      const r = rate[i];
      const x = alpha[i];
      const upper = isUpperBranch(k, a[i]);
      let eOverR: number; // rate-weighted E/R
      if (k.formCode === NTH_ORDER) {
        eOverR = k.e1OverR;
      } else if (upper) {
        eOverR = k.e3OverR;
      } else {
        const u = K2[i] * (k.formCode === KAMAL_SOUROUR ? powerOfKind(x > SEED ? x : SEED, k.m, k.mKind) : x);
        eOverR = (K1[i] * k.e1OverR + u * k.e2OverR) / (K1[i] + u);
      }
      let g = eOverR / (T[i] * T[i]);
      if (k.hasDiffusion && c * (x - centre[i]) > -40) {
        // 1 − f_d = e/(1 + e) with the exponential the stage rates used (diffusionExp from the step's start)
        const e = diffusionExp(c, x, centre[i], a[i], ea[i]);
        g += diffusionSlope * (e / (1 + e));
      }
      out[i] = r > 0 ? g : 0;
    }
  }
}

/**
 * advanceCure for the nodes listed in nodes[0..count): alphaOut[j] = advanceCure(k, alphaIn[j], TK[j], dtS),
 * to the last bit (cureBatchSlopes then gives each result's temperature slope).
 * Under the time loop's step limits the first Dormand–Prince step of length dtS passes the error test at
 * almost every node; those nodes are finished here, stage by stage across the nodes, with exactly the
 * arithmetic of advanceCure's first step. The rest (error too large, the Lee–Loos–Springer switch inside the
 * step, a step near the end of the reaction, invalid input) go through advanceCure itself.
 */
export function advanceCureBatch(
  k: PreparedKinetics, alphaIn: Float64Array, TK: Float64Array, dtS: number, alphaOut: Float64Array,
  nodes: Int32Array, count: number, w: CureBatch,
): void {
  if (count > w.size) throw new RangeError(`advanceCureBatch: ${count} nodes for a batch of ${w.size}`);
  const { a: a0, x, T, own } = w;
  const h = dtS;
  for (let i = 0; i < count; i++) {
    const j = nodes[i];
    T[i] = TK[j];
    a0[i] = alphaIn[j] < CAP ? alphaIn[j] : CAP;
    x[i] = a0[i];
  }
  stageConstants(k, w, count);
  // expAtStart(), written out: as a call here it was not inlined and boxed its result
  if (k.hasDiffusion) for (let i = 0; i < count; i++) w.ea[i] = Math.exp(k.diffusionC * (a0[i] - w.centre[i]));
  stageRates(k, w, count, w.f[0]);
  w.h.fill(dtS, 0, count);
  dormandPrinceStages(k, w, count);
  const [f1, , f3, f4, f5, f6, f7] = w.f;
  let retries = 0;
  const lls = k.formCode === LEE_LOOS_SPRINGER;
  for (let i = 0; i < count; i++) {
    const j = nodes[i];
    const a = a0[i];
    const a5 = x[i];
    const upper = isUpperBranch(k, a);
    const err = stepError(h, f1[i], f3[i], f4[i], f5[i], f6[i], f7[i]);
    const room = (lls && !upper ? k.b : 1) - a;
    // advanceCure refuses a non-physical temperature or degree of cure: let it be the one to say so.
    const valid = TK[j] > 0 && TK[j] < Infinity && alphaIn[j] >= 0 && alphaIn[j] <= 1;
    const tol = toleranceAt(k, a);
    // the full step is a fair trial: no invalid input to refuse, and short of half the room to full cure
    const fits = valid && h * f1[i] <= 0.5 * room;
    own[i] = 0;
    if (valid && f1[i] === 0) {
      alphaOut[j] = a; // an equilibrium at this temperature, as in advanceCure
      own[i] = 1;
    } else if (fits && err > tol && !lls) {
      // advanceCure would reject this very step first: the node goes on from there with the others like it,
      // sub-stepping in a batch of their own (continueCureBatch), with advanceCure's loop and arithmetic
      w.h[i] = h * stepFactor(err, tol);
      w.t[i] = 0;
      w.at[i] = i;
      copySubStepState(w, i, w.retry as CureBatch, retries++);
    } else if (fits && err <= tol && !(lls && !upper && a5 >= SWITCH_ALPHA)) {
      const next = a5 < CAP ? a5 : CAP;
      alphaOut[j] = next > a ? next : a;
      own[i] = 1;
    } else {
      alphaOut[j] = advanceCure(k, alphaIn[j], TK[j], dtS);
    }
  }
  if (retries > 0) continueCureBatch(k, w.retry as CureBatch, retries, dtS, nodes, alphaOut);
}

// The stages of dormandPrince() from α = a[i] with rate f[0][i] over the step h[i], each across all the
// nodes, with the same arithmetic (one call site of stageRates, so that it stays inlined).
function dormandPrinceStages(k: PreparedKinetics, w: CureBatch, count: number): void {
  const { a: a0, x, h } = w;
  const [f1, f2, f3, f4, f5, f6] = w.f;
  for (let stage = 1; stage < 7; stage++) {
    switch (stage) {
      case 1:
        for (let i = 0; i < count; i++) x[i] = a0[i] + h[i] * (A21 * f1[i]);
        break;
      case 2:
        for (let i = 0; i < count; i++) x[i] = a0[i] + h[i] * (A31 * f1[i] + A32 * f2[i]);
        break;
      case 3:
        for (let i = 0; i < count; i++) x[i] = a0[i] + h[i] * (A41 * f1[i] + A42 * f2[i] + A43 * f3[i]);
        break;
      case 4:
        for (let i = 0; i < count; i++) x[i] = a0[i] + h[i] * (A51 * f1[i] + A52 * f2[i] + A53 * f3[i] + A54 * f4[i]);
        break;
      case 5:
        for (let i = 0; i < count; i++) x[i] = a0[i] + h[i] * (A61 * f1[i] + A62 * f2[i] + A63 * f3[i] + A64 * f4[i] + A65 * f5[i]);
        break;
      default: // 6: the 5th-order end value; its rate enters the error estimate (and the slope)
        for (let i = 0; i < count; i++) x[i] = a0[i] + h[i] * (B1 * f1[i] + B3 * f3[i] + B4 * f4[i] + B5 * f5[i] + B6 * f6[i]);
        break;
    }
    stageRates(k, w, count, w.f[stage]);
  }
}

/**
 * advanceCure's sub-step loop for nodes (not Lee–Loos–Springer) whose first full step was rejected, all at
 * once: each round every node takes one Dormand–Prince step of its own length, then is accepted or not and
 * gets its next step exactly as that loop would, so each ends on advanceCure's value to the last bit.
 * q holds per node what copySubStepState moves: α, rate constants, rate at α (f[0]), trial step h, time t
 * and list position `at`.
 */
function continueCureBatch(k: PreparedKinetics, q: CureBatch, count: number, dtS: number, nodes: Int32Array, alphaOut: Float64Array): void {
  const { a, h, t, at, x } = q;
  const [f1, , f3, f4, f5, f6, f7] = q.f;
  let n = count;
  for (let round = 0; n > 0; round++) {
    if (round >= MAX_SUBSTEPS) throw new Error(`advanceCure: no convergence within ${MAX_SUBSTEPS} sub-steps (batch of ${n}, dt ${dtS} s)`);
    // The top of advanceCure's loop: an equilibrium ends the node; the step is clipped to what is left and
    // to half the room to full cure.
    let m = 0;
    for (let r = 0; r < n; r++) {
      if (f1[r] === 0) {
        alphaOut[nodes[at[r]]] = a[r];
        continue;
      }
      if (m !== r) copySubStepState(q, r, q, m);
      const remaining = dtS - t[m];
      if (h[m] > remaining) h[m] = remaining;
      const room = 1 - a[m];
      if (h[m] * f1[m] > 0.5 * room) h[m] = (0.5 * room) / f1[m];
      m++;
    }
    n = m;
    if (n === 0) return;
    dormandPrinceStages(k, q, n);
    m = 0;
    for (let r = 0; r < n; r++) {
      const err = stepError(h[r], f1[r], f3[r], f4[r], f5[r], f6[r], f7[r]);
      const tol = toleranceAt(k, a[r]);
      if (err <= tol) {
        const next = x[r] < CAP ? x[r] : CAP;
        if (next > a[r]) a[r] = next;
        q.ea[r] = k.hasDiffusion ? Math.exp(k.diffusionC * (a[r] - q.centre[r])) : 0; // expAtStart(), written out
        f1[r] = f7[r];
        t[r] += h[r];
        if (t[r] >= dtS * (1 - 1e-14)) {
          alphaOut[nodes[at[r]]] = a[r];
          continue;
        }
      }
      h[r] *= stepFactor(err, tol);
      if (m !== r) copySubStepState(q, r, q, m);
      m++;
    }
    n = m;
  }
}

/** What a sub-stepping node carries, from position i of one batch to position r of another (or the same). */
function copySubStepState(from: CureBatch, i: number, to: CureBatch, r: number): void {
  to.a[r] = from.a[i];
  to.K1[r] = from.K1[i];
  to.K2[r] = from.K2[i];
  to.K3[r] = from.K3[i];
  to.centre[r] = from.centre[i];
  to.ea[r] = from.ea[i];
  to.f[0][r] = from.f[0][i];
  to.h[r] = from.h[i];
  to.t[r] = from.t[i];
  to.at[r] = from.at[i];
}

/**
 * For the nodes of the last advanceCureBatch call (same nodes, count and dtS, nothing run on the batch in
 * between): slope[j] = ∂alphaOut[j]/∂TK[j] in 1/K, NaN where the node needed advanceCure's sub-steps or the
 * switch. With h = ∫ dα/f over [α₀, α₁] held fixed, ∂α₁/∂T = f(α₁)·∫₀ʰ ∂ln f/∂T dt; the integral by the
 * trapezoidal rule between the step's ends (the slope barely changes over a step of Δα ≲ 0.005).
 */
export function cureBatchSlopes(k: PreparedKinetics, w: CureBatch, nodes: Int32Array, count: number, dtS: number, slope: Float64Array): void {
  stageSlopes(k, w, count);
  const { own, g0, g1 } = w;
  const f1 = w.f[0];
  const f7 = w.f[6];
  for (let i = 0; i < count; i++) {
    const j = nodes[i];
    if (!own[i]) slope[j] = Number.NaN;
    else if (f1[i] === 0) slope[j] = 0;
    else slope[j] = f7[i] * 0.5 * dtS * (g0[i] + g1[i]);
  }
}

/**
 * Degree of cure to start a simulation from: 0, except for a purely autocatalytic Kamal–Sourour law
 * (k1 = 0), which would never leave α = 0 and starts from the seed instead (shared/solver/README.md, "Cure kinetics").
 */
export function initialDegreeOfCure(k: PreparedKinetics): number {
  return k.formCode === KAMAL_SOUROUR && k.a1 === 0 ? SEED : 0;
}
