import { describe, expect, it } from 'vitest';
import {
  createHeatColumn, heatStep, prepareHeatStep, solveHeatStep, storedHeat, thomasSolve, transverseConductivity,
  volumetricHeatCapacity, type BoundaryHeat, type HeatColumn,
} from './heat-transfer';
import { expectClose } from './test-support/expect-close';

const PINNED = 1e12; // a film coefficient this large holds the face at the air temperature

/** March a column from a uniform start with the given air history on both faces; returns the final field. */
function run(col: HeatColumn, T0: number, airK: (tS: number) => number, endS: number, dtS: number, theta: number,
  onStep?: (T: Float64Array, tS: number, heatIn: number) => void): Float64Array {
  let T = new Float64Array(col.nodes).fill(T0);
  let next = new Float64Array(col.nodes);
  const heat: BoundaryHeat = { bottomJPerM2: 0, topJPerM2: 0 };
  const steps = Math.round(endS / dtS);
  for (let s = 0; s < steps; s++) {
    const t0 = s * dtS;
    const t1 = (s + 1) * dtS;
    const q = heatStep(col, T, next, dtS, theta, airK(t0), airK(t1), airK(t0), airK(t1), null, heat);
    [T, next] = [next, T];
    onStep?.(T, t1, q);
  }
  return T;
}

describe('ply thermal properties', () => {
  it('transverse conductivity: equal constituents give the constituent, and a hand-evaluated case', () => {
    // Halpin–Tsai-type form (Halpin & Kardos 1976, from memory); 0.2·(10.2 + 9.8·0.6)/(10.2 − 9.8·0.6) evaluated by hand
    expectClose(transverseConductivity(0.3, 0.3, 0.6), 0.3, 1e-12);
    expectClose(transverseConductivity(10, 0.2, 0.6), 0.744444, 1e-6);
  });

  it('volumetric heat capacity is the volume average of ρc', () => {
    // rule of mixtures on heat capacity per unit volume: 0.6·1800·800 + 0.4·1250·1200 by hand
    expectClose(volumetricHeatCapacity(1800, 800, 1250, 1200, 0.6), 1.464e6, 1e-12);
  });
});

/** An aluminium plate under a laminate: the column the coupled step solves (numbers invented for the tests). */
const toolAndLaminate = [
  { thicknessM: 0.01, intervals: 6, conductivityWPerMK: 167, volumetricHeatCapacity: 2.43e6 },
  { thicknessM: 0.004, intervals: 16, conductivityWPerMK: 0.6, volumetricHeatCapacity: 1.6e6 },
];

describe('prepared step, several sources', () => {
  it('prepare once and solve per source gives what heatStep gives, to the last bit, also when the step is reused', () => {
    // consistency of the split (no outside source): the coupled step solves one step with several sources
    const a = createHeatColumn(toolAndLaminate, 60, 50);
    const b = createHeatColumn(toolAndLaminate, 60, 50);
    const n = a.nodes;
    const TOld = Float64Array.from({ length: n }, (_, i) => 350 + 0.3 * i);
    const source = new Float64Array(n);
    const viaStep = new Float64Array(n);
    const viaSplit = new Float64Array(n);
    const h1: BoundaryHeat = { bottomJPerM2: 0, topJPerM2: 0 };
    const h2: BoundaryHeat = { bottomJPerM2: 0, topJPerM2: 0 };
    for (const [dt, air] of [[30, 360], [30, 361], [12.5, 362]]) {
      prepareHeatStep(b, TOld, dt, 0.5, air - 1, air, air - 1, air);
      for (const q of [0, 800, 1900]) {
        for (let i = 6; i < n; i++) source[i] = q * (1 + 0.1 * i);
        const qa = heatStep(a, TOld, viaStep, dt, 0.5, air - 1, air, air - 1, air, source, h1);
        const qb = solveHeatStep(b, TOld, viaSplit, source, h2);
        expect(Array.from(viaSplit)).toEqual(Array.from(viaStep));
        expect([qb, h2.bottomJPerM2, h2.topJPerM2]).toEqual([qa, h1.bottomJPerM2, h1.topJPerM2]);
      }
    }
  });
});

