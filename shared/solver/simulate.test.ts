import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseStudy, StudyInputError, type StudyParams, type StudyParamsInput } from '../schemas/study';
import { cToK, minToS } from '../units';
import { expectClose } from './test-support/expect-close';
import { aluminiumPlate, demoCarbonFibre, demoResin180, demoStudies, invarPlate, leeLoosSpringerResin, quasiIsotropic, referenceStudy } from './demo-cards';
import { DEFAULT_STEP_LIMITS, PREVIEW_OPTIONS, simulate, type SimulationResult, type StepLimits } from './simulate';

/** Linear interpolation of a history at time t (histories land exactly on segment ends). */
function at(result: SimulationResult, series: Float64Array, tS: number): number {
  const t = result.history.timeS;
  let i = 1;
  while (i < t.length - 1 && t[i] < tS) i++;
  const f = (tS - t[i - 1]) / (t[i] - t[i - 1]);
  return series[i - 1] + Math.min(1, Math.max(0, f)) * (series[i] - series[i - 1]);
}

function study(overrides: Partial<StudyParamsInput>): StudyParams {
  return parseStudy({ ...referenceStudy(), ...overrides });
}

/** Every number in the result finite: histories, profiles, nodes, stresses, curvature, summary. */
function expectAllFinite(r: SimulationResult): void {
  const arrays: [string, ArrayLike<number>][] = [
    ...Object.entries(r.history),
    ['profiles.zM', r.profiles.zM], ['profiles.T', r.profiles.temperatureK], ['profiles.alpha', r.profiles.alpha],
    ['nodes.zM', r.nodes.zM], ['nodes.gel', r.nodes.gelTimeS], ['nodes.vit', r.nodes.vitrificationTimeS],
    ['sigma1', r.plyStresses.sigma1Pa], ['sigma2', r.plyStresses.sigma2Pa], ['tau12', r.plyStresses.tau12Pa],
    ['segmentBoundsS', r.segmentBoundsS],
  ];
  for (const [name, a] of arrays) {
    for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) throw new Error(`${name}[${i}] = ${a[i]}`);
  }
  for (const k of ['kx', 'ky', 'kxy'] as const) expect(Number.isFinite(r.curvature[k]), k).toBe(true);
  const walk = (x: unknown, path: string): void => {
    if (typeof x === 'number') {
      if (!Number.isFinite(x)) throw new Error(`summary${path} = ${x}`);
    } else if (x && typeof x === 'object') for (const [k, v] of Object.entries(x)) walk(v, `${path}.${k}`);
  };
  walk(r.summary, '');
}

