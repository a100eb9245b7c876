// Resin relaxation (SI): normalised Prony series in reduced time, the Tg-referenced shift factor, the
// recursive stress update, and the CHILE elastic alternative through the same path.
//
//   E(ξ) = E∞ + (E_u − E∞) Σ wᵢ e^(−ξ/τᵢ),  Σ wᵢ = 1,  dξ = dt / a(T, α)          (normalised Prony form)
//   log₁₀ a = −C1 (T − T_r)/(C2 + T − T_r) for T ≥ T_r, T_r = Tg(α) + offset     (Williams, Landel & Ferry 1955)
//   log₁₀ a = E_a/(R ln 10) (1/T − 1/T_r) below T_r                               (Arrhenius; continuous at T_r)
//   plus an optional cure table log₁₀ a_α(α), linearly interpolated and held flat beyond its ends.
//
// Recursive update per term (Taylor, Pister & Goudreau 1970; Simo & Hughes 1998 (memory)):
//   x = Δξ/τ, e = e^(−x), g = (1 − e)/x,  h ← e·h + Eᵢ·g·Δε
// exact when the strain is linear in reduced time over the step, with O(1) memory per term.
// CHILE (Johnston, Vaziri & Poursartip 2001 (memory)) is one term with τ → ∞ (e = 1, g = 1): a hypoelastic
// modulus that is piecewise linear in T* = T − Tg(α) between a rubbery and a glassy value.

import type { ResinCard } from '../schemas/study';
import { gpaToPa } from '../units';

/** R in J/(mol·K) (CODATA 2018, exact). */
export const GAS_CONSTANT = 8.314462618;
const R_GAS = GAS_CONSTANT;

/** |log₁₀ a| is held below this so reduced time stays finite far from T_r. */
export const MAX_LOG10_SHIFT = 250;
// Module-private copies for the hot paths (an exported binding is not folded; kinetics.ts says why).
const MAX_LOG10 = MAX_LOG10_SHIFT;

/** Below this x the closed form (1 − e^(−x))/x loses digits; its series is used instead. */
const SMALL_X = 1e-3;
/** Above this x, e^(−x) < 1e-17: the term has fully relaxed within the step. */
const LARGE_X = 40;

export interface ShiftSI {
  wlfC1: number;
  wlfC2K: number;
  /** T_r − Tg(α), K */
  offsetK: number;
  arrheniusEJPerMol: number;
  /** optional cure table: ascending α and log₁₀ a_α at each */
  cureAlpha: Float64Array | null;
  cureLog10a: Float64Array | null;
}

export interface ChileSI {
  /** T* = T − Tg at and below which the resin is glassy, K */
  glassyOffsetK: number;
  /** T* at and above which the resin is rubbery, K */
  rubberyOffsetK: number;
}

export interface ResinRelaxation {
  model: 'prony' | 'chile';
  /** glassy (unrelaxed) modulus E_u, Pa */
  unrelaxedPa: number;
  /** rubbery (relaxed) modulus E∞, Pa */
  relaxedPa: number;
  /** normalised Prony weights (Σ = 1) and times, s; for CHILE one term of weight 1 and τ = ∞ */
  weights: Float64Array;
  timesS: Float64Array;
  shift: ShiftSI;
  chile: ChileSI;
}

/**
 * The card's modulus block in SI. CHILE runs through the same path as one term of τ = ∞ whose share of
 * E_u − E∞ is the glassy fraction at T* (set per step), so its weights and times are fixed here.
 */
