import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { StudyParams } from '../schemas/study';
import { parseStudy } from '../schemas/study';
import { expectClose } from './test-support/expect-close';
import { referenceStudy } from './demo-cards';
import { glassTransitionK, prepareGlassTransition } from './glass-transition';
import { shopCoolRateKPerS, shopTemperatureK } from './cycle';
import { coolToShopTemperature, createMechanics, demould, mechanicsResult, mechanicsStep, primeMechanics, resinModulusPa, type MechanicsState } from './mechanics';
import { elasticFreeResponse, laminateGeometry, plyFreeStrainToLaminate, plyStiffness, rotateStiffness } from './laminate';
import { plyProperties } from './micromechanics';

type Layup = StudyParams['layup']['plies'];

function study(overrides: Partial<StudyParams>, resin: Partial<StudyParams['resin']> = {}): StudyParams {
  const ref = referenceStudy();
  return parseStudy({ ...ref, ...overrides, resin: { ...ref.resin, ...resin } });
}

function plyPoints(layup: Layup): Float64Array {
  const z = new Float64Array(2 * layup.length);
  let at = 0;
  layup.forEach((p, k) => {
    z[2 * k] = at;
    at += p.thicknessMm / 1000;
    z[2 * k + 1] = at;
  });
  return z;
}

/** Drive the mechanics with the same T, α at every point; Tg from the card's DiBenedetto law unless given. */
function drive(state: MechanicsState, params: StudyParams, path: { TK: number; alpha: number; tgK?: number; dtS: number }[]) {
  const n = state.prevTK.length;
  const TK = new Float64Array(n);
  const alpha = new Float64Array(n);
  const tgK = new Float64Array(n);
  const gt = prepareGlassTransition(params.resin.glassTransition);
  for (const s of path) {
    TK.fill(s.TK);
    alpha.fill(s.alpha);
    tgK.fill(s.tgK ?? glassTransitionK(s.alpha, gt));
    mechanicsStep(state, TK, alpha, tgK, s.dtS);
  }
  return { TK, alpha, tgK };
}

/** A simple cure: heat to 453 K uncured, cure there for 2 h through gel, cool to 333 K (all uniform). */
function cureAndCool(): { TK: number; alpha: number; dtS: number }[] {
  const path: { TK: number; alpha: number; dtS: number }[] = [];
  for (let T = 293.15; T < 453.15; T += 2) path.push({ TK: T + 2, alpha: 0.01, dtS: 60 });
  for (let i = 1; i <= 120; i++) path.push({ TK: 455.15, alpha: 0.01 + (0.94 * i) / 120, dtS: 60 });
  for (let T = 455.15; T > 333.15; T -= 3) path.push({ TK: T - 3, alpha: 0.95, dtS: 60 });
  return path;
}

const QI: Layup = [0, 45, -45, 90, 90, -45, 45, 0].map((angleDeg) => ({ angleDeg, thicknessMm: 0.19 }));
const CROSS: Layup = [0, 0, 90, 90].map((angleDeg) => ({ angleDeg, thicknessMm: 0.19 }));