describe('simulate: the reference study', () => {
  it('runs, lands on every segment end, and returns finite, consistent arrays', () => {
    const r = simulate(referenceStudy(), { recordProfiles: true });
    expectAllFinite(r);
    const n = r.history.timeS.length;
    expect(n).toBe(r.steps + 1);
    for (const s of Object.values(r.history)) expect(s.length).toBe(n);
    const nodes = r.profiles.zM.length;
    expect(r.profiles.temperatureK.length).toBe(n * nodes);
    expect(r.plyStresses.zM.length).toBe(48);
    // every segment boundary is a history time (the loop lands on it exactly)
    for (const b of r.segmentBoundsS) expect(r.history.timeS.some((t) => Math.abs(t - b) < 1e-6)).toBe(true);
    expect(r.segmentBoundsS.length).toBe(6);
    // demould at the end of the history
    expect(r.history.timeS[n - 1]).toBeCloseTo(r.segmentBoundsS[5], 6);
    expect(r.summary.cycleMin).toBeCloseTo(r.segmentBoundsS[5] / 60, 6);
    // lagging-part holds start no earlier than the clock would: cycle ≥ scheduled 360 min
    // (closed form: 100/2 + 90 + 60/1.5 + 120 + 120/2 = 360 min)
    expect(r.summary.cycleMin).toBeGreaterThanOrEqual(360 - 1e-9);
    expect(r.summary.finalCureMin).toBeGreaterThan(0.8);
    // the shape is reported at the shop temperature, the cycle's 20 °C start (not the 60 °C demould)
    expect(r.summary.shapeAtC).toBeCloseTo(20, 9);
    expect(r.summary.limits.map((l) => l.key)).toEqual([
      'minFinalCure', 'maxOvershootC', 'maxGradientC', 'maxHeatRateCPerMin', 'maxCoolRateCPerMin', 'maxWarpageMm', 'maxSpringInDeg', 'maxCycleMin',
    ]);
    // α never decreases, at any node
    for (let s = 1; s < n; s++) {
      for (let j = 0; j < nodes; j++) expect(r.profiles.alpha[s * nodes + j]).toBeGreaterThanOrEqual(r.profiles.alpha[(s - 1) * nodes + j]);
    }
  });

  it('refuses invalid input with StudyInputError naming the field', () => {
    const bad = structuredClone(referenceStudy());
    bad.layup.plies[0].thicknessMm = -1;
    expect(() => simulate(bad)).toThrow(StudyInputError);
    expect(() => simulate(bad)).toThrow(/layup\.plies\.0\.thicknessMm/);
  });

  it('fills the hold defaults itself when a stored study left them out', () => {
    const raw = structuredClone(referenceStudy()) as StudyParamsInput;
    if (raw.cycle.kind === 'segments') {
      for (const seg of raw.cycle.segments) if (seg.kind === 'hold') Object.assign(seg, { start: undefined, bandC: undefined });
    }
    const r = simulate(raw);
    // clock-started holds: exactly the scheduled 360 min (closed form, see cycle tests)
    expect(r.summary.cycleMin).toBeCloseTo(360, 9);
  });

  it('returns fresh typed arrays on every call', () => {
    const p = referenceStudy();
    const a = simulate(p);
    const b = simulate(p);
    expect(a.history.timeS).not.toBe(b.history.timeS);
    expect(Array.from(a.history.midPlaneK)).toEqual(Array.from(b.history.midPlaneK));
  });
});

describe('simulate: lagging-part holds', () => {
  it('starts the hold clock where the coldest laminate node enters the band, placed inside the step', () => {
    const p = study({
      layup: { plies: quasiIsotropic(64) },
      cycle: {
        kind: 'segments',
        startC: 20,
        segments: [
          { kind: 'ramp', rateCPerMin: 3, targetC: 120, pressureBar: 7 },
          { kind: 'hold', holdMin: 30, pressureBar: 7, start: 'lagging-part', bandC: 2 },
          { kind: 'cool', rateCPerMin: 3, targetC: 60, pressureBar: 7 },
        ],
      },
    });
    const r = simulate(p, { recordProfiles: true });
    const [, rampEnd, holdEnd] = r.segmentBoundsS;
    const clockStart = holdEnd - minToS(30);
    // 12 mm on a 10 mm aluminium plate lags the air by minutes: the clock starts well after the ramp ends
    expect(clockStart - rampEnd).toBeGreaterThan(60);
    const nodes = r.profiles.zM.length;
    const coldest = (i: number) => Math.min(...r.profiles.temperatureK.subarray(i * nodes, (i + 1) * nodes));
    const t = r.history.timeS;
    const i = t.findIndex((x) => x >= clockStart - 1e-9);
    expect(i).toBeGreaterThan(0);
    const lower = cToK(120 - 2);
    expect(coldest(i)).toBeGreaterThanOrEqual(lower);
    expect(coldest(i - 1)).toBeLessThan(lower);
    // linear in time between the two steps around it
    const f = (lower - coldest(i - 1)) / (coldest(i) - coldest(i - 1));
    expect(clockStart).toBeCloseTo(t[i - 1] + f * (t[i] - t[i - 1]), 6);
  });
});

