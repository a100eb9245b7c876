import fc from 'fast-check';
import { Solver } from 'odex';
import { describe, expect, it } from 'vitest';
import {
  ALPHA_MAX, advanceCure, advanceCureBatch, createCureBatch, cureBatchSlopes, cureRate, diffusionFactor, GAS_CONSTANT, initialDegreeOfCure,
  prepareKinetics, type KineticsInput,
} from './kinetics';
import { expectClose } from './test-support/expect-close';

const C0 = 273.15;

// Published constants of Lee, Loos & Springer, J. Compos. Mater. 16 (1982), per minute.
const leeLoosSpringer: KineticsInput = {
  kinetics: {
    form: 'lee-loos-springer',
    a1PerMin: 2.101e9, a2PerMin: -2.014e9, a3PerMin: 1.96e5,
    e1JPerMol: 80.7e3, e2JPerMol: 77.8e3, e3JPerMol: 56.6e3, b: 0.47,
  },
};

/** March α along a temperature path with the temperature taken at each step's midpoint (second order). */
function march(k: ReturnType<typeof prepareKinetics>, alpha0: number, tempK: (tS: number) => number, t0S: number, t1S: number, dtS: number): number {
  let alpha = alpha0;
  const steps = Math.max(1, Math.round((t1S - t0S) / dtS));
  const h = (t1S - t0S) / steps;
  for (let i = 0; i < steps; i++) alpha = advanceCure(k, alpha, tempK(t0S + (i + 0.5) * h), h);
  return alpha;
}

describe('closed-form kinetics', () => {
  it('first order, k = 0.05, t = 20: α = 1 − e^(−kt) = 0.632121', () => {
    // closed form
    const k = prepareKinetics({ kinetics: { form: 'nth-order', aPerS: 0.05, eJPerMol: 0, n: 1 } });
    expectClose(advanceCure(k, 0, 300, 20), 0.632121, 0, 1e-6);
  });

  it('nth order n = 1.5, k = 0.05, t = 20: α = 1 − (1 + (n−1)kt)^(−1/(n−1)) = 0.555556', () => {
    // closed form
    const k = prepareKinetics({ kinetics: { form: 'nth-order', aPerS: 0.05, eJPerMol: 0, n: 1.5 } });
    expectClose(advanceCure(k, 0, 300, 20), 0.555556, 0, 1e-6);
  });

  it('autocatalytic m = n = 1, α0 = 0.01, k = 0.05, t = 20: logistic α = 0.026724', () => {
    // closed form, logistic α/(1−α) = α0/(1−α0)·e^(kt)
    const k = prepareKinetics({
      kinetics: { form: 'kamal-sourour', a1PerS: 0, e1JPerMol: 0, a2PerS: 0.05, e2JPerMol: 0, m: 1, n: 1 },
    });
    expectClose(advanceCure(k, 0.01, 300, 20), 0.026724, 0, 1e-6);
  });

  it('a pure autocatalytic law starts from the 1e-6 seed', () => {
    // a pure α^m law needs a small seed α0 (1e-6): shared/solver/README.md, "Cure kinetics". One call over the
    // whole 300 s (α 1e-6 → 0.77), so at a sub-step tolerance of 1e-8, not the default sized for the solver's
    // short steps (shared/solver/README.md, "Time step").
    const k = prepareKinetics(
      { kinetics: { form: 'kamal-sourour', a1PerS: 0, e1JPerMol: 0, a2PerS: 0.05, e2JPerMol: 0, m: 1, n: 1 } },
      { tolerance: 1e-8 },
    );
    const alpha0 = initialDegreeOfCure(k);
    expect(alpha0).toBe(1e-6);
    expect(cureRate(k, 0, 300)).toBeGreaterThan(0);
    // seeded logistic over 300 s: α/(1−α) = α0/(1−α0)·e^15 (closed form)
    const odds = (alpha0 / (1 - alpha0)) * Math.exp(0.05 * 300);
    expectClose(advanceCure(k, alpha0, 300, 300), odds / (1 + odds), 1e-6);
    // forms with an n-th order term start from zero
    expect(initialDegreeOfCure(prepareKinetics(leeLoosSpringer))).toBe(0);
  });
});