describe('mechanics through a cure', () => {
  it('gives a symmetric balanced laminate no curvature', () => {
    // Common practice, no source: a symmetric, balanced layup under a uniform history stays flat.
    const params = study({ layup: { plies: QI }, constraint: 'free' });
    const state = createMechanics(params, plyPoints(QI));
    drive(state, params, cureAndCool());
    const r = mechanicsResult(state, params);
    for (const k of [r.curvature.kx, r.curvature.ky, r.curvature.kxy]) expect(Math.abs(k)).toBeLessThan(1e-9);
    expect(r.warpageMm).toBeLessThan(1e-6);
    // …yet its plies carry residual stress: the 0° plies are pulled across the fibres by the others on cooling.
    expect(r.plyStresses.sigma2Pa[0]).toBeGreaterThan(5e6);
  });

  it('warps an unsymmetric [0/90] laminate the way the 90° side shrinks more', () => {
    // The 90° plies on top shrink more along x on cooling than the 0° plies below, so κx < 0 and κy > 0
    // (Hyer, J. Compos. Mater. 15, 1981 (memory); common practice).
    const params = study({ layup: { plies: CROSS }, constraint: 'free' });
    const state = createMechanics(params, plyPoints(CROSS));
    drive(state, params, cureAndCool());
    const r = mechanicsResult(state, params);
    expect(r.curvature.kx).toBeLessThan(-1);
    expect(r.curvature.ky).toBeGreaterThan(1);
    expectClose(r.warpageMm, (Math.abs(r.curvature.kx) * 0.3 * 0.3 * 1000) / 8, 1e-12);
    for (const v of [...r.plyStresses.sigma1Pa, ...r.plyStresses.sigma2Pa, ...r.plyStresses.tau12Pa]) expect(Number.isFinite(v)).toBe(true);
  });

  it('carries no stress and no curvature before gel', () => {
    // Before gel the resin is liquid and carries no stress.
    const params = study({ layup: { plies: CROSS }, constraint: 'free' });
    const state = createMechanics(params, plyPoints(CROSS));
    drive(state, params, cureAndCool().slice(0, 100));
    const r = mechanicsResult(state, params);
    expect([r.curvature.kx, r.curvature.ky]).toEqual([0, 0]);
    expect(Math.max(...r.plyStresses.sigma1Pa.map(Math.abs))).toBe(0);
    expect(r.resinModulusMidPa).toBe(0);
  });

  it('holds a laminate flat on the tool, then springs back at demould', () => {
    // Tool-held until demould, then released; the springback is the warpage a user sees.
    const params = study({ layup: { plies: CROSS }, constraint: 'tool-held' });
    const state = createMechanics(params, plyPoints(CROSS));
    const last = drive(state, params, cureAndCool());
    expect([...state.laminate.curvature]).toEqual([0, 0, 0]);
    demould(state, last.TK, last.alpha, last.tgK);
    const r = mechanicsResult(state, params);
    expect(r.curvature.kx).toBeLessThan(-1);
    // After release nothing holds it: no net force or moment.
    const z = r.plyStresses.zM;
    let n = 0;
    let m = 0;
    for (let k = 0; k < CROSS.length; k++) {
      // σx from σ1, σ2 in a 0° or 90° ply; trapezoid in z (stress is linear within a ply).
      const sx = (p: number) => (CROSS[k].angleDeg === 0 ? r.plyStresses.sigma1Pa[p] : r.plyStresses.sigma2Pa[p]);
      const t = z[2 * k + 1] - z[2 * k];
      const zc = (z[2 * k] + z[2 * k + 1]) / 2 - z[z.length - 1] / 2;
      n += (t * (sx(2 * k) + sx(2 * k + 1))) / 2;
      m += t * zc * (sx(2 * k) + sx(2 * k + 1)) / 2 + (t * t * (sx(2 * k + 1) - sx(2 * k))) / 12;
    }
    expect(Math.abs(n)).toBeLessThan(1e-3);
    expect(Math.abs(m)).toBeLessThan(1e-6);
  });

  it('closes a cured corner by a plausible spring-in', () => {
    // Carbon/epoxy 90° corners typically close by about 0.5–2° (common practice, no source).
    const params = study({ layup: { plies: QI }, constraint: 'free' });
    const state = createMechanics(params, plyPoints(QI));
    drive(state, params, cureAndCool());
    const r = mechanicsResult(state, params);
    expect(r.springInDeg).toBeGreaterThan(0.3);
    expect(r.springInDeg).toBeLessThan(3);
  });
});

describe('mechanics bookkeeping', () => {
  it('gives the same answer whether or not ply-interface points share their work', () => {
    // Internal consistency: nudging every other point by 1e-9 K turns the interface reuse off.
    const params = study({ layup: { plies: CROSS }, constraint: 'free' });
    const run = (nudge: number) => {
      const state = createMechanics(params, plyPoints(CROSS));
      const n = 2 * CROSS.length;
      const gt = prepareGlassTransition(params.resin.glassTransition);
      const TK = new Float64Array(n);
      const alpha = new Float64Array(n);
      const tgK = new Float64Array(n);
      for (const s of cureAndCool()) {
        for (let p = 0; p < n; p++) TK[p] = s.TK + (p % 2) * nudge;
        alpha.fill(s.alpha);
        tgK.fill(glassTransitionK(s.alpha, gt));
        mechanicsStep(state, TK, alpha, tgK, s.dtS);
      }
      return mechanicsResult(state, params);
    };
    const shared = run(0);
    const separate = run(1e-9);
    expectClose(shared.curvature.kx, separate.curvature.kx, 1e-6);
    for (let p = 0; p < 8; p++) expectClose(shared.plyStresses.sigma2Pa[p], separate.plyStresses.sigma2Pa[p], 1e-6);
    expectClose(shared.springInDeg, separate.springInDeg, 1e-6);
  });
});