describe('simulate: measured records', () => {
  it('follows the recorded air linearly, lands on record points and applies the tool column to the tool side', () => {
    const p = study({
      cycle: {
        kind: 'record',
        points: [
          { timeMin: 0, airC: 20, toolC: 20, pressureBar: 0 },
          { timeMin: 60, airC: 140, toolC: 100, pressureBar: 7 },
          { timeMin: 120, airC: 140, toolC: 100 },
          { timeMin: 150, airC: 60, toolC: 60, pressureBar: 0 },
        ],
      },
      heatTransfer: { bagSideWPerM2K: 500, toolSideWPerM2K: 500 },
    });
    const r = simulate(p);
    expect(Array.from(r.segmentBoundsS)).toEqual([0, 9000]);
    for (const tMin of [60, 120, 150]) expect(r.history.timeS.some((t) => Math.abs(t - minToS(tMin)) < 1e-6)).toBe(true);
    // linear interpolation between the record points: 80 °C at 30 min, 100 °C at 135 min
    expectClose(at(r, r.history.airK, minToS(30)), cToK(80), 1e-9);
    expectClose(at(r, r.history.airK, minToS(135)), cToK(100), 1e-9);
    expectClose(at(r, r.history.pressurePa, minToS(30)), 3.5e5, 1e-9);
    // After an hour at 140 °C air over the bag and 100 °C under the tool the column is near steady conduction
    // through series resistances (closed form): 1/h + t_lam/k_z + t_tool/k_tool + 1/h, with k_z of the demo
    // ply from the Halpin–Tsai-type form (Halpin & Kardos 1976, from memory): 0.2·(2.6 + 2.2·0.58)/(2.6 − 2.2·0.58) = 0.5855 W/(m·K).
    // R = 0.002 + 0.00456/0.5855 + 0.010/167 + 0.002 = 0.011848 m²K/W, q = 40/R = 3376 W/m²,
    // so the tool's back face sits q/h = 6.75 K above the 100 °C tool-side temperature.
    const toolBack = at(r, r.history.toolK, minToS(119));
    const bag = at(r, r.history.bagSurfaceK, minToS(119));
    expect(Math.abs(toolBack - cToK(106.75))).toBeLessThan(0.5);
    expect(Math.abs(bag - cToK(140 - 6.75))).toBeLessThan(0.5);
    expect(r.summary.cycleMin).toBeCloseTo(150, 9);
  });
});

describe('simulate: Lee–Loos–Springer two-dwell cycle, thin part following the air', () => {
  it('matches the reference α at 36.4, 96.4, 120.8, 150.8 and 240.8 min within 0.5 %', () => {
    // Check values computed with SciPy LSODA (rtol 1e-10) from the constants of
    // Lee, Loos & Springer, J. Compos. Mater. 16 (1982): 25 °C, 2.5 °C/min → 116 °C, 60 min,
    // 2.5 °C/min → 177 °C, 120 min. A single 0.1 mm ply with h = 5000 W/(m²K) on both faces and no tool
    // follows the air within a few hundredths of a kelvin, so it stands in for the isothermal-with-air ODE.
    const p = study({
      resin: leeLoosSpringerResin(),
      layup: { plies: [{ angleDeg: 0, thicknessMm: 0.1 }] },
      tool: { kind: 'none' },
      constraint: 'free',
      heatTransfer: { bagSideWPerM2K: 5000, toolSideWPerM2K: 5000 },
      cycle: {
        kind: 'segments',
        startC: 25,
        segments: [
          { kind: 'ramp', rateCPerMin: 2.5, targetC: 116, pressureBar: 6 },
          { kind: 'hold', holdMin: 60, pressureBar: 6, start: 'clock', bandC: 5 },
          { kind: 'ramp', rateCPerMin: 2.5, targetC: 177, pressureBar: 6 },
          { kind: 'hold', holdMin: 120, pressureBar: 6, start: 'clock', bandC: 5 },
          { kind: 'cool', rateCPerMin: 3, targetC: 60, pressureBar: 6 },
        ],
      },
    });
    const r = simulate(p);
    const expected: [number, number][] = [[36.4, 0.0685], [96.4, 0.2825], [120.8, 0.5607], [150.8, 0.9104], [240.8, 0.9992]];
    for (const [tMin, alpha] of expected) {
      expectClose(at(r, r.history.alphaMin, minToS(tMin)), alpha, 0.005);
      expectClose(at(r, r.history.alphaMax, minToS(tMin)), alpha, 0.005);
    }
    // and the part did follow the air
    let worst = 0;
    for (let i = 0; i < r.history.timeS.length; i++) worst = Math.max(worst, Math.abs(r.history.midPlaneK[i] - r.history.airK[i]));
    expect(worst).toBeLessThan(0.5);
  });
});

