import { describe, expect, it } from 'vitest';
import { expectClose } from './test-support/expect-close';
import {
  abdMatrix,
  createIncrementalLaminate,
  elasticFreeResponse,
  elasticPlyStress,
  laminateGeometry,
  laminateStep,
  plyFreeStrainToLaminate,
  plyStiffness,
  pointStress,
  rotateStiffness,
  stressResultants,
  type IncrementalLaminate,
} from './laminate';

// Hyer, Stress Analysis of Fiber-Reinforced Composite Materials (1998), property set:
// E1 155, E2 12.1, G12 4.4 GPa, ν12 0.248, α1 −0.018e-6, α2 24.3e-6 /K, ply 0.15 mm, ΔT −150 K.
const HYER = { e1: 155e9, e2: 12.1e9, g12: 4.4e9, nu12: 0.248, a1: -0.018e-6, a2: 24.3e-6, t: 0.15e-3 };
const DT = -150;

function hyerLaminate(angles: number[]) {
  const q = plyStiffness(HYER.e1, HYER.e2, HYER.g12, HYER.nu12);
  const geometry = laminateGeometry(angles.map(() => HYER.t));
  const qbar = new Float64Array(6 * angles.length);
  const free = new Float64Array(3 * angles.length);
  angles.forEach((a, k) => {
    rotateStiffness(q, a, qbar, 0, 6 * k);
    const r = (a * Math.PI) / 180;
    plyFreeStrainToLaminate(HYER.a1 * DT, HYER.a2 * DT, Math.cos(r), Math.sin(r), free, 3 * k);
  });
  return { geometry, qbar, free };
}

/** The same laminate through the incremental path, elastic (no relaxing part), cooled in `steps` equal steps. */
function incrementalCooldown(angles: number[], steps: number): IncrementalLaminate {
  const { geometry, qbar, free } = hyerLaminate(angles);
  const lam = createIncrementalLaminate(geometry, qbar, new Float64Array(qbar.length), 0);
  lam.active.fill(1);
  for (let s = 0; s < steps; s++) {
    for (let p = 0; p < 2 * angles.length; p++) for (let i = 0; i < 3; i++) lam.freeStrain[3 * p + i] = free[3 * (p >> 1) + i] / steps;
    laminateStep(lam, false);
  }
  return lam;
}

describe('classical lamination theory', () => {
  it('gives A11, A12, A66 of the Hyer [0/90]T laminate', () => {
    // 25.1859, 0.90458, 1.3200 MN/m: Hyer (1998) property set, values by classical lamination theory.
    const { geometry, qbar } = hyerLaminate([0, 90]);
    const abd = abdMatrix(geometry, qbar);
    expectClose(abd[0] / 1e6, 25.1859, 5e-6);
    expectClose(abd[1] / 1e6, 0.90458, 5e-6);
    expectClose(abd[6 * 2 + 2] / 1e6, 1.32, 1e-6);
  });

  it('gives the thermal curvatures of the Hyer [0/90]T laminate', () => {
    // κx = −10.832, κy = +10.832 1/m for ΔT = −150 K, 0° ply at the bottom: Hyer (1998) set, CLT.
    const { geometry, qbar, free } = hyerLaminate([0, 90]);
    const x = elasticFreeResponse(geometry, qbar, free);
    expectClose(x[3], -10.832, 5e-5);
    expectClose(x[4], 10.832, 5e-5);
    expect(Math.abs(x[5])).toBeLessThan(1e-9);
  });

  it('gives the residual ply stresses of the Hyer [0/90]S laminate', () => {
    // σx = −39.52 MPa in the 0° plies and +39.52 MPa in the 90° plies: Hyer (1998) set, CLT.
    const { geometry, qbar, free } = hyerLaminate([0, 90, 90, 0]);
    const x = elasticFreeResponse(geometry, qbar, free);
    expectClose(elasticPlyStress(qbar, 0, x, geometry.zBottomM[0], free)[0] / 1e6, -39.52, 2e-4);
    expectClose(elasticPlyStress(qbar, 1, x, geometry.zBottomM[1], free)[0] / 1e6, 39.52, 2e-4);
  });

  it('matches Timoshenko’s bimetal curvature', () => {
    // t1 = t2 = 1 mm, E 200/70 GPa, α 12e-6/23e-6 /K, ΔT +100 K, ν = 0: κ = 0.767123 1/m
    // (Timoshenko, J. Opt. Soc. Am. 11, 1925). Isotropic layers with ν = 0 have Q = diag(E, E, E/2).
    const geometry = laminateGeometry([1e-3, 1e-3]);
    const qbar = new Float64Array(12);
    plyStiffness(200e9, 200e9, 100e9, 0, qbar.subarray(0, 6));
    plyStiffness(70e9, 70e9, 35e9, 0, qbar.subarray(6, 12));
    const free = Float64Array.of(12e-6 * 100, 12e-6 * 100, 0, 23e-6 * 100, 23e-6 * 100, 0);
    const x = elasticFreeResponse(geometry, qbar, free);
    expectClose(x[3], 0.767123, 1e-6);
    expectClose(x[4], 0.767123, 1e-6);
  });

  it('rotates the stiffness as the textbook closed forms', () => {
    // Jones, Mechanics of Composite Materials (1999) (memory): at 45°, Q̄11 = (Q11 + Q22 + 2Q12 + 4Q66)/4 and
    // Q̄16 = (Q11 − Q22)/4; at 90° Q11 and Q22 swap.
    const q = plyStiffness(HYER.e1, HYER.e2, HYER.g12, HYER.nu12);
    const at45 = rotateStiffness(q, 45);
    expectClose(at45[0], (q[0] + q[3] + 2 * q[1] + 4 * q[5]) / 4, 1e-12);
    expectClose(at45[2], (q[0] - q[3]) / 4, 1e-12);
    const at90 = rotateStiffness(q, 90);
    expectClose(at90[0], q[3], 1e-12);
    expectClose(at90[3], q[0], 1e-12);
    expect(Math.abs(at90[2])).toBeLessThan(1e-6 * q[0]);
  });

  it('gives a symmetric balanced laminate no curvature on uniform cool-down', () => {
    // Common practice, no source: B = 0 and a balanced layup has no shear coupling, so a uniform ΔT only shrinks it.
    const { geometry, qbar, free } = hyerLaminate([0, 45, -45, 90, 90, -45, 45, 0]);
    const x = elasticFreeResponse(geometry, qbar, free);
    for (const k of [3, 4, 5]) expect(Math.abs(x[k])).toBeLessThan(1e-9);
    expect(Math.abs(x[2])).toBeLessThan(1e-12);
    expect(x[0]).toBeLessThan(0);
  });
});

