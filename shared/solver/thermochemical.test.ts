import { describe, expect, it } from 'vitest';
import { advanceCure, cureRate } from './kinetics';
import { expectClose } from './test-support/expect-close';
import {
  adiabaticTemperatureRiseK, advanceThermochemical, createThermochemical, maxCureRate,
  type ThermochemicalParams, type ThermochemicalState,
} from './thermochemical';

const C0 = 273.15;

// Test material: Lee–Loos–Springer kinetics (J. Compos. Mater. 16, 1982, constants per minute, H_R 473.6 kJ/kg);
// every other number is invented for these tests.
function study(plies: number, overrides: Partial<ThermochemicalParams> = {}): ThermochemicalParams {
  return {
    resin: {
      name: 'test resin', provenance: { source: 'invented for tests' },
      kinetics: { form: 'lee-loos-springer', a1PerMin: 2.101e9, a2PerMin: -2.014e9, a3PerMin: 1.96e5, e1JPerMol: 80.7e3, e2JPerMol: 77.8e3, e3JPerMol: 56.6e3, b: 0.47 },
      heatOfReactionKJPerKg: 473.6, densityKgM3: 1260, specificHeatJPerKgK: 1250, conductivityWPerMK: 0.2,
      glassTransition: { tg0C: 0, tgInfC: 210, lambda: 0.5 }, gelPoint: 0.4,
      modulus: {
        model: 'prony', unrelaxedGPa: 3.5, relaxedGPa: 0.5, poisson: 0.36, prony: { weights: [1], timesS: [100] },
        shift: { wlfC1: 15, wlfC2K: 60, offsetC: 0, arrheniusEJPerMol: 2e5 }, chile: { glassyOffsetC: -40, rubberyOffsetC: 0 },
      },
      cteMicroPerK: 55, totalShrinkagePct: 4,
    },
    fibre: {
      name: 'test fibre', provenance: { source: 'invented for tests' }, e1GPa: 230, e2GPa: 15, g12GPa: 24, nu12: 0.27,
      cte1MicroPerK: -0.5, cte2MicroPerK: 8, densityKgM3: 1790, specificHeatJPerKgK: 760,
      conductivityAxialWPerMK: 9, conductivityTransverseWPerMK: 2.4,
    },
    fibreVolumeFraction: 0.6,
    layup: { plies: Array.from({ length: plies }, (_, i) => ({ angleDeg: [0, 90][i % 2], thicknessMm: 0.25 })) },
    tool: { kind: 'none' },
    heatTransfer: { bagSideWPerM2K: 60, toolSideWPerM2K: 60 },
    mesh: { nodesPerPly: 2 },
    ...overrides,
  };
}

const aluminium: ThermochemicalParams['tool'] = {
  kind: 'plate', name: 'aluminium', thicknessMm: 10, densityKgM3: 2700, specificHeatJPerKgK: 900, conductivityWPerMK: 167, cteMicroPerK: 23.6,
};

/** Drive a column along an air history with an adaptive step like the time loop's: Δα ≤ 0.005, air ≤ 1 K, ≤ 60 s. */
function cure(s: ThermochemicalState, airK: (tS: number) => number, endS: number, onStep?: (s: ThermochemicalState) => void): number {
  let steps = 0;
  while (s.timeS < endS - 1e-9) {
    const rate = maxCureRate(s);
    let dt = Math.min(60, endS - s.timeS, rate > 0 ? 0.005 / rate : 60);
    const slope = Math.abs(airK(s.timeS + 1) - airK(s.timeS));
    if (slope > 0) dt = Math.min(dt, 1 / slope);
    const t1 = s.timeS + dt;
    advanceThermochemical(s, dt, airK(t1), airK(t1));
    steps++;
    onStep?.(s);
  }
  return steps;
}

/** Ramp from 20 °C at `rate` °C/min to 177 °C, hold to `endMin`. */
const rampHold = (ratePerMin: number) => (tS: number) => Math.min(20 + (ratePerMin * tS) / 60, 177) + C0;

describe('mesh of the coupled column', () => {
  it('puts nodes on every ply face, nodesPerPly intervals per ply, and the tool plate below z = 0', () => {
    const s = createThermochemical(study(4, { tool: aluminium, mesh: { nodesPerPly: 3 } }), { initialK: 293.15 });
    expect(s.zM.length).toBe(4 * 3 + 1);
    expect(s.alpha.length).toBe(s.zM.length);
    expect(s.TK.length).toBe(s.zM.length);
    expect(Array.from(s.plyPointNode)).toEqual([0, 3, 3, 6, 6, 9, 9, 12]);
    expectClose(s.plyPointZM[7], 0.001, 1e-12);
    expectClose(s.zM[s.zM.length - 1], 0.001, 1e-12);
    expect(s.allZM[0]).toBeCloseTo(-0.01, 12);
    expect(Array.from(s.nodePly)).toEqual([0, 0, 0, 1, 1, 1, 2, 2, 2, 3, 3, 3, 3]);
  });
});

