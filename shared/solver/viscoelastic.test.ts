import { describe, expect, it } from 'vitest';
import { expectClose } from './test-support/expect-close';
import {
  GAS_CONSTANT,
  advanceScalarRelaxation,
  apparentResinModulusPa,
  chileGlassyFraction,
  createScalarRelaxation,
  directHereditaryStress,
  log10ShiftFactor,
  reducedTimeIncrement,
  relaxationFactors,
  type ResinRelaxation,
  type ShiftSI,
} from './viscoelastic';

// Prony set of the checks: E∞ = 1 GPa, E1 = 2 GPa (τ 10 s), E2 = 4 GPa (τ 100 s).
const E_INF = 1e9;
const TERMS = [2e9, 4e9];
const TIMES = [10, 100];

function pronySet() {
  return createScalarRelaxation(E_INF, TERMS, TIMES);
}

/** Advance at constant strain rate from the current state; returns the final stress. */
function strainAtRate(s: ReturnType<typeof pronySet>, rate: number, durationS: number, dtS: number): number {
  let sigma = NaN;
  const n = Math.round(durationS / dtS);
  for (let k = 0; k < n; k++) sigma = advanceScalarRelaxation(s, dtS, rate * dtS);
  return sigma;
}

describe('recursive Prony update', () => {
  it('relaxes after a strain step as the closed form', () => {
    // Closed form σ(t) = ε0 (E∞ + Σ Eᵢ e^(−t/τᵢ)), ε0 = 1e-3; values by the closed form.
    const s = pronySet();
    const at0 = advanceScalarRelaxation(s, 0, 1e-3);
    expectClose(at0 / 1e6, 7.0, 1e-9);
    let t = 0;
    const sigmaAt = (target: number, dt: number) => {
      let sigma = NaN;
      while (t < target - 1e-9) {
        const step = Math.min(dt, target - t);
        sigma = advanceScalarRelaxation(s, step, 0);
        t += step;
      }
      return sigma;
    };
    // Tolerance: half a unit in the last digit the table prints.
    expectClose(sigmaAt(10, 0.7) / 1e6, 5.355109, 0, 5e-7);
    expectClose(sigmaAt(100, 13) / 1e6, 2.471609, 0, 5e-7);
    expectClose(sigmaAt(1000, 250) / 1e6, 1.000182, 0, 5e-7);
  });

  it.each([50, 5, 0.5])('matches the constant-rate closed form at 50 s with Δt = %s s (exact for any step)', (dt) => {
    // Closed form σ = ε̇ (E∞ t + Σ Eᵢ τᵢ (1 − e^(−t/τᵢ))), ε̇ = 1e-4/s: 22.725298 MPa at 50 s.
    // The update is exact for strain linear in reduced time, so the step size must not matter.
    const sigma = strainAtRate(pronySet(), 1e-4, 50, dt);
    expectClose(sigma / 1e6, 22.725298, 0, 5e-7);
  });

  it('matches the ramp-then-hold closed form', () => {
    // Ramp at 1e-4/s for 20 s, then hold: σ(100 s) = 5.258561 MPa (closed form).
    for (const [rampDt, holdDt] of [
      [20, 80],
      [1, 3.2],
      [0.25, 0.5],
    ]) {
      const s = pronySet();
      strainAtRate(s, 1e-4, 20, rampDt);
      const sigma = strainAtRate(s, 0, 80, holdDt);
      expectClose(sigma / 1e6, 5.258561, 0, 5e-7);
    }
  });

  it('agrees with the direct hereditary integral on a random smooth strain history', () => {
    // Recursive update (exact for piecewise-linear strain in ξ) against the O(n²) convolution
    // σ(ξ_n) = Σ E(ξ_n − ξ_(k−½)) Δε_k (midpoint rule): both converge to the same integral, so on 2000 steps of
    // a smooth history they must agree to second order in the step (Simo & Hughes 1998 (memory)).
    let seed = 12345;
    const random = () => {
      // mulberry32: a small seeded generator so the history is random but repeatable.
      seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const modes = Array.from({ length: 5 }, () => ({ a: (random() - 0.5) * 2e-3, w: 0.002 + random() * 0.05, p: random() * 6.28 }));
    const n = 2000;
    const dt = 0.25;
    const xi = new Float64Array(n + 1);
    const eps = new Float64Array(n + 1);
    for (let k = 0; k <= n; k++) {
      const t = k * dt;
      eps[k] = modes.reduce((s, m) => s + m.a * (Math.sin(m.w * t + m.p) - Math.sin(m.p)), 0);
      // A shift factor that wanders over two decades, as a temperature history would make it.
      if (k > 0) xi[k] = xi[k - 1] + reducedTimeIncrement(dt, 10 ** -Math.sin((k - 1) * dt * 0.01), 10 ** -Math.sin(k * dt * 0.01));
    }
    const direct = new Float64Array(n + 1);
    directHereditaryStress(E_INF, TERMS, TIMES, xi, eps, direct);
    const s = pronySet();
    let maxAbs = 0;
    let maxDiff = 0;
    for (let k = 1; k <= n; k++) {
      const sigma = advanceScalarRelaxation(s, xi[k] - xi[k - 1], eps[k] - eps[k - 1]);
      maxAbs = Math.max(maxAbs, Math.abs(direct[k]));
      maxDiff = Math.max(maxDiff, Math.abs(sigma - direct[k]));
    }
    expect(maxAbs).toBeGreaterThan(1e5);
    expect(maxDiff / maxAbs).toBeLessThan(1e-4);
  });

  it('uses a series for tiny x that joins the closed form', () => {
    // g = (1 − e^(−x))/x = −expm1(−x)/x, evaluated here with expm1 (accurate for small x) as the reference.
    const e = new Float64Array(1);
    const g = new Float64Array(1);
    for (const x of [1e-12, 1e-6, 9.99e-4, 1.001e-3, 0.5, 39, 41]) {
      relaxationFactors(x, Float64Array.of(1), e, g);
      expectClose(g[0], -Math.expm1(-x) / x, 1e-13);
      expectClose(e[0], Math.exp(-x), 1e-13, 1e-17);
    }
    // τ → ∞: no relaxation at all (the CHILE term).
    relaxationFactors(1e30, Float64Array.of(Infinity), e, g);
    expect([e[0], g[0]]).toEqual([1, 1]);
  });

  it('is elastic with one term of τ = ∞ (the CHILE path)', () => {
    // With τ → ∞ the update is σ = Σ E Δε whatever the history (hypoelastic, Johnston, Vaziri & Poursartip 2001 (memory)).
    const s = createScalarRelaxation(0, [3e9], [Infinity]);
    let eps = 0;
    let sigma = 0;
    for (const [dXi, dEps] of [
      [10, 1e-4],
      [1e6, -3e-4],
      [0, 2e-4],
      [1e12, 5e-5],
    ]) {
      eps += dEps;
      sigma = advanceScalarRelaxation(s, dXi, dEps);
    }
    expectClose(sigma, 3e9 * eps, 1e-12);
  });
});

describe('shift factor', () => {
  const shift: ShiftSI = { wlfC1: 17.44, wlfC2K: 51.6, offsetK: 0, arrheniusEJPerMol: 100_000, cureAlpha: null, cureLog10a: null };

  it('follows WLF above T_r = Tg + offset', () => {
    // WLF with the "universal" constants C1 = 17.44, C2 = 51.6 K (Williams, Landel & Ferry, JACS 77, 1955):
    // log₁₀ a at T − Tg = 10 K is −17.44·10/61.6 = −2.831169.
    expectClose(log10ShiftFactor(shift, 410, 400, 0.8), -2.831169, 1e-6);
    // The offset moves the reference: T_r = 400 + 10 K gives log₁₀ a = 0 at 410 K.
    expectClose(log10ShiftFactor({ ...shift, offsetK: 10 }, 410, 400, 0.8), 0, 0, 1e-15);
  });

  it('follows Arrhenius below T_r and is continuous there', () => {
    // log₁₀ a = E/(R ln 10)(1/T − 1/T_r): E 100 kJ/mol, T 380 K, T_r 400 K → 0.687280 (Arrhenius form).
    const expected = (100_000 / (GAS_CONSTANT * Math.LN10)) * (1 / 380 - 1 / 400);
    expectClose(expected, 0.68728, 1e-5);
    expectClose(log10ShiftFactor(shift, 380, 400, 0.8), expected, 1e-12);
    expect(Math.abs(log10ShiftFactor(shift, 400 - 1e-9, 400, 0.8) - log10ShiftFactor(shift, 400 + 1e-9, 400, 0.8))).toBeLessThan(1e-6);
  });

  it('adds the cure table by linear interpolation, flat beyond its ends', () => {
    // By definition of the card's optional cure table (shared/solver/README.md, "Resin state": a user table of log₁₀ a_α(α)
    // added to the shift); linear between its points and flat beyond them is our reading of a table (common practice, no
    // source). At T = T_r the WLF part is 0, so the result is the table alone: halfway from 0.6 to 0.8 → 1.
    const withTable: ShiftSI = { ...shift, cureAlpha: Float64Array.of(0.4, 0.8), cureLog10a: Float64Array.of(-2, 2) };
    expectClose(log10ShiftFactor(withTable, 400, 400, 0.7), 1, 1e-12);
    expectClose(log10ShiftFactor(withTable, 400, 400, 0.1), -2, 1e-12);
    expectClose(log10ShiftFactor(withTable, 400, 400, 0.95), 2, 1e-12);
  });

  it('stays finite far from T_r', () => {
    // By definition: log₁₀ a is clamped to ±MAX_LOG10_SHIFT (a solver rule, README), so reduced time stays finite
    // however far the state is from T_r; no outside source.
    const la = log10ShiftFactor({ ...shift, arrheniusEJPerMol: 2e6 }, 60, 500, 1);
    expect(Number.isFinite(la)).toBe(true);
    expect(Number.isFinite(reducedTimeIncrement(60, 10 ** -la, 10 ** -la))).toBe(true);
  });
});

describe('resin modulus for the history', () => {
  const resin: ResinRelaxation = {
    model: 'chile',
    unrelaxedPa: 3e9,
    relaxedPa: 0.1e9,
    weights: Float64Array.of(1),
    timesS: Float64Array.of(Infinity),
    shift: { wlfC1: 15, wlfC2K: 60, offsetK: 0, arrheniusEJPerMol: 250_000, cureAlpha: null, cureLog10a: null },
    chile: { glassyOffsetK: -40, rubberyOffsetK: 0 },
  };

  it('is piecewise linear in T* for CHILE and zero before gel', () => {
    // CHILE: glassy at T* ≤ −40 K, rubbery at T* ≥ 0, linear between (Johnston, Vaziri & Poursartip 2001 (memory)).
    expect(chileGlassyFraction(resin.chile, 300, 400)).toBe(1);
    expect(chileGlassyFraction(resin.chile, 400, 400)).toBe(0);
    expectClose(apparentResinModulusPa(resin, 0.5, 380, 0.8, 400), 0.1e9 + 0.5 * 2.9e9, 1e-12);
    expect(apparentResinModulusPa(resin, 0.5, 380, 0.3, 400)).toBe(0);
  });

  it('is glassy well below Tg and relaxed well above it for a Prony resin', () => {
    // By definition of the Prony form: far below T_r the shift factor is huge, nothing relaxes in
    // the 60 s window and E → E_u; far above, a ≪ 1 and E → E∞. The two temperatures are common practice for
    // "well below / above Tg" (no source).
    const prony: ResinRelaxation = { ...resin, model: 'prony', weights: Float64Array.of(0.5, 0.5), timesS: Float64Array.of(1e3, 1e6) };
    expectClose(apparentResinModulusPa(prony, 0.5, 300, 0.9, 450), 3e9, 1e-3);
    expectClose(apparentResinModulusPa(prony, 0.5, 500, 0.9, 400), 0.1e9, 1e-6);
  });
});