describe('mechanics: gel inside a step', () => {
  // By construction: a point gels where α crosses α_gel, not at a step boundary, so a step that contains the
  // crossing must give what two steps split exactly at the crossing give (T and 1/a linear over the step,
  // the crossing found linearly in α). Rounding the gel to whole steps made warpage jump with the step size.
  const n = 2 * CROSS.length;
  const fill = (x: number) => new Float64Array(n).fill(x);
  /** Run `through` (one step across gel, or the same split at the crossing), then a common cure and cool. */
  function run(params: StudyParams, start: { TK: number; alpha: number; tgK?: number }, through: { TK: number; alpha: number; tgK?: number; dtS: number }[]) {
    const state = createMechanics(params, plyPoints(CROSS));
    const gt = prepareGlassTransition(params.resin.glassTransition);
    primeMechanics(state, fill(start.TK), fill(start.alpha), fill(start.tgK ?? glassTransitionK(start.alpha, gt)));
    drive(state, params, through);
    const end = through[through.length - 1];
    const rest = [
      ...Array.from({ length: 20 }, (_, i) => ({ TK: end.TK, alpha: end.alpha + ((0.9 - end.alpha) * (i + 1)) / 20, dtS: 60 })),
      ...Array.from({ length: 20 }, (_, i) => ({ TK: end.TK - 5 * (i + 1), alpha: 0.9, dtS: 60 })),
    ];
    const last = drive(state, params, rest);
    demould(state, last.TK, last.alpha, last.tgK);
    return mechanicsResult(state, params);
  }
  function expectSame(a: ReturnType<typeof mechanicsResult>, b: ReturnType<typeof mechanicsResult>) {
    expect(Math.abs(a.curvature.kx)).toBeGreaterThan(0.01); // something to compare
    expectClose(a.curvature.kx, b.curvature.kx, 1e-6);
    expectClose(a.curvature.ky, b.curvature.ky, 1e-6);
    const scale = Math.max(...b.plyStresses.sigma2Pa.map(Math.abs));
    for (let p = 0; p < n; p++) {
      expectClose(a.plyStresses.sigma1Pa[p], b.plyStresses.sigma1Pa[p], 1e-6, 1e-6 * scale);
      expectClose(a.plyStresses.sigma2Pa[p], b.plyStresses.sigma2Pa[p], 1e-6, 1e-6 * scale);
    }
    expectClose(a.springInDeg, b.springInDeg, 1e-6);
  }

  it('starts a heating tool-held point from the crossing temperature (CHILE)', () => {
    // α_gel = 0.36 is crossed half-way through a 60 s step from 420 K to 440 K: at 430 K, 30 s in.
    const ref = referenceStudy();
    const params = study({ layup: { plies: CROSS }, constraint: 'tool-held' }, { modulus: { ...ref.resin.modulus, model: 'chile' } });
    const start = { TK: 420, alpha: 0.3 };
    const one = run(params, start, [{ TK: 440, alpha: 0.42, dtS: 60 }]);
    const split = run(params, start, [
      { TK: 430, alpha: 0.36, dtS: 30 },
      { TK: 440, alpha: 0.42, dtS: 30 },
    ]);
    expectSame(one, split);
  });

  it('relaxes a point only over the part of the step after its gel (Prony)', () => {
    // Isothermal, Tg held: 1/a is constant, so the reduced time after the crossing is exactly that of the
    // second half-step; the spectrum's short terms relax appreciably within it (log₁₀ a ≈ −2 at T − Tg = 10 K).
    const params = study({ layup: { plies: CROSS }, constraint: 'free' });
    const start = { TK: 440, alpha: 0.3, tgK: 430 };
    const one = run(params, start, [{ TK: 440, alpha: 0.42, tgK: 430, dtS: 60 }]);
    const split = run(params, start, [
      { TK: 440, alpha: 0.36, tgK: 430, dtS: 30 },
      { TK: 440, alpha: 0.42, tgK: 430, dtS: 30 },
    ]);
    expectSame(one, split);
  });
});