describe('adiabatic temperature rise', () => {
  it('ΔT_ad = (1 − V_f) ρ_r H_R / (ρc)_laminate, evaluated by hand for the test card', () => {
    // closed form, by hand: 0.4·1260·473600 / (0.6·1790·760 + 0.4·1260·1250) = 238694.4 / 1446240
    expectClose(adiabaticTemperatureRiseK(study(1)), 238694.4 / 1446240 * 1000, 1e-9);
  });

  it('an insulated laminate heats by ΔT_ad × Δα (energy conservation)', () => {
    // first law with no heat exchange: (ρc) ΔT = (1 − V_f) ρ_r H_R Δα (closed form)
    const s = createThermochemical(study(8, { heatTransfer: { bagSideWPerM2K: 0, toolSideWPerM2K: 0 } }), { initialK: 150 + C0 });
    cure(s, () => 150 + C0, 3 * 3600);
    const dAlpha = s.alpha[4];
    expect(dAlpha).toBeGreaterThan(0.95);
    expectClose(s.TK[4] - (150 + C0), adiabaticTemperatureRiseK(study(1)) * dAlpha, 1e-6);
  });
});

describe('energy bookkeeping', () => {
  it('closes within 0.5 % on a 25 mm laminate on a tool with a strong exotherm', () => {
    // first law: heat in through the faces + reaction heat = change of stored heat, to < 0.5 %
    const s = createThermochemical(study(100, { tool: aluminium }), { initialK: 20 + C0 });
    const air = (tS: number) => (tS < 300 * 60 ? rampHold(3)(tS) : Math.max(177 + C0 - (3 * (tS - 300 * 60)) / 60, 60 + C0));
    cure(s, air, 340 * 60);
    const e = s.energy;
    expect(e.reactionJPerM2).toBeGreaterThan(0.25 * e.grossBoundaryJPerM2);
    expect(e.relativeError).toBeLessThan(0.005);
    // the same balance from the three totals directly
    expectClose(e.storedChangeJPerM2, e.bagInJPerM2 + e.toolInJPerM2 + e.reactionJPerM2, 0, 0.005 * (e.grossBoundaryJPerM2 + e.reactionJPerM2));
    // full cure everywhere releases ρ_r(1 − V_f)H_R × thickness (less what the initial α already held)
    expectClose(e.reactionJPerM2, 0.4 * 1260 * 473.6e3 * 0.025, 0.01);
  });
});

describe('thick against thin (common practice, no source)', () => {
  function peakOvershoot(plies: number): number {
    const s = createThermochemical(study(plies), { initialK: 20 + C0 });
    const air = rampHold(5);
    let worst = -Infinity;
    cure(s, air, 150 * 60, (st) => {
      for (let j = 0; j < st.TK.length; j++) worst = Math.max(worst, st.TK[j] - (177 + C0));
    });
    return worst;
  }

  it('a 25 mm laminate on a 5 °C/min ramp overshoots the air while a 2 mm one does not', () => {
    // "does not": stays within 3 K of the air, inside a usual thermocouple tolerance band
    const thick = peakOvershoot(100);
    const thin = peakOvershoot(8);
    expect(thick).toBeGreaterThan(20);
    expect(thin).toBeLessThan(3);
  });
});

describe('mesh convergence of the coupled column', () => {
  it('the peak exotherm of a 10 mm laminate hardly moves from 2 to 4 nodes per ply', () => {
    // spatial convergence of the finite-volume column (common practice, no source)
    const peakC = (nodesPerPly: number) => {
      const s = createThermochemical(study(40, { mesh: { nodesPerPly } }), { initialK: 20 + C0 });
      let peak = -Infinity;
      cure(s, rampHold(5), 120 * 60, (st) => {
        for (let j = 0; j < st.TK.length; j++) peak = Math.max(peak, st.TK[j]);
      });
      return peak - C0;
    };
    const coarse = peakC(2);
    expect(coarse).toBeGreaterThan(185);
    expect(Math.abs(peakC(4) - coarse)).toBeLessThan(0.05);
  });
});