describe('simulate: exotherm of thick sections', () => {
  it('a 25 mm laminate on a fast ramp overshoots the set point; a 2 mm one does not', () => {
    // Common practice, no source: thick sections cannot shed the reaction heat on a fast single ramp, so the
    // centre runs away above the dwell temperature; thin skins follow the air.
    const fastCycle = {
      kind: 'segments' as const,
      startC: 20,
      segments: [
        { kind: 'ramp' as const, rateCPerMin: 5, targetC: 180, pressureBar: 7 },
        { kind: 'hold' as const, holdMin: 120, pressureBar: 7, start: 'clock' as const, bandC: 5 },
        { kind: 'cool' as const, rateCPerMin: 3, targetC: 60, pressureBar: 7 },
      ],
    };
    const ply = (n: number, t: number) => Array.from({ length: n }, (_, i) => ({ angleDeg: [0, 45, -45, 90][i % 4], thicknessMm: t }));
    const thick = simulate(study({ layup: { plies: ply(125, 0.2) }, cycle: fastCycle }));
    const thin = simulate(study({ layup: { plies: ply(10, 0.2) }, cycle: fastCycle }));
    expect(thick.summary.peakOvershootC).toBeGreaterThan(10);
    expect(thin.summary.peakOvershootC).toBeLessThan(3);
    // the adiabatic rise bounds what any section can reach: ΔT_ad = (1−Vf)ρ_r H_R/(ρc_p) (closed form)
    expect(thick.summary.peakPartC).toBeLessThan(180 + thick.summary.adiabaticRiseC);
    expect(thick.summary.peakOvershootZMm).toBeGreaterThan(2);
    // and the heat bookkeeping closed within 0.5 % (shared/solver/README.md, "Heat balance"), or the summary would carry a warning
    expect(thick.summary.warnings).toEqual([]);
  });
});

describe('simulate: step-size convergence', () => {
  it('halving the step limits shrinks the change in results by the expected order', () => {
    // Expected order: Crank–Nicolson in time with the cure integrated at the step-midpoint temperature is
    // second order (Crank & Nicolson, Proc. Camb. Phil. Soc. 43, 1947 (memory)), so each halving of every step limit
    // should shrink the change about 4× (Richardson's argument: log2 ratio ≈ 2). Clock-started holds keep the
    // schedule fixed; values are read at segment ends, where every run lands exactly.
    const ref = structuredClone(referenceStudy());
    if (ref.cycle.kind === 'segments') for (const s of ref.cycle.segments) if (s.kind === 'hold') s.start = 'clock';
    const p = parseStudy({ ...ref, layup: { plies: quasiIsotropic(16) } });
    const run = (f: number) =>
      simulate(p, { stepLimits: { maxAirChangeK: 1 * f, maxCureChange: 0.005 * f, maxPartChangeK: 2 * f, maxStepS: 60 * f } });
    const atBoundary = (r: SimulationResult, series: Float64Array, tMin: number) => {
      const i = r.history.timeS.findIndex((t) => Math.abs(t - minToS(tMin)) < 1e-6);
      expect(i).toBeGreaterThan(0);
      return series[i];
    };
    const runs = [run(1), run(0.5), run(0.25)];
    expect(runs[1].steps).toBeGreaterThan(1.8 * runs[0].steps);
    const probes = [
      (r: SimulationResult) => atBoundary(r, r.history.alphaMin, 50), // end of the first ramp
      (r: SimulationResult) => atBoundary(r, r.history.midPlaneK, 180), // end of the second ramp (50 + 90 + 40 min)
    ];
    for (const probe of probes) {
      const [a, b, c] = runs.map(probe);
      const d1 = Math.abs(a - b);
      const d2 = Math.abs(b - c);
      expect(d1).toBeLessThan(1e-3 * Math.abs(a));
      const order = Math.log2(d1 / d2);
      expect(order).toBeGreaterThan(1.4);
      expect(order).toBeLessThan(2.6);
    }
  });
});