describe('mechanics: elastic and viscoelastic limits', () => {
  /** Resin that is CHILE and glassy throughout (Tg far above T), already gelled at the start. */
  function glassyChile(layup: Layup) {
    const ref = referenceStudy();
    const params = study(
      { layup: { plies: layup }, constraint: 'free' },
      { modulus: { ...ref.resin.modulus, model: 'chile' }, totalShrinkagePct: 0 },
    );
    const state = createMechanics(params, plyPoints(layup));
    const n = 2 * layup.length;
    primeMechanics(state, new Float64Array(n).fill(450), new Float64Array(n).fill(0.9), new Float64Array(n).fill(600));
    return { params, state };
  }

  it('is elastic through the same path with CHILE (one term of τ = ∞)', () => {
    // Johnston, Vaziri & Poursartip 2001 (memory): CHILE at a fixed T* is linear elastic, so cooling a glassy
    // [0/90] by 150 K in 9 steps must give the elastic CLT curvature of the glassy ply.
    const { params, state } = glassyChile(CROSS);
    const path = Array.from({ length: 9 }, (_, i) => ({ TK: 450 - ((i + 1) * 150) / 9, alpha: 0.9, tgK: 600, dtS: 100 }));
    drive(state, params, path);
    // The elastic reference through classical lamination theory (laminate.ts), glassy ply from micromechanics.
    const m = params.resin.modulus;
    const f = params.fibre;
    const ply = plyProperties(
      { e1Pa: f.e1GPa * 1e9, e2Pa: f.e2GPa * 1e9, g12Pa: f.g12GPa * 1e9, nu12: f.nu12, nu23: f.nu23 ?? f.nu12, cte1PerK: f.cte1MicroPerK * 1e-6, cte2PerK: f.cte2MicroPerK * 1e-6 },
      { ePa: m.unrelaxedGPa * 1e9, nu: m.poisson, ctePerK: params.resin.cteMicroPerK * 1e-6 },
      params.fibreVolumeFraction,
    );
    const q = plyStiffness(ply.e1Pa, ply.e2Pa, ply.g12Pa, ply.nu12);
    const qbar = new Float64Array(6 * CROSS.length);
    const free = new Float64Array(3 * CROSS.length);
    CROSS.forEach((p, k) => {
      rotateStiffness(q, p.angleDeg, qbar, 0, 6 * k);
      const r = (p.angleDeg * Math.PI) / 180;
      plyFreeStrainToLaminate(ply.cte1PerK * -150, ply.cte2PerK * -150, Math.cos(r), Math.sin(r), free, 3 * k);
    });
    const elastic = elasticFreeResponse(laminateGeometry(CROSS.map((p) => p.thicknessMm / 1000)), qbar, free);
    const r = mechanicsResult(state, params);
    expectClose(r.curvature.kx, elastic[3], 1e-6);
    expectClose(r.curvature.ky, elastic[4], 1e-6);
  });

  it('never rescales locked-in stress when the resin stiffens (CHILE, hypoelastic)', () => {
    // Hypoelastic rule: growing stiffness multiplies only new increments. Strain a rubbery [0/90] by cooling,
    // then raise Tg at constant temperature (glassy now, no strain change): stresses must not move.
    const ref = referenceStudy();
    const params = study(
      { layup: { plies: CROSS }, constraint: 'free' },
      { modulus: { ...ref.resin.modulus, model: 'chile' }, totalShrinkagePct: 0 },
    );
    const state = createMechanics(params, plyPoints(CROSS));
    const n = 2 * CROSS.length;
    primeMechanics(state, new Float64Array(n).fill(450), new Float64Array(n).fill(0.9), new Float64Array(n).fill(400));
    drive(state, params, [{ TK: 440, alpha: 0.9, tgK: 400, dtS: 60 }]);
    const before = mechanicsResult(state, params);
    expect(Math.abs(before.plyStresses.sigma2Pa[0])).toBeGreaterThan(1e4);
    drive(state, params, [{ TK: 440, alpha: 0.9, tgK: 600, dtS: 60 }]);
    const after = mechanicsResult(state, params);
    for (let p = 0; p < n; p++) expectClose(after.plyStresses.sigma2Pa[p], before.plyStresses.sigma2Pa[p], 1e-9);
    expectClose(after.curvature.kx, before.curvature.kx, 1e-9);
  });

  it('follows the Prony constant-rate closed form in a tool-held ply', () => {
    // A unidirectional ply held on a tool whose thermal strain grows at a constant rate, with constant shift
    // (C1 = 0, E_a = 0: a = 1), no ply CTE and no shrinkage: σ1 = Σ(Q∞1j + ΔQ1j Σ wᵢ τᵢ/t (1 − e^(−t/τᵢ))) ε(t)
    // summed over j = 1, 2 (equal strain in x and y), the closed form behind the constant-rate Prony check value.
    const ref = referenceStudy();
    const prony = { weights: [0.3, 0.7], timesS: [10, 100] };
    const layup: Layup = [{ angleDeg: 0, thicknessMm: 0.2 }];
    const params = study(
      { layup: { plies: layup }, constraint: 'tool-held', fibre: { ...ref.fibre, cte1MicroPerK: 0, cte2MicroPerK: 0 } },
      {
        cteMicroPerK: 0,
        totalShrinkagePct: 0,
        modulus: { ...ref.resin.modulus, prony, shift: { wlfC1: 0, wlfC2K: 60, offsetC: 0, arrheniusEJPerMol: 0 } },
      },
    );
    const toolCte = 23.6e-6; // the reference study's aluminium plate
    const rateKPerS = 0.5;
    const tEnd = 50;
    for (const dt of [50, 5, 0.5]) {
      const state = createMechanics(params, plyPoints(layup));
      primeMechanics(state, Float64Array.of(300, 300), Float64Array.of(0.9, 0.9), Float64Array.of(450, 450));
      const path = Array.from({ length: Math.round(tEnd / dt) }, (_, i) => ({ TK: 300 + rateKPerS * dt * (i + 1), alpha: 0.9, tgK: 450, dtS: dt }));
      drive(state, params, path);
      const r = mechanicsResult(state, params);
      const m = params.resin.modulus;
      const f = params.fibre;
      const fibre = { e1Pa: f.e1GPa * 1e9, e2Pa: f.e2GPa * 1e9, g12Pa: f.g12GPa * 1e9, nu12: f.nu12, nu23: 0.4, cte1PerK: 0, cte2PerK: 0 };
      const qu = plyStiffness(...ply4(plyProperties(fibre, { ePa: m.unrelaxedGPa * 1e9, nu: m.poisson, ctePerK: 0 }, params.fibreVolumeFraction)));
      const qr = plyStiffness(...ply4(plyProperties(fibre, { ePa: m.relaxedGPa * 1e9, nu: m.poisson, ctePerK: 0 }, params.fibreVolumeFraction)));
      const rate = toolCte * rateKPerS;
      const share = prony.weights.reduce((s, w, i) => s + w * prony.timesS[i] * rate * (1 - Math.exp(-tEnd / prony.timesS[i])), 0);
      const expected = (qr[0] + qr[1]) * rate * tEnd + (qu[0] + qu[1] - qr[0] - qr[1]) * share;
      expectClose(r.plyStresses.sigma1Pa[0], expected, 1e-9);
    }
  });
});