describe('time-step convergence of the coupled step', () => {
  // Air rises smoothly from 20 °C to 180 °C over an hour (zero slope at the start, compatible with the uniform
  // start), 10 mm laminate, exotherm in progress at the end: the centre temperature at one hour.
  const air = (tS: number) => 20 + C0 + 80 * (1 - Math.cos((Math.PI * Math.min(tS, 3600)) / 3600));
  function centreAt(dt: number, scheme: 'crank-nicolson' | 'backward-euler'): number {
    const s = createThermochemical(study(40), { initialK: 20 + C0, scheme });
    const steps = Math.round(4200 / dt);
    for (let i = 1; i <= steps; i++) advanceThermochemical(s, dt, air(i * dt), air(i * dt));
    expect(s.alpha[40]).toBeGreaterThan(0.05);
    return s.TK[40];
  }

  it('halving dt divides the error by about 2 (backward Euler) and 4 (Crank–Nicolson)', () => {
    // expected orders of the θ-scheme with the cure integrated at the θ-weighted temperature (common practice, no source)
    for (const [scheme, ratio] of [['backward-euler', 2], ['crank-nicolson', 4]] as const) {
      const ref = centreAt(1.875, scheme);
      const e1 = Math.abs(centreAt(60, scheme) - ref);
      const e2 = Math.abs(centreAt(30, scheme) - ref);
      const e3 = Math.abs(centreAt(15, scheme) - ref);
      expectClose(e1 / e2, ratio, 0.25);
      expectClose(e2 / e3, ratio, 0.25);
    }
  });
});

describe('coupling passes', () => {
  it('each node ends its step with the cure advanceCure gives at the step-midpoint temperature, within 2e-7', () => {
    // consistency of the fixed-point coupling (no outside source): the cure increment used for the reaction
    // heat must be the integral of the kinetics at the θ-weighted temperature the step ends with (later
    // passes may carry increments over linearly; this checks that the carry-over stays inside the tolerance)
    const s = createThermochemical(study(100), { initialK: 20 + C0 });
    const air = rampHold(3);
    let checked = 0;
    let worst = 0;
    while (s.timeS < 110 * 60) {
      const rate = maxCureRate(s);
      const dt = Math.min(60, rate > 0 ? 0.005 / rate : 60, 20);
      const TOld = Float64Array.from(s.TK);
      const alphaOld = Float64Array.from(s.alpha);
      const t1 = s.timeS + dt;
      advanceThermochemical(s, dt, air(t1), air(t1));
      if (s.lastStep.splits > 0) continue;
      for (let j = 0; j < s.alpha.length; j++) {
        const mid = 0.5 * (TOld[j] + s.TK[j]);
        worst = Math.max(worst, Math.abs(s.alpha[j] - advanceCure(s.kinetics, alphaOld[j], mid, dt)));
      }
      checked++;
    }
    expect(checked).toBeGreaterThan(100);
    expect(Math.max(...s.alpha)).toBeGreaterThan(0.8);
    expect(worst).toBeLessThan(2e-7);
  });

  it('with the reaction heat linearised in the new temperature, a reacting step in a steady hold settles in one pass', () => {
    // Newton coupling (common practice, no source): the solve already meets the cure's response to its own
    // heat, so once the first guess is close (steady air, steady step) no second pass is needed, where a plain
    // fixed-point iteration needs at least two whenever the cure moves
    const s = createThermochemical(study(40), { initialK: 110 + C0 });
    const passes: number[] = [];
    let moved = 0;
    for (let i = 1; i <= 20; i++) {
      const before = s.alpha[40];
      advanceThermochemical(s, 30, 110 + C0, 110 + C0);
      if (i > 3) {
        passes.push(s.lastStep.passes);
        moved = Math.max(moved, s.alpha[40] - before);
      }
    }
    expect(moved).toBeGreaterThan(1e-3); // the cure really moves in these steps
    expect(passes.filter((p) => p === 1).length).toBeGreaterThanOrEqual(12); // of 17
  });
});

describe('robustness', () => {
  it('a ten-minute step into a runaway exotherm converges by internal halving and conserves energy', () => {
    // insulated, so the first law gives ΔT = ΔT_ad × Δα however the step was cut (closed form)
    const s = createThermochemical(study(8, { heatTransfer: { bagSideWPerM2K: 0, toolSideWPerM2K: 0 } }), { initialK: 130 + C0 });
    advanceThermochemical(s, 600, 130 + C0, 130 + C0);
    expect(s.lastStep.splits).toBeGreaterThan(0);
    for (let j = 0; j < s.TK.length; j++) {
      expect(Number.isFinite(s.TK[j])).toBe(true);
      expectClose(s.TK[j] - (130 + C0), adiabaticTemperatureRiseK(study(1)) * s.alpha[j], 1e-6);
    }
    expect(s.alpha[4]).toBeGreaterThan(0.3);
  });

  it('maxCureRate is the fastest node rate', () => {
    const s = createThermochemical(study(8), { initialK: 120 + C0 });
    advanceThermochemical(s, 600, 180 + C0, 180 + C0);
    const rates = Array.from(s.alpha, (a, j) => cureRate(s.kinetics, a, s.TK[j]));
    expect(maxCureRate(s)).toBe(Math.max(...rates));
  });

  it('refuses a non-positive step or a non-finite air temperature, naming it', () => {
    const s = createThermochemical(study(2), { initialK: 293.15 });
    expect(() => advanceThermochemical(s, 0, 300, 300)).toThrow(/step 0 s/);
    expect(() => advanceThermochemical(s, 10, Number.NaN, 300)).toThrow(/air temperature NaN K/);
  });
});