describe('simulate: warpage against the step and the inputs', () => {
  // Convergence/smoothness checks by construction (common practice, no source): a result must not depend on
  // where the step boundaries fall. In the reference study the gel front crosses the laminate near the end of
  // the second ramp, while the tool still heats; rounding each point's gel to whole steps made the warpage
  // jump by up to ±10 % with the step limits (free: by a factor of two) and by several per cent for a
  // 0.01 °C/min change of a ramp rate.
  const scaled = (f: number) => ({ maxAirChangeK: 1 * f, maxCureChange: 0.005 * f, maxPartChangeK: 2 * f, maxStepS: 60 * f });

  it.each([
    ['held on the tool', referenceStudy()],
    // Free, the laminate is very compliant while its first points gel: what bends it then is locked in.
    ['free', study({ constraint: 'free' })],
  ])('warpage and κx at step factors 1, ½ and ¼ agree with ⅛ within 2 % (%s)', (_, p) => {
    const finest = simulate(p, { stepLimits: scaled(0.125) });
    expect(finest.summary.warpageMm).toBeGreaterThan(0.01); // a warpage worth comparing
    for (const f of [1, 0.5, 0.25]) {
      const r = simulate(p, { stepLimits: scaled(f) });
      expect(Math.abs(r.summary.warpageMm / finest.summary.warpageMm - 1), `warpage at factor ${f}`).toBeLessThan(0.02);
      expect(Math.abs(r.curvature.kx / finest.curvature.kx - 1), `κx at factor ${f}`).toBeLessThan(0.02);
    }
  });

  /** Warpage for ten nudges of one segment's rate by 0.01 °C/min, default step limits. */
  const nudged = (segment: number) =>
    Array.from({ length: 11 }, (_, i) => {
      const ref = structuredClone(referenceStudy());
      const seg = ref.cycle.kind === 'segments' ? ref.cycle.segments[segment] : undefined;
      if (!seg || seg.kind === 'hold') throw new Error(`segment ${segment} has no rate`);
      seg.rateCPerMin += 0.01 * i;
      return simulate(parseStudy(ref)).summary.warpageMm;
    });

  it('moves warpage by no more than 0.5 % for each 0.01 °C/min nudge of the first ramp', () => {
    // Gel happens long after the first ramp: its rate barely matters, so any jump is a step artefact.
    const w = nudged(0);
    for (let i = 1; i < w.length; i++) expect(Math.abs(w[i] / w[i - 1] - 1), `nudge ${i}`).toBeLessThan(0.005);
  });

  it('moves warpage steadily as the ramp the part gels in is nudged', () => {
    // The second ramp's rate sets how far the tool heats after the gel front: warpage really moves with it
    // (about 0.7 % per 0.01 °C/min here), but steadily: consecutive changes differ by less than 0.1 %.
    const w = nudged(2);
    const d = w.slice(1).map((x, i) => x / w[i] - 1);
    expect(Math.max(...d.map(Math.abs))).toBeGreaterThan(0.001); // the input matters…
    for (let i = 1; i < d.length; i++) expect(Math.abs(d[i] - d[i - 1]), `nudge ${i + 1}`).toBeLessThan(0.001); // …smoothly
  });
});