export function prepareResinRelaxation(modulus: ResinCard['modulus']): ResinRelaxation {
  const unrelaxedPa = gpaToPa(modulus.unrelaxedGPa);
  const relaxedPa = gpaToPa(modulus.relaxedGPa);
  if (!(unrelaxedPa > relaxedPa && relaxedPa > 0)) {
    throw new RangeError(
      `resin.modulus.relaxedGPa: ${String(modulus.relaxedGPa)} GPa is out of range: allowed > 0 and < unrelaxedGPa (${String(modulus.unrelaxedGPa)} GPa)`,
    );
  }
  const { weights, timesS } = modulus.prony;
  if (modulus.model === 'prony' && (weights.length !== timesS.length || weights.length === 0)) {
    throw new RangeError(`resin.modulus.prony.timesS: ${timesS.length} times for ${weights.length} weights: allowed one time per weight`);
  }
  if (!(modulus.chile.glassyOffsetC < modulus.chile.rubberyOffsetC)) {
    throw new RangeError(
      `resin.modulus.chile.glassyOffsetC: ${String(modulus.chile.glassyOffsetC)} °C is out of range: allowed < rubberyOffsetC (${String(modulus.chile.rubberyOffsetC)} °C)`,
    );
  }
  const table = modulus.shift.cureTable;
  const chile = modulus.model === 'chile';
  return {
    model: modulus.model,
    unrelaxedPa,
    relaxedPa,
    weights: chile ? Float64Array.of(1) : Float64Array.from(weights),
    timesS: chile ? Float64Array.of(Infinity) : Float64Array.from(timesS),
    shift: {
      wlfC1: modulus.shift.wlfC1,
      wlfC2K: modulus.shift.wlfC2K,
      offsetK: modulus.shift.offsetC,
      arrheniusEJPerMol: modulus.shift.arrheniusEJPerMol,
      cureAlpha: table ? Float64Array.from(table.alpha) : null,
      cureLog10a: table ? Float64Array.from(table.log10a) : null,
    },
    // Offsets are temperature differences: the same number in °C and K.
    chile: { glassyOffsetK: modulus.chile.glassyOffsetC, rubberyOffsetK: modulus.chile.rubberyOffsetC },
  };
}

/** log₁₀ of a table value at α: linear interpolation, flat beyond the ends. */
function cureTableLog10(alpha: Float64Array, log10a: Float64Array, a: number): number {
  const n = alpha.length;
  if (a <= alpha[0]) return log10a[0];
  if (a >= alpha[n - 1]) return log10a[n - 1];
  let i = 1;
  while (alpha[i] < a) i++;
  const s = (a - alpha[i - 1]) / (alpha[i] - alpha[i - 1]);
  return log10a[i - 1] + s * (log10a[i] - log10a[i - 1]);
}

/** log₁₀ a(T, α): WLF above T_r = Tg(α) + offset, Arrhenius below, plus the cure table; clamped to ±MAX_LOG10_SHIFT. */
export function log10ShiftFactor(shift: ShiftSI, TK: number, tgK: number, alpha: number): number {
  const tr = tgK + shift.offsetK;
  const d = TK - tr;
  let la = d >= 0 ? (-shift.wlfC1 * d) / (shift.wlfC2K + d) : (shift.arrheniusEJPerMol / (R_GAS * Math.LN10)) * (1 / TK - 1 / tr);
  if (shift.cureAlpha && shift.cureLog10a) la += cureTableLog10(shift.cureAlpha, shift.cureLog10a, alpha);
  return Math.min(MAX_LOG10, Math.max(-MAX_LOG10, la));
}

/** dξ/dt = 1/a(T, α) = 10^(−log₁₀ a). */
export function reducedTimeRate(shift: ShiftSI, TK: number, tgK: number, alpha: number): number {
  return Math.exp(-Math.LN10 * log10ShiftFactor(shift, TK, tgK, alpha));
}

/** Reduced-time increment over a step: Δξ = ∫ dt/a, by the trapezoid rule on 1/a between the step's ends. */
export function reducedTimeIncrement(dtS: number, rateStart: number, rateEnd: number): number {
  return 0.5 * dtS * (rateStart + rateEnd);
}

/**
 * e = e^(−x), g = (1 − e)/x for every term, x = Δξ/τ; written at `offset` in `e` and `g`.
 * τ = ∞ gives x = 0: e = 1, g = 1 (no relaxation; the CHILE term).
 */
export function relaxationFactors(dXi: number, timesS: Float64Array, e: Float64Array, g: Float64Array, offset = 0): void {
  for (let i = 0; i < timesS.length; i++) {
    const x = dXi / timesS[i];
    if (x < SMALL_X) {
      // Series to x⁴: the error is below 1e-13 · x, and no exp is spent on terms that barely move.
      e[offset + i] = 1 - x * (1 - x * (0.5 - x * (1 / 6 - x / 24)));
      g[offset + i] = 1 - x * (0.5 - x * (1 / 6 - x / 24));
    } else if (x > LARGE_X) {
      e[offset + i] = 0;
      g[offset + i] = 1 / x;
    } else {
      const ei = Math.exp(-x);
      e[offset + i] = ei;
      g[offset + i] = (1 - ei) / x;
    }
  }
}