function ply4(p: { e1Pa: number; e2Pa: number; g12Pa: number; nu12: number }): [number, number, number, number] {
  return [p.e1Pa, p.e2Pa, p.g12Pa, p.nu12];
}

/**
 * κx of a free [0/90]T pair of equal plies (0° at the bottom) under a uniform ΔT, by classical lamination
 * theory written out for this layup (Hyer 1998 property set): A11 = A22 = (Q11 + Q22)t,
 * A12 = 2Q12 t, B11 = −B22 = (Q22 − Q11)t²/2, D11 = D22 = (Q11 + Q22)t³/3, D12 = 2Q12 t³/3; by symmetry
 * ε⁰x = ε⁰y = e and κy = −κx = −k, which leaves (A11 + A12)e + B11 k = N, B11 e + (D11 − D12)k = M.
 */
function crossPairKx(ply: { e1: number; e2: number; nu12: number; a1: number; a2: number }, t: number, dT: number): number {
  const d = 1 - (ply.nu12 * ply.nu12 * ply.e2) / ply.e1;
  const q11 = ply.e1 / d;
  const q22 = ply.e2 / d;
  const q12 = (ply.nu12 * ply.e2) / d;
  const a = (q11 + q22) * t + 2 * q12 * t;
  const b = ((q22 - q11) * t * t) / 2;
  const dd = ((q11 + q22) * t ** 3) / 3 - (2 * q12 * t ** 3) / 3;
  const sx0 = q11 * ply.a1 + q12 * ply.a2; // σx per K of the free-strain-restrained 0° ply
  const sx90 = q22 * ply.a2 + q12 * ply.a1; // and of the 90° ply
  const n = t * dT * (sx0 + sx90);
  const m = ((t * t) / 2) * dT * (sx90 - sx0);
  return (m * a - b * n) / (a * dd - b * b);
}