describe('incremental lamination theory', () => {
  it.each([1, 7])('reproduces the Hyer [0/90]T curvatures in %s step(s)', (steps) => {
    // Same CLT values (Hyer 1998 set) through the two-point-per-ply incremental path.
    const lam = incrementalCooldown([0, 90], steps);
    expectClose(lam.curvature[0], -10.832, 5e-5);
    expectClose(lam.curvature[1], 10.832, 5e-5);
  });

  it('reproduces the Hyer [0/90]S ply stresses and stays in equilibrium', () => {
    const lam = incrementalCooldown([0, 90, 90, 0], 3);
    const s = new Float64Array(3);
    pointStress(lam, 0, s);
    expectClose(s[0] / 1e6, -39.52, 2e-4);
    pointStress(lam, 3, s);
    expectClose(s[0] / 1e6, 39.52, 2e-4);
    const nm = stressResultants(lam);
    for (let i = 0; i < 3; i++) expect(Math.abs(nm[i])).toBeLessThan(1e-6);
  });

  it('never rescales old stress when the stiffness grows (hypoelastic)', () => {
    // Hypoelastic rule: the current stiffness multiplies only the current increment. A held ply strained at
    // stiffness share 1, then stiffened threefold with no new strain, keeps its stress; a further increment
    // then adds at the new stiffness.
    const geometry = laminateGeometry([1e-3]);
    const qd = plyStiffness(10e9, 5e9, 2e9, 0.3);
    const lam = createIncrementalLaminate(geometry, new Float64Array(6), qd, 1);
    lam.active.fill(1);
    lam.e.fill(1);
    lam.sg.fill(1);
    laminateStep(lam, true, 1e-3);
    const s = new Float64Array(3);
    pointStress(lam, 0, s);
    const before = s[0];
    expectClose(before, (qd[0] + qd[1]) * 1e-3, 1e-12);
    lam.sg.fill(3);
    laminateStep(lam, true, 0);
    pointStress(lam, 0, s);
    expect(s[0]).toBe(before);
    laminateStep(lam, true, 1e-3);
    pointStress(lam, 0, s);
    expectClose(s[0], before + 3 * (qd[0] + qd[1]) * 1e-3, 1e-12);
  });

  it('lets liquid (ungelled) points carry no stress', () => {
    const { geometry, qbar } = hyerLaminate([0, 90]);
    const lam = createIncrementalLaminate(geometry, qbar, new Float64Array(qbar.length), 0);
    lam.active.set([1, 1, 0, 0]);
    lam.freeStrain.fill(-1e-3);
    laminateStep(lam, true, 5e-4);
    const s = new Float64Array(3);
    pointStress(lam, 3, s);
    expect([...s]).toEqual([0, 0, 0]);
    pointStress(lam, 0, s);
    expect(s[0]).toBeGreaterThan(0);
  });

  it('ends where the free laminate ends when an elastic laminate is held, then released', () => {
    // Elastic superposition (common practice, no source): holding the laminate flat while it cools, then
    // releasing it, leaves the same curvature and stresses as cooling it free.
    const { geometry, qbar, free } = hyerLaminate([0, 90]);
    const lam = createIncrementalLaminate(geometry, qbar, new Float64Array(qbar.length), 0);
    lam.active.fill(1);
    for (let p = 0; p < 4; p++) for (let i = 0; i < 3; i++) lam.freeStrain[3 * p + i] = free[3 * (p >> 1) + i];
    laminateStep(lam, true, 23.6e-6 * DT);
    expect([...lam.curvature]).toEqual([0, 0, 0]);
    expect(Math.abs(stressResultants(lam)[0])).toBeGreaterThan(1);
    lam.freeStrain.fill(0);
    laminateStep(lam, false);
    expectClose(lam.curvature[0], -10.832, 5e-5);
    expectClose(lam.curvature[1], 10.832, 5e-5);
    const nm = stressResultants(lam);
    for (let i = 0; i < 6; i++) expect(Math.abs(nm[i])).toBeLessThan(1e-6);
  });
});