describe('simulate: accuracy budget of the default step limits', () => {
  // The budget of shared/solver/README.md, "Time step": what the default limits may cost against steps 16×
  // shorter, on every demo study and on a 200-ply part on a fast ramp (the hardest exotherm we ship). The
  // sizes are a thermocouple's and a gauge's resolution with a wide margin (common practice, no source).
  const finer = (f: number): StepLimits => ({
    maxAirChangeK: DEFAULT_STEP_LIMITS.maxAirChangeK * f,
    maxCureChange: DEFAULT_STEP_LIMITS.maxCureChange * f,
    maxPartChangeK: DEFAULT_STEP_LIMITS.maxPartChangeK * f,
    maxStepS: DEFAULT_STEP_LIMITS.maxStepS * f,
  });
  const fast = demoStudies()[2].params;
  const cases: [string, StudyParams][] = [
    ...demoStudies().map((s): [string, StudyParams] => [s.name, s.params]),
    ['200 plies on a 5 °C/min ramp', parseStudy({ ...fast, layup: { plies: quasiIsotropic(200) } })],
  ];
  it.each(cases)('%s: within 0.05 K, 1e-4 cure, 0.5 min, 2.5 % (or 1 µm) warpage and 0.2 % spring-in', (_, p) => {
    const d = simulate(p).summary;
    const f = simulate(p, { stepLimits: finer(1 / 16) }).summary;
    for (const key of ['peakPartC', 'finalTgC', 'maxGradientC'] as const) expectClose(d[key], f[key], 0, 0.05);
    expectClose(d.finalCureMin, f.finalCureMin, 0, 1e-4);
    for (const key of ['gelTimeMin', 'vitrificationTimeMin', 'cycleMin'] as const) expectClose(d[key], f[key], 0, 0.5);
    expectClose(d.warpageMm, f.warpageMm, 0.025, 0.001);
    expectClose(d.springInDeg, f.springInDeg, 0.002);
  });

  it('needs about a third of the steps of limits half this size', () => {
    const p = referenceStudy();
    expect(simulate(p).steps).toBeLessThan(0.6 * simulate(p, { stepLimits: finer(0.5) }).steps);
  });
});

describe('simulate: preview limits', () => {
  it('take about half the steps and stay close to the default solution', () => {
    const p = referenceStudy();
    const full = simulate(p);
    const quick = simulate(p, PREVIEW_OPTIONS);
    expect(quick.steps).toBeLessThan(0.65 * full.steps);
    expect(Math.abs(quick.summary.finalCureMin - full.summary.finalCureMin)).toBeLessThan(1e-3);
    expect(Math.abs(quick.summary.peakPartC - full.summary.peakPartC)).toBeLessThan(0.5);
    expect(Math.abs(quick.summary.cycleMin - full.summary.cycleMin)).toBeLessThan(2.5);
    expectClose(quick.summary.warpageMm, full.summary.warpageMm, 0.05);
  });

  it('its looser cure tolerance moves the results by far less than its longer steps do', () => {
    const p = referenceStudy();
    const tight = simulate(p, { ...PREVIEW_OPTIONS, cureTolerance: 1e-8 }).summary;
    const quick = simulate(p, PREVIEW_OPTIONS).summary;
    const full = simulate(p).summary;
    expect(Math.abs(quick.finalCureMin - tight.finalCureMin)).toBeLessThan(0.1 * Math.abs(tight.finalCureMin - full.finalCureMin));
    expect(Math.abs(quick.warpageMm - tight.warpageMm)).toBeLessThan(0.1 * Math.abs(tight.warpageMm - full.warpageMm));
  });

  it('its nodes on the ply faces only move the results by far less than its longer steps do, on every demo study', () => {
    // spatial convergence (common practice, no source): a ply is thin against the thermal length of the
    // cycle, so its temperature and cure are all but linear between its faces
    for (const { name, params } of demoStudies()) {
      const faces = simulate(params, PREVIEW_OPTIONS);
      const mid = simulate(params, { ...PREVIEW_OPTIONS, nodesPerPly: 2 });
      const full = simulate(params);
      expect(faces.nodes.zM.length, name).toBe(params.layup.plies.length + 1);
      const mesh = (a: number, b: number) => Math.abs(a - b);
      expect(mesh(faces.summary.peakPartC, mid.summary.peakPartC), name).toBeLessThan(1e-3);
      expect(mesh(faces.summary.maxGradientC, mid.summary.maxGradientC), name).toBeLessThan(1e-2);
      expect(mesh(faces.summary.finalCureMin, mid.summary.finalCureMin), name).toBeLessThan(1e-5);
      expect(Math.abs(faces.summary.warpageMm / mid.summary.warpageMm - 1), name).toBeLessThan(0.1 * Math.abs(mid.summary.warpageMm / full.summary.warpageMm - 1) + 5e-4);
    }
  });

  it('refuses a mesh override that is not a whole number of nodes per ply within the laminate limit, and names it', () => {
    for (const bad of [0, 1.5, 7]) {
      expect(() => simulate(referenceStudy(), { nodesPerPly: bad })).toThrow(/options\.nodesPerPly: .* is out of range: allowed a whole number ≥ 1 and ≤ 6/);
    }
    const thick = parseStudy({ ...referenceStudy(), layup: { plies: quasiIsotropic(200) } });
    expect(() => simulate(thick, { nodesPerPly: 3 })).toThrow(/allowed a whole number ≥ 1 and ≤ 2 \(200 plies, ≤ 400 laminate nodes\)/);
  });

  it('refuses a cure tolerance outside (0, 1e-3] and names the option', () => {
    expect(() => simulate(referenceStudy(), { cureTolerance: 0 })).toThrow(/options\.cureTolerance: 0 is out of range: allowed > 0 and ≤ 1e-3/);
    expect(() => simulate(referenceStudy(), { cureTolerance: 0.01 })).toThrow(StudyInputError);
  });
});