describe('Lee–Loos–Springer', () => {
  const k = prepareKinetics(leeLoosSpringer);

  it('isothermal 177 °C from α = 0 gives 0.3900, 0.5320, 0.8379, 0.9669, 0.9986 at 5, 10, 30, 60, 120 min', () => {
    // computed with SciPy LSODA, rtol 1e-10, from the constants of Lee, Loos & Springer 1982; values rounded to 4 decimals
    const times = [5, 10, 30, 60, 120];
    const expected = [0.39, 0.532, 0.8379, 0.9669, 0.9986];
    let alpha = 0;
    let t = 0;
    times.forEach((tMin, i) => {
      alpha = advanceCure(k, alpha, 177 + C0, (tMin - t) * 60);
      t = tMin;
      expectClose(alpha, expected[i], 0, 6e-5);
    });
    // one long call lands on the switch itself and gives the same end value
    expectClose(advanceCure(k, 0, 177 + C0, 120 * 60), 0.9986, 0, 6e-5);
  });

  it('two-dwell cycle (25 °C, 2.5 °C/min → 116 °C, 60 min, 2.5 °C/min → 177 °C, 120 min) matches the reference', () => {
    // computed with SciPy LSODA, rtol 1e-10, from the constants of Lee, Loos & Springer 1982; a thin part follows the air
    const airC = (tMin: number) =>
      tMin <= 36.4 ? 25 + 2.5 * tMin : tMin <= 96.4 ? 116 : tMin <= 120.8 ? 116 + 2.5 * (tMin - 96.4) : 177;
    const tempK = (tS: number) => airC(tS / 60) + C0;
    const marks = [36.4, 96.4, 120.8, 150.8, 240.8];
    const expected = [0.0685, 0.2825, 0.5607, 0.9104, 0.9992];
    let alpha = 0;
    let t = 0;
    marks.forEach((tMin, i) => {
      alpha = march(k, alpha, tempK, t * 60, tMin * 60, 5);
      t = tMin;
      expectClose(alpha, expected[i], 0, 6e-5);
    });
  });

  it('above α = 0.3 the half-life at 177 °C is ln 2 / K3 = 13.08 min', () => {
    // closed form 1 − α = (1 − α0) e^(−K3 t)
    const alpha0 = 0.5;
    const alpha = advanceCure(k, alpha0, 177 + C0, 13.08 * 60);
    expectClose((1 - alpha) / (1 - alpha0), 0.5, 2e-4);
  });

  it('lands on the α = 0.3 switch: low branch to the switch, then the closed-form upper branch', () => {
    // Time to the switch t* = ∫0^0.3 dα / ((K1 + K2α)(1−α)(B−α)) by Simpson's rule on the published form,
    // then 1 − α = 0.7 e^(−K3 (t − t*)) (closed form of the upper branch; Lee, Loos & Springer 1982).
    const T = 116 + C0;
    const K = (aPerMin: number, e: number) => (aPerMin / 60) * Math.exp(-e / (GAS_CONSTANT * T));
    const K1 = K(2.101e9, 80.7e3), K2 = K(-2.014e9, 77.8e3), K3 = K(1.96e5, 56.6e3);
    const inv = (a: number) => 1 / ((K1 + K2 * a) * (1 - a) * (0.47 - a));
    const n = 2000;
    let sum = inv(0) + inv(0.3);
    for (let i = 1; i < n; i++) sum += (i % 2 ? 4 : 2) * inv((0.3 * i) / n);
    const tSwitch = (sum * 0.3) / n / 3;
    // the rate jumps by about ×3 at 116 °C (Lee, Loos & Springer 1982 constants)
    expect(cureRate(k, 0.3, T) / ((K1 + 0.3 * K2) * 0.7 * 0.17)).toBeGreaterThan(2.5);
    const after = 1800;
    const exact = 1 - 0.7 * Math.exp(-K3 * after);
    // one call across the switch and 30 min beyond, so at a sub-step tolerance of 1e-8 (as in the seed check)
    expectClose(advanceCure(prepareKinetics(leeLoosSpringer, { tolerance: 1e-8 }), 0, T, tSwitch + after), exact, 0, 1e-7);
    expectClose(advanceCure(k, 0, T, tSwitch * 0.999), 0.3, 0, 2e-3);
    expect(advanceCure(k, 0, T, tSwitch * 0.999)).toBeLessThan(0.3);
  });
});