describe('source linear in the new temperature', () => {
  it('solves the step whose source, evaluated at the temperatures it returns, is the given affine source', () => {
    // consistency (no outside source): with s_i(T) = a_i + b_i·T_i the result must be the plain solve with the
    // source a_i + b_i·TNew_i fixed, and the boundary heat must be that solve's
    const col = createHeatColumn(toolAndLaminate, 60, 50);
    const n = col.nodes;
    const TOld = Float64Array.from({ length: n }, (_, i) => 400 + 0.2 * i);
    const a = Float64Array.from({ length: n }, (_, i) => (i >= 6 ? 900 + 40 * i : 0));
    const b = Float64Array.from({ length: n }, (_, i) => (i >= 6 ? 0.3 * col.capacity[i] * (1 + 0.01 * i) : 0));
    const linear = new Float64Array(n);
    const fixed = new Float64Array(n);
    const source = new Float64Array(n);
    const h1: BoundaryHeat = { bottomJPerM2: 0, topJPerM2: 0 };
    const h2: BoundaryHeat = { bottomJPerM2: 0, topJPerM2: 0 };
    prepareHeatStep(col, TOld, 40, 0.5, 420, 425, 420, 425);
    solveHeatStep(col, TOld, linear, a, h1, b);
    for (let i = 0; i < n; i++) source[i] = a[i] + b[i] * linear[i];
    solveHeatStep(col, TOld, fixed, source, h2);
    for (let i = 0; i < n; i++) expectClose(linear[i], fixed[i], 1e-13);
    expectClose(h1.bottomJPerM2 + h1.topJPerM2, h2.bottomJPerM2 + h2.topJPerM2, 1e-9);
    // the temperature-dependent part mattered: without it the result is another one
    solveHeatStep(col, TOld, fixed, a, h2);
    expect(Math.abs(linear[n - 1] - fixed[n - 1])).toBeGreaterThan(0.01);
  });
});

describe('Thomas tridiagonal solve', () => {
  it('solves a small system exactly', () => {
    // [2 −1 0; −1 2 −1; 0 −1 2] x = [1 0 1] has x = [1 1 1] (by hand)
    const x = new Float64Array(3);
    thomasSolve(new Float64Array([0, -1, -1]), new Float64Array([2, 2, 2]), new Float64Array([-1, -1, 0]), new Float64Array([1, 0, 1]), x, 3, new Float64Array(3));
    expect(Array.from(x).map((v) => Number(v.toFixed(12)))).toEqual([1, 1, 1]);
  });
});

describe('slab with both faces stepped (Carslaw & Jaeger, Conduction of Heat in Solids, 1959, §3.3)', () => {
  // slab −l..l, κ = k/ρc; centre θ = (T − T0)/(T1 − T0) against Fo = κt/l² from the series solution
  const l = 0.005;
  const k = 0.5;
  const rhoC = 1.5e6;
  const kappa = k / rhoC;
  const fo = [0.1, 0.2, 0.5, 1.0];
  const series = [0.050695, 0.227688, 0.629223, 0.892023];

  function centreErrors(intervals: number): number[] {
    const col = createHeatColumn([{ thicknessM: 2 * l, intervals, conductivityWPerMK: k, volumetricHeatCapacity: rhoC }], PINNED, PINNED);
    const dt = (1e-4 * l * l) / kappa; // Fo step 1e-4, backward Euler (L-stable for the step at t = 0)
    const errors: number[] = [];
    let i = 0;
    run(col, 0, () => 1, (fo[fo.length - 1] * l * l) / kappa + dt / 2, dt, 1, (T, t) => {
      if (i < fo.length && Math.abs((t * kappa) / (l * l) - fo[i]) < 1e-9) {
        errors.push(T[intervals / 2] - series[i]);
        i++;
      }
    });
    return errors;
  }

  it('centre θ at Fo 0.1, 0.2, 0.5, 1.0 converges to 0.050695, 0.227688, 0.629223, 0.892023 under refinement', () => {
    const coarse = centreErrors(8);
    const medium = centreErrors(16);
    const fine = centreErrors(32);
    expect(fine.length).toBe(4);
    for (let j = 0; j < 4; j++) {
      // the fine mesh sits on the series solution…
      expect(Math.abs(fine[j])).toBeLessThan(2e-3);
      // …and the error shrinks with each halving of the node spacing
      expect(Math.abs(medium[j])).toBeLessThan(Math.abs(coarse[j]));
      expect(Math.abs(fine[j])).toBeLessThan(Math.abs(medium[j]));
    }
  });
});