describe('mechanics: shape at the shop temperature', () => {
  it('writes out classical lamination theory for a [0/90]T pair that reproduces Hyer’s curvature', () => {
    // κx = −10.832 1/m for ΔT = −150 K: Hyer (1998) property set, CLT.
    expectClose(crossPairKx({ e1: 155e9, e2: 12.1e9, nu12: 0.248, a1: -0.018e-6, a2: 24.3e-6 }, 0.15e-3, -150), -10.832, 5e-5);
  });

  it('bends a free unsymmetric [0/90] laminate further from demould to the shop temperature, as CLT says', () => {
    const layup: Layup = [0, 90].map((angleDeg) => ({ angleDeg, thicknessMm: 0.15 }));
    const params = study({ layup: { plies: layup }, constraint: 'free', tool: { kind: 'none' } });
    const state = createMechanics(params, plyPoints(layup));
    const alpha = 0.99;
    const tgK = glassTransitionK(alpha, prepareGlassTransition(params.resin.glassTransition)); // ≈ 483 K
    const stressFreeK = 423.15;
    const demouldK = 333.15;
    const fill = (x: number) => new Float64Array(4).fill(x);
    // Cured and stress-free at 150 °C (points past gel are stress-free where primed), then cooled to a 60 °C
    // demould in 1 K steps.
    primeMechanics(state, fill(stressFreeK), fill(alpha), fill(tgK));
    drive(state, params, Array.from({ length: 90 }, (_, i) => ({ TK: stressFreeK - (i + 1), alpha, tgK, dtS: 0.01 })));
    const atDemould = mechanicsResult(state, params).curvature.kx;
    const TK = fill(demouldK);
    const shopK = shopTemperatureK(params.cycle);
    coolToShopTemperature(state, TK, fill(alpha), fill(tgK), shopK, shopCoolRateKPerS(params.cycle));
    expect(Array.from(TK)).toEqual([shopK, shopK, shopK, shopK]);
    const atShop = mechanicsResult(state, params).curvature.kx;
    expect(Math.abs(atShop)).toBeGreaterThan(Math.abs(atDemould));
    // The elastic reference with the glassy ply from micromechanics (tested against the rule of mixtures and
    // Schapery in micromechanics.test.ts), ΔT from the stress-free 150 °C. Tolerance 1e-4: the path is linear
    // elastic up to relaxation, and far below Tg (≈ 210 °C) the resin hardly relaxes: the shortest Prony time
    // (1 s) is shifted by a ≈ 7e3 at 150 °C and by a > 1e12 below 60 °C, so over these steps Δξ/τ < 1e-5.
    const m = params.resin.modulus;
    const f = params.fibre;
    const ply = plyProperties(
      { e1Pa: f.e1GPa * 1e9, e2Pa: f.e2GPa * 1e9, g12Pa: f.g12GPa * 1e9, nu12: f.nu12, nu23: f.nu23 ?? f.nu12, cte1PerK: f.cte1MicroPerK * 1e-6, cte2PerK: f.cte2MicroPerK * 1e-6 },
      { ePa: m.unrelaxedGPa * 1e9, nu: m.poisson, ctePerK: params.resin.cteMicroPerK * 1e-6 },
      params.fibreVolumeFraction,
    );
    const glassy = { e1: ply.e1Pa, e2: ply.e2Pa, nu12: ply.nu12, a1: ply.cte1PerK, a2: ply.cte2PerK };
    expectClose(atDemould, crossPairKx(glassy, 0.15e-3, demouldK - stressFreeK), 1e-4);
    expectClose(atShop, crossPairKx(glassy, 0.15e-3, shopK - stressFreeK), 1e-4);
  });
});