describe('cross-check against an independent extrapolation integrator (odex: Gragg–Bulirsch–Stoer)', () => {
  // The reference right-hand sides are written out again here from the published forms, not taken from kinetics.ts.
  const R = 8.314;
  const ramp = (tS: number) => 20 + C0 + Math.min(tS * (3 / 60), 160); // 3 °C/min from 20 °C to 180 °C, then hold
  const fd = (a: number, T: number) => 1 / (1 + Math.exp(30 * (a - (-1.5 + 0.0055 * T))));
  const cases: { name: string; card: KineticsInput; rhs: (a: number, T: number) => number }[] = [
    {
      name: 'nth order n = 1.4',
      card: { kinetics: { form: 'nth-order', aPerS: 4e5, eJPerMol: 70e3, n: 1.4 } },
      rhs: (a, T) => 4e5 * Math.exp(-70e3 / (R * T)) * Math.pow(Math.max(1 - a, 0), 1.4),
    },
    {
      name: 'Kamal–Sourour m = 0.6, n = 1.6',
      card: { kinetics: { form: 'kamal-sourour', a1PerS: 2e4, e1JPerMol: 68e3, a2PerS: 8e5, e2JPerMol: 66e3, m: 0.6, n: 1.6 } },
      rhs: (a, T) =>
        (2e4 * Math.exp(-68e3 / (R * T)) + 8e5 * Math.exp(-66e3 / (R * T)) * Math.pow(Math.max(a, 1e-6), 0.6)) *
        Math.pow(Math.max(1 - a, 0), 1.6),
    },
    {
      name: 'Kamal–Sourour with the diffusion factor',
      card: {
        kinetics: { form: 'kamal-sourour', a1PerS: 2e4, e1JPerMol: 68e3, a2PerS: 8e5, e2JPerMol: 66e3, m: 0.6, n: 1.6 },
        diffusion: { c: 30, alphaC0: -1.5, alphaCTPerK: 0.0055 },
      },
      rhs: (a, T) =>
        (2e4 * Math.exp(-68e3 / (R * T)) + 8e5 * Math.exp(-66e3 / (R * T)) * Math.pow(Math.max(a, 1e-6), 0.6)) *
        Math.pow(Math.max(1 - a, 0), 1.6) * fd(a, T),
    },
    {
      name: 'Lee–Loos–Springer',
      card: leeLoosSpringer,
      rhs: (a, T) => {
        const K = (A: number, E: number) => (A / 60) * Math.exp(-E / (R * T));
        return a < 0.3
          ? Math.max(0, (K(2.101e9, 80.7e3) + K(-2.014e9, 77.8e3) * a) * (1 - a) * (0.47 - a))
          : K(1.96e5, 56.6e3) * (1 - a);
      },
    },
    {
      name: 'Lee–Loos–Springer with the diffusion factor',
      card: { ...leeLoosSpringer, diffusion: { c: 30, alphaC0: -1.5, alphaCTPerK: 0.0055 } },
      rhs: (a, T) => {
        const K = (A: number, E: number) => (A / 60) * Math.exp(-E / (R * T));
        const r = a < 0.3
          ? Math.max(0, (K(2.101e9, 80.7e3) + K(-2.014e9, 77.8e3) * a) * (1 - a) * (0.47 - a))
          : K(1.96e5, 56.6e3) * (1 - a);
        return r * fd(a, T);
      },
    },
  ];

  for (const c of cases) {
    it(`${c.name}: 3 °C/min ramp to 180 °C and hold agrees at 20, 40, 60, 80, 120 min`, () => {
      const k = prepareKinetics(c.card);
      const solver = new Solver(1);
      solver.absoluteTolerance = 1e-11;
      solver.relativeTolerance = 1e-11;
      solver.maxSteps = 100_000;
      let alphaRef = 0;
      let alpha = 0;
      let t = 0;
      for (const tMin of [20, 40, 60, 80, 120]) {
        // small reference pieces keep odex's extrapolation honest across the rate jump at α = 0.3
        for (let s = t * 60; s < tMin * 60; s += 30) {
          alphaRef = solver.solve((x, y) => [c.rhs(y[0], ramp(x))], s, [alphaRef], s + 30).y[0];
        }
        alpha = march(k, alpha, ramp, t * 60, tMin * 60, 10);
        t = tMin;
        expectClose(alpha, alphaRef, 0, 2e-5);
      }
      expect(alpha).toBeGreaterThan(0.5);
    });
  }
});