/** Normalised relaxation function Σ wᵢ e^(−ξ/τᵢ) (1 unrelaxed, 0 fully relaxed). */
export function normalisedRelaxation(weights: Float64Array, timesS: Float64Array, xi: number): number {
  let s = 0;
  for (let i = 0; i < weights.length; i++) s += weights[i] * Math.exp(-xi / timesS[i]);
  return s;
}

/** CHILE glassy fraction: 1 at and below the glassy T*, 0 at and above the rubbery T*, linear between. */
export function chileGlassyFraction(chile: ChileSI, TK: number, tgK: number): number {
  const tStar = TK - tgK;
  if (tStar <= chile.glassyOffsetK) return 1;
  if (tStar >= chile.rubberyOffsetK) return 0;
  return (chile.rubberyOffsetK - tStar) / (chile.rubberyOffsetK - chile.glassyOffsetK);
}

/** Window over which the history plot's apparent modulus is taken (a Prony resin has no single modulus). */
export const APPARENT_MODULUS_WINDOW_S = 60;
const MODULUS_WINDOW_S = APPARENT_MODULUS_WINDOW_S;

/**
 * Resin modulus for the history plot, Pa: 0 before gel (liquid); CHILE: its modulus at T*; Prony: the
 * relaxation modulus reached after APPARENT_MODULUS_WINDOW_S of real time at the current T, α, Tg.
 */
export function apparentResinModulusPa(resin: ResinRelaxation, gelPoint: number, TK: number, alpha: number, tgK: number): number {
  if (!(alpha >= gelPoint)) return 0;
  const range = resin.unrelaxedPa - resin.relaxedPa;
  if (resin.model === 'chile') return resin.relaxedPa + range * chileGlassyFraction(resin.chile, TK, tgK);
  const xi = MODULUS_WINDOW_S * reducedTimeRate(resin.shift, TK, tgK, alpha);
  return resin.relaxedPa + range * normalisedRelaxation(resin.weights, resin.timesS, xi);
}

// --- One-dimensional form: the rule on its own, for the closed-form checks and the bench --------------------

export interface ScalarRelaxation {
  relaxedPa: number;
  termModuliPa: Float64Array;
  timesS: Float64Array;
  /** stress carried by each relaxing term, Pa */
  h: Float64Array;
  /** stress carried by the relaxed modulus, Pa */
  sigmaInfPa: number;
  e: Float64Array;
  g: Float64Array;
}

export function createScalarRelaxation(relaxedPa: number, termModuliPa: ArrayLike<number>, timesS: ArrayLike<number>): ScalarRelaxation {
  const n = termModuliPa.length;
  return {
    relaxedPa,
    termModuliPa: Float64Array.from(termModuliPa),
    timesS: Float64Array.from(timesS),
    h: new Float64Array(n),
    sigmaInfPa: 0,
    e: new Float64Array(n),
    g: new Float64Array(n),
  };
}

/** One recursive step with strain increment Δε over reduced-time increment Δξ; returns the stress, Pa. */
export function advanceScalarRelaxation(s: ScalarRelaxation, dXi: number, dEps: number): number {
  relaxationFactors(dXi, s.timesS, s.e, s.g);
  s.sigmaInfPa += s.relaxedPa * dEps;
  let sigma = s.sigmaInfPa;
  for (let i = 0; i < s.h.length; i++) {
    s.h[i] = s.e[i] * s.h[i] + s.termModuliPa[i] * s.g[i] * dEps;
    sigma += s.h[i];
  }
  return sigma;
}

/**
 * Direct hereditary integral σ(ξ_n) = Σ_k E(ξ_n − ξ_(k−½)) Δε_k for every n (midpoint rule in reduced time):
 * O(n²) work. The reference the recursive update is checked and benchmarked against. xi[0], eps[0] are the
 * start; out[n] receives σ at xi[n].
 */
export function directHereditaryStress(
  relaxedPa: number,
  termModuliPa: ArrayLike<number>,
  timesS: ArrayLike<number>,
  xi: Float64Array,
  eps: Float64Array,
  out: Float64Array,
): void {
  const m = termModuliPa.length;
  out[0] = 0;
  for (let n = 1; n < xi.length; n++) {
    let sigma = relaxedPa * (eps[n] - eps[0]);
    for (let k = 1; k <= n; k++) {
      const dEps = eps[k] - eps[k - 1];
      const age = xi[n] - 0.5 * (xi[k] + xi[k - 1]);
      for (let i = 0; i < m; i++) sigma += termModuliPa[i] * Math.exp(-age / timesS[i]) * dEps;
    }
    out[n] = sigma;
  }
}