describe('simulate: thousands of random valid inputs', () => {
  it('every output number is finite and α never decreases', () => {
    const plyArb = fc.record({
      angleDeg: fc.integer({ min: -90, max: 90 }),
      thicknessMm: fc.double({ min: 0.02, max: 1.0, noNaN: true }),
    });
    // Thin laminates with any mesh, and (one run in seven) thick ones of 40–125 plies, up to 37 mm, with 2–3
    // nodes per ply (the 400-node mesh cap allows no more), where a fast ramp drives a real exotherm.
    const thin = fc.record({ plies: fc.array(plyArb, { minLength: 1, maxLength: 4 }), nodesPerPly: fc.integer({ min: 2, max: 6 }) });
    const thick = fc.record({
      plies: fc.array(fc.record({ angleDeg: fc.constantFrom(0, 45, -45, 90), thicknessMm: fc.double({ min: 0.1, max: 0.3, noNaN: true }) }), { minLength: 40, maxLength: 125 }),
      nodesPerPly: fc.integer({ min: 2, max: 3 }),
    });
    const input = fc.record({
      layup: fc.oneof({ arbitrary: thin, weight: 6 }, { arbitrary: thick, weight: 1 }),
      vf: fc.double({ min: 0.3, max: 0.75, noNaN: true }),
      tool: fc.constantFrom('none', 'alu', 'thin', 'invar'),
      held: fc.boolean(),
      hBag: fc.double({ min: 1, max: 5000, noNaN: true }),
      hTool: fc.double({ min: 1, max: 5000, noNaN: true }),
      startC: fc.double({ min: 15, max: 40, noNaN: true }),
      // half the runs ramp fast (10–20 °C/min)
      rampRate: fc.oneof(fc.double({ min: 1, max: 20, noNaN: true }), fc.double({ min: 10, max: 20, noNaN: true })),
      dwellC: fc.double({ min: 60, max: 230, noNaN: true }),
      holdMin: fc.double({ min: 0.1, max: 30, noNaN: true }),
      lagging: fc.boolean(),
      bandC: fc.double({ min: 0.5, max: 10, noNaN: true }),
      secondDwell: fc.boolean(),
      coolRate: fc.double({ min: 1, max: 20, noNaN: true }),
      demouldC: fc.double({ min: 20, max: 55, noNaN: true }),
      record: fc.boolean(),
      model: fc.constantFrom('prony', 'chile'),
      kinetics: fc.constantFrom('demo', 'lls', 'nth', 'autocatalytic'),
      cureTable: fc.boolean(),
      heatKJ: fc.double({ min: 0, max: 800, noNaN: true }),
    });
    fc.assert(
      fc.property(input, (x) => {
        const resin = x.kinetics === 'lls' ? leeLoosSpringerResin() : demoResin180();
        if (x.kinetics === 'nth') resin.kinetics = { form: 'nth-order', aPerS: 5e5, eJPerMol: 70_000, n: 1.4 };
        // a pure α^m law starts from the seed α (shared/solver/README.md, "Cure kinetics")
        if (x.kinetics === 'autocatalytic') resin.kinetics = { form: 'kamal-sourour', a1PerS: 0, e1JPerMol: 0, a2PerS: 8e3, e2JPerMol: 60_000, m: 0.7, n: 1.2 };
        if (x.cureTable) resin.modulus.shift.cureTable = { alpha: [0.3, 0.7, 1], log10a: [-2, 0, 1] };
        resin.heatOfReactionKJPerKg = x.heatKJ;
        resin.modulus.model = x.model;
        const hold = { kind: 'hold' as const, holdMin: x.holdMin, pressureBar: 7, start: x.lagging ? ('lagging-part' as const) : ('clock' as const), bandC: x.bandC };
        const segments = [
          { kind: 'ramp' as const, rateCPerMin: x.rampRate, targetC: x.dwellC, pressureBar: 7 },
          hold,
          ...(x.secondDwell ? [{ kind: 'ramp' as const, rateCPerMin: x.rampRate, targetC: x.dwellC + 15, pressureBar: 7 }, hold] : []),
          { kind: 'cool' as const, rateCPerMin: x.coolRate, targetC: x.demouldC, pressureBar: 0 },
        ];
        const rampMin = (x.dwellC - x.startC) / x.rampRate;
        const cycle = x.record
          ? {
              kind: 'record' as const,
              points: [
                { timeMin: 0, airC: x.startC, pressureBar: 0 },
                { timeMin: rampMin, airC: x.dwellC, toolC: x.dwellC - 3, pressureBar: 7 },
                { timeMin: rampMin + x.holdMin, airC: x.dwellC },
                { timeMin: rampMin + x.holdMin + (x.dwellC - x.demouldC) / x.coolRate, airC: x.demouldC, pressureBar: 0 },
              ],
            }
          : { kind: 'segments' as const, startC: x.startC, segments };
        const tool = { none: { kind: 'none' as const }, alu: aluminiumPlate(10), thin: aluminiumPlate(0.5), invar: invarPlate(12) }[x.tool];
        const p = parseStudy({
          ...referenceStudy(),
          resin,
          fibre: demoCarbonFibre(),
          fibreVolumeFraction: x.vf,
          layup: { plies: x.layup.plies },
          tool,
          constraint: x.held && x.tool !== 'none' ? 'tool-held' : 'free',
          heatTransfer: { bagSideWPerM2K: x.hBag, toolSideWPerM2K: x.hTool },
          mesh: { nodesPerPly: x.layup.nodesPerPly },
          cycle,
        });
        const r = simulate(p, { recordProfiles: true });
        expectAllFinite(r);
        const nodes = r.profiles.zM.length;
        const a = r.profiles.alpha;
        for (let i = nodes; i < a.length; i++) if (a[i] < a[i - nodes]) throw new Error(`α fell at node ${i % nodes}`);
        for (let i = 0; i < a.length; i++) if (a[i] < 0 || a[i] >= 1) throw new Error(`α out of [0,1): ${a[i]}`);
        const h = r.history;
        for (let i = 1; i < h.alphaMin.length; i++) if (h.alphaMin[i] < h.alphaMin[i - 1]) throw new Error('alphaMin fell');
        for (let i = 1; i < h.timeS.length; i++) if (!(h.timeS[i] > h.timeS[i - 1])) throw new Error('time did not advance');
        expect(r.summary.cycleMin * 60).toBeCloseTo(h.timeS[h.timeS.length - 1], 6);
        expect(h.setpointK[0]).toBeCloseTo(cToK(x.startC), 9);
        for (const g of r.nodes.gelTimeS) expect(g === -1 || (g >= 0 && g <= h.timeS[h.timeS.length - 1])).toBe(true);
      }),
      { numRuns: 2000 },
    );
  }, 300_000);
});