describe('slab with both faces ramped at K (Carslaw & Jaeger 1959)', () => {
  it('centre lag settles to K l² / (2κ)', () => {
    const l = 0.004;
    const k = 0.45;
    const rhoC = 1.6e6;
    const kappa = k / rhoC;
    const K = 5 / 60; // 5 °C/min
    const col = createHeatColumn([{ thicknessM: 2 * l, intervals: 40, conductivityWPerMK: k, volumetricHeatCapacity: rhoC }], PINNED, PINNED);
    const end = (4 * l * l) / kappa; // Fo = 4: transients below e^(−π²) of their start
    const T = run(col, 300, (t) => 300 + K * t, end, 0.5, 1);
    const lag = 300 + K * end - T[20];
    expectClose(lag, (K * l * l) / (2 * kappa), 2e-3);
  });
});

describe('time-step order and conservation', () => {
  const col = createHeatColumn([{ thicknessM: 0.01, intervals: 20, conductivityWPerMK: 0.5, volumetricHeatCapacity: 1.5e6 }], 150, 150);
  // Air starts with zero slope, compatible with the uniform start: Crank–Nicolson damps the stiffest modes
  // hardly at all (amplification → −1), so an incompatible start would hide its order behind a transient.
  const air = (t: number) => 300 + 30 * (1 - Math.cos((Math.PI * t) / 1200));
  const centreAt = (dt: number, theta: number) => run(col, 300, air, 1200, dt, theta)[10];

  it('halving dt divides the error by 2 for backward Euler and by 4 for Crank–Nicolson', () => {
    // expected orders 1 and 2 of the θ-scheme (any numerical analysis text; common practice, no source)
    for (const [theta, ratio] of [[1, 2], [0.5, 4]] as const) {
      const ref = centreAt(0.9375, theta);
      const e1 = Math.abs(centreAt(60, theta) - ref);
      const e2 = Math.abs(centreAt(30, theta) - ref);
      const e3 = Math.abs(centreAt(15, theta) - ref);
      expectClose(e1 / e2, ratio, 0.15);
      expectClose(e2 / e3, ratio, 0.15);
    }
  });

  it('stored heat change equals the heat in through the faces', () => {
    // conservation of energy in the discrete balance (first law)
    for (const theta of [0.5, 1]) {
      let heatIn = 0;
      const T = run(col, 300, air, 1200, 20, theta, (_T, _t, q) => {
        heatIn += q;
      });
      const stored = storedHeat(col, T) - storedHeat(col, new Float64Array(col.nodes).fill(300));
      expect(heatIn).toBeGreaterThan(1e4);
      expectClose(stored, heatIn, 1e-10);
    }
  });

  it('a tool plate below the laminate shares one column with perfect contact', () => {
    // Two layers in series at steady state carry the same flux: ΔT across each is proportional to t/k
    // (Fourier's law, series resistances; common practice, no source)
    const two = createHeatColumn(
      [
        { thicknessM: 0.01, intervals: 5, conductivityWPerMK: 20, volumetricHeatCapacity: 3.5e6 },
        { thicknessM: 0.004, intervals: 8, conductivityWPerMK: 0.5, volumetricHeatCapacity: 1.5e6 },
      ],
      PINNED, PINNED,
    );
    let T = new Float64Array(two.nodes).fill(300);
    let next = new Float64Array(two.nodes);
    const heat: BoundaryHeat = { bottomJPerM2: 0, topJPerM2: 0 };
    for (let s = 0; s < 4000; s++) {
      heatStep(two, T, next, 5, 1, 400, 400, 300, 300, null, heat);
      [T, next] = [next, T];
    }
    const dropTool = T[0] - T[5];
    const dropLaminate = T[5] - T[13];
    expectClose(dropTool / dropLaminate, 0.01 / 20 / (0.004 / 0.5), 1e-6);
    // (pinned faces: the face flux is h × a difference near rounding, so compare loosely)
    expectClose(-heat.topJPerM2, heat.bottomJPerM2, 1e-4);
  });
});