describe('mechanics input', () => {
  it('refuses integration points that do not match the layup, naming the field', () => {
    const params = study({ layup: { plies: CROSS } });
    expect(() => createMechanics(params, new Float64Array(3))).toThrow(/plyPointZM: 3 points for 4 plies/);
  });

  it('refuses a negative time step and NaN temperatures', () => {
    const params = study({ layup: { plies: CROSS } });
    const state = createMechanics(params, plyPoints(CROSS));
    const ok = new Float64Array(8).fill(300);
    expect(() => mechanicsStep(state, ok, new Float64Array(8), ok, -1)).toThrow(/time step -1 s is out of range/);
    const bad = ok.slice();
    bad[3] = NaN;
    expect(() => mechanicsStep(state, bad, new Float64Array(8), ok, 1)).toThrow(/point 3 has T NaN/);
  });

  it('reports a resin modulus of zero before gel and glassy well below Tg', () => {
    const params = study({ layup: { plies: CROSS } });
    const state = createMechanics(params, plyPoints(CROSS));
    expect(resinModulusPa(state, 400, 0.1, 300)).toBe(0);
    expectClose(resinModulusPa(state, 300, 0.95, 480), params.resin.modulus.unrelaxedGPa * 1e9, 0.02);
  });
});

describe('mechanics on random valid input', () => {
  it('returns finite stresses, curvature, warpage and spring-in', () => {
    // Property test (fast-check): whatever the layup, model, constraint and history, no NaN or Infinity escapes.
    const ref = referenceStudy();
    fc.assert(
      fc.property(
        fc.array(fc.record({ angleDeg: fc.integer({ min: -90, max: 90 }), thicknessMm: fc.double({ min: 0.02, max: 2, noNaN: true }) }), { minLength: 1, maxLength: 12 }),
        fc.constantFrom('prony' as const, 'chile' as const),
        fc.constantFrom('free' as const, 'tool-held' as const),
        fc.array(fc.record({ dT: fc.double({ min: -20, max: 20, noNaN: true }), dA: fc.double({ min: 0, max: 0.2, noNaN: true }), dtS: fc.double({ min: 0, max: 600, noNaN: true }) }), { minLength: 1, maxLength: 40 }),
        (layup, model, constraint, path) => {
          const params = study({ layup: { plies: layup }, constraint }, { modulus: { ...ref.resin.modulus, model } });
          const state = createMechanics(params, plyPoints(layup));
          let T = 300;
          let a = 0;
          const steps = path.map((s) => {
            T = Math.min(600, Math.max(250, T + s.dT));
            a = Math.min(0.999, a + s.dA);
            return { TK: T, alpha: a, dtS: s.dtS };
          });
          const last = drive(state, params, steps);
          demould(state, last.TK, last.alpha, last.tgK);
          const r = mechanicsResult(state, params);
          const all = [r.curvature.kx, r.curvature.ky, r.curvature.kxy, r.warpageMm, r.springInDeg, r.resinModulusMidPa,
            ...r.plyStresses.sigma1Pa, ...r.plyStresses.sigma2Pa, ...r.plyStresses.tau12Pa];
          return all.every(Number.isFinite);
        },
      ),
      { numRuns: 300 },
    );
  });
});