describe('rate and step guarantees', () => {
  const cards: KineticsInput[] = [
    leeLoosSpringer,
    { kinetics: { form: 'nth-order', aPerS: 4e5, eJPerMol: 70e3, n: 0.7 } },
    { kinetics: { form: 'kamal-sourour', a1PerS: 0, e1JPerMol: 68e3, a2PerS: 8e5, e2JPerMol: 66e3, m: 0.6, n: 1.6 } },
    { ...leeLoosSpringer, diffusion: { c: 30, alphaC0: -1.5, alphaCTPerK: 0.0055 } },
  ];

  it('the rate is never negative and α never decreases nor reaches 1 (random states, common practice)', () => {
    // α stays in [0, 1); the rate is never negative
    const prepared = cards.map((c) => prepareKinetics(c));
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: prepared.length - 1 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 150, max: 700, noNaN: true }),
        fc.double({ min: 0, max: 1e5, noNaN: true }),
        (i, alpha, T, dt) => {
          const k = prepared[i];
          const r = cureRate(k, alpha, T);
          const next = advanceCure(k, alpha, T, dt);
          return Number.isFinite(r) && r >= 0 && next >= Math.min(alpha, ALPHA_MAX) && next <= ALPHA_MAX;
        },
      ),
      { numRuns: 400 },
    );
  });

  it('the batch integrator gives advanceCure to the last bit, node by node (consistency, no outside source)', () => {
    const prepared = cards.map((c) => prepareKinetics(c));
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: prepared.length - 1 }),
        fc.array(fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 300, max: 520, noNaN: true })), { minLength: 1, maxLength: 12 }),
        fc.double({ min: 1e-3, max: 600, noNaN: true }),
        (i, states, dt) => {
          const k = prepared[i];
          const n = states.length;
          const alpha = Float64Array.from(states, (s) => s[0]);
          const T = Float64Array.from(states, (s) => s[1]);
          const out = new Float64Array(n);
          // every other node listed, in reverse, so the listing itself is exercised
          const nodes = Int32Array.from({ length: Math.ceil(n / 2) }, (_, m) => n - 1 - 2 * m);
          advanceCureBatch(k, alpha, T, dt, out, nodes, nodes.length, createCureBatch(n));
          return Array.from(nodes).every((j) => Object.is(out[j], advanceCure(k, alpha[j], T[j], dt)));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('the batch slope ∂α/∂T of a step (cureBatchSlopes) matches a central difference of advanceCure within 1 %', () => {
    // derivative check by central differences (common practice, no source); steps the size the time loop
    // takes (Δα ≲ 0.005), where the slope's trapezoidal rule is meant to hold
    const demo: KineticsInput = {
      kinetics: { form: 'kamal-sourour', a1PerS: 4.4e4, e1JPerMol: 75e3, a2PerS: 8e3, e2JPerMol: 60e3, m: 0.5, n: 1.5 },
      diffusion: { c: 30, alphaC0: -1.3, alphaCTPerK: 0.005 },
    };
    let checked = 0;
    for (const card of [...cards, demo]) {
      const k = prepareKinetics(card);
      for (const [a0, T] of [[0.05, 400], [0.2, 420], [0.45, 440], [0.7, 450], [0.9, 460]]) {
        const dt = 0.004 / cureRate(k, a0, T);
        const out = new Float64Array(1);
        const slope = new Float64Array(1);
        const batch = createCureBatch(1);
        advanceCureBatch(k, Float64Array.of(a0), Float64Array.of(T), dt, out, Int32Array.of(0), 1, batch);
        cureBatchSlopes(k, batch, Int32Array.of(0), 1, dt, slope);
        if (Number.isNaN(slope[0])) continue; // sub-stepped or across the switch: the caller integrates again
        const e = 1e-3;
        const central = (advanceCure(k, a0, T + e, dt) - advanceCure(k, a0, T - e, dt)) / (2 * e);
        expectClose(slope[0], central, 0.01, 1e-12);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(15);
  });

  it('the diffusion factor is one half where α equals α_C0 + α_CT·T', () => {
    // definition of the Chern & Poehlein (1987) factor
    const k = prepareKinetics({ ...leeLoosSpringer, diffusion: { c: 30, alphaC0: -1.5, alphaCTPerK: 0.0055 } });
    expectClose(diffusionFactor(k, -1.5 + 0.0055 * 430, 430), 0.5, 1e-12);
  });

  it('bad constants are refused with the field and the allowed range', () => {
    expect(() => prepareKinetics({ kinetics: { form: 'nth-order', aPerS: 1, eJPerMol: 1e4, n: -1 } })).toThrow(/kinetics\.n: -1 .*allowed ≥ 0/);
    expect(() => prepareKinetics({ kinetics: { ...leeLoosSpringer.kinetics, b: 0.2 } as KineticsInput['kinetics'] })).toThrow(
      /kinetics\.b: 0\.2 .*allowed > 0\.3/,
    );
    const k = prepareKinetics(leeLoosSpringer);
    expect(() => advanceCure(k, 0.1, Number.NaN, 1)).toThrow(/temperature NaN K/);
    expect(() => advanceCure(k, 0.1, 400, -1)).toThrow(/time step -1 s/);
  });
});
