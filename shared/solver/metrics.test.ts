import { describe, expect, it } from 'vitest';
import { prepareGlassTransition } from './glass-transition';
import { createMetricsTracker, observeStep, summarize } from './metrics';
import { referenceStudy } from './demo-cards';
import { simulate } from './simulate';

// Tg0 = −20 °C, Tg∞ = 220 °C, λ = 0.5: Tg(0.5) = 60 °C (DiBenedetto, closed form).
const tg = prepareGlassTransition({ tg0C: -20, tgInfC: 220, lambda: 0.5 });
const z = new Float64Array([0, 0.001, 0.002]);

function tracker(T: number[], a: number[], setpointK: number) {
  return createMetricsTracker(z, 0.4, tg, new Float64Array(T), new Float64Array(a), 0, setpointK);
}

describe('metrics tracker', () => {
  it('interpolates gel time inside the step where α crosses the gel point', () => {
    const tr = tracker([400, 400, 400], [0.3, 0.2, 0.1], 400);
    observeStep(tr, 100, new Float64Array([400, 400, 400]), new Float64Array([0.3, 0.2, 0.1]), 0, 400);
    // node 0: 0.3 → 0.5 between 100 s and 200 s crosses 0.4 halfway: 150 s (linear interpolation)
    observeStep(tr, 200, new Float64Array([400, 400, 400]), new Float64Array([0.5, 0.35, 0.1]), 0, 400);
    expect(tr.gelTimeS[0]).toBeCloseTo(150, 9);
    expect(tr.gelTimeS[1]).toBe(-1);
    expect(tr.gelTimeS[2]).toBe(-1);
  });

  it('marks vitrification where Tg(α) passes the node temperature', () => {
    // At T = 60 °C = 333.15 K, Tg reaches T at α = 0.5 exactly (DiBenedetto check value above).
    const T = 333.15;
    const tr = tracker([T, T, T], [0.4, 0.4, 0.4], T);
    observeStep(tr, 60, new Float64Array([T, T, T]), new Float64Array([0.45, 0.45, 0.45]), 0, T);
    expect(tr.vitrificationTimeS[0]).toBe(-1);
    observeStep(tr, 120, new Float64Array([T, T, T]), new Float64Array([0.55, 0.45, 0.45]), 0, T);
    // margin T − Tg goes from positive to negative within (60, 120]; Tg is not linear in α, so the crossing
    // lies near, not exactly at, the α midpoint
    expect(tr.vitrificationTimeS[0]).toBeGreaterThan(60);
    expect(tr.vitrificationTimeS[0]).toBeLessThan(120);
    expect(Math.abs(tr.vitrificationTimeS[0] - 90)).toBeLessThan(10);
    expect(tr.vitrificationTimeS[1]).toBe(-1);
  });

  it('counts exotherm overshoot against the highest set point so far, not the falling one of a cool-down', () => {
    const tr = tracker([300, 300, 300], [0, 0, 0], 300);
    // ramp to 450 K, centre exotherm of +6 K at the hold
    observeStep(tr, 3000, new Float64Array([448, 449, 448]), new Float64Array([0.1, 0.1, 0.1]), 0, 450);
    observeStep(tr, 3600, new Float64Array([452, 456, 452]), new Float64Array([0.5, 0.6, 0.5]), 0, 450);
    // cool-down: the part lags 10 K above the falling set point, which is not an exotherm
    observeStep(tr, 6000, new Float64Array([410, 412, 410]), new Float64Array([0.9, 0.9, 0.9]), 0, 400);
    expect(tr.peakOvershootK).toBeCloseTo(6, 9);
    expect(tr.peakOvershootTimeS).toBe(3600);
    expect(tr.peakOvershootZM).toBe(0.001);
    expect(tr.peakPartK).toBe(456);
    // largest through-thickness difference 4 K at 3600 s
    expect(tr.maxGradientK).toBeCloseTo(4, 9);
    expect(tr.maxGradientTimeS).toBe(3600);
    // rates: node 1 rose 149 K in the first 3000 s; it fell 44 K in the 2400 s of the cool-down
    expect(tr.maxHeatRateKPerS).toBeCloseTo(149 / 3000, 12);
    expect(tr.maxCoolRateKPerS).toBeCloseTo(44 / 2400, 12);
    expect(tr.maxCoolRateZM).toBe(0.001);
  });

  it('summarizes limits with pass/fail, the worst place and time, and finite numbers', () => {
    const tr = tracker([300, 300, 300], [0, 0, 0], 300);
    observeStep(tr, 600, new Float64Array([320, 330, 325]), new Float64Array([0.95, 0.85, 0.9]), 0, 330);
    const limits = { ...referenceStudy().limits, minFinalCure: 0.9 };
    const s = summarize({
      tracker: tr, finalAlpha: new Float64Array([0.95, 0.85, 0.9]), offset: 0, demouldS: 600, steps: 1,
      warpageMm: -0.4, springInDeg: 2, shapeAtK: 293.15, adiabaticRiseK: 100, limits, warnings: [],
    });
    expect(s.shapeAtC).toBeCloseTo(20, 9); // 293.15 K = 20 °C by definition
    expect(s.finalCureMin).toBe(0.85);
    expect(s.finalCureMinZMm).toBeCloseTo(1, 12);
    const byKey = Object.fromEntries(s.limits.map((l) => [l.key, l]));
    expect(byKey.minFinalCure).toMatchObject({ pass: false, value: 0.85, limit: 0.9, atZMm: expect.closeTo(1, 12) });
    expect(byKey.maxWarpageMm).toMatchObject({ pass: true, value: 0.4 });
    expect(byKey.maxSpringInDeg).toMatchObject({ pass: false, value: 2 });
    expect(byKey.maxCycleMin).toMatchObject({ value: 10, pass: true });
    expect(byKey.maxHeatRateCPerMin.value).toBeCloseTo(3, 12); // 30 K in 10 min
    expect(s.gelTimeMin).toBeGreaterThan(0);
    // Tg(0.85) = 157 °C with these constants, far above the 47–57 °C part: vitrified within the step
    expect(s.vitrificationTimeMin).toBeGreaterThan(0);
    expect(s.vitrificationTimeMin).toBeLessThanOrEqual(10);
    expect(s.peakOvershootC).toBe(0); // never above the set point: reported as 0, with no place or time
    expect(byKey.maxOvershootC).toMatchObject({ pass: true, atTimeMin: null, atZMm: null });
  });

  it('reports the adiabatic rise of the reference laminate', () => {
    // ΔT_ad = (1 − V_f) ρ_r H_R / (V_f ρ_f c_f + (1 − V_f) ρ_r c_r) (closed form), by hand for the demo cards:
    // 0.42·1260·500e3 / (0.58·1790·760 + 0.42·1260·1200) = 264.6e6 / 1 424 068 = 185.80 K
    const r = simulate(referenceStudy());
    expect(r.summary.adiabaticRiseC).toBeCloseTo(185.8052, 3);
  });
});
