import { describe, expect, it } from 'vitest';
import { expectClose } from './test-support/expect-close';
import { laminateCte, radfordDiefendorfSpringInDeg, springInDeg, stripWarpageM, type ThroughThicknessPly } from './distortion';

// Hyer (1998) property set with ν23 = 0.45 (our choice for the through-thickness check).
const ply = (angleDeg: number): ThroughThicknessPly => ({
  angleDeg,
  thicknessM: 0.15e-3,
  e1Pa: 155e9,
  e2Pa: 12.1e9,
  g12Pa: 4.4e9,
  nu12: 0.248,
  nu23: 0.45,
});
const A1 = -0.018e-6;
const A2 = 24.3e-6;

describe('spring-in', () => {
  it('gives the Radford–Diefendorf values without and with shrinkage', () => {
    // θ 90°, α_I 2e-6, α_T 30e-6 /K, ΔT −150 K: 0.3797°; with φ_I −1e-4, φ_T −5e-3: 0.8229°
    // (Radford & Diefendorf 1993 formula). Tolerance: half a unit in the printed digit.
    expectClose(radfordDiefendorfSpringInDeg(90, 2e-6, 30e-6, -150, 0, 0), 0.3797, 0, 5e-5);
    expectClose(radfordDiefendorfSpringInDeg(90, 2e-6, 30e-6, -150, -1e-4, -5e-3), 0.8229, 0, 5e-5);
  });

  it('is zero when the laminate expands alike in plane and through the thickness', () => {
    // Radford & Diefendorf 1993: spring-in comes only from the anisotropy of the free strains.
    expect(springInDeg(90, -3e-3, -3e-3, -2e-3, -2e-3)).toBe(0);
  });
});

describe('warpage', () => {
  it('is the shallow-arc sagitta κL²/8', () => {
    // Geometry of a circular arc: sagitta R − √(R² − L²/4) → L²/(8R) for a shallow arc.
    const kappa = 0.1;
    const span = 0.3;
    const R = 1 / kappa;
    expectClose(stripWarpageM(kappa, span), R - Math.sqrt(R * R - (span * span) / 4), 1e-4);
    expectClose(stripWarpageM(kappa, span), 1.125e-3, 1e-12);
  });
});

describe('laminate effective CTE', () => {
  it('is the ply CTE along and across the fibres for a unidirectional laminate', () => {
    // Nothing constrains a unidirectional laminate's free expansion: α_I = α1 and α_T = α3 = α2.
    const cte = laminateCte([ply(0), ply(0), ply(0)], A1, A2);
    expectClose(cte.inPlane[0], A1, 1e-9);
    expectClose(cte.inPlane[1], A2, 1e-9);
    expectClose(cte.throughThickness, A2, 1e-9);
  });

  it('matches the closed form of a symmetric cross-ply', () => {
    // [0/90]S with equal plies: εx = εy = ε, and Nx = 0 gives
    // ε = (Q11 α1 + Q12 (α1 + α2) + Q22 α2) / (Q11 + 2 Q12 + Q22) (derived by hand from CLT, Hyer 1998 set);
    // each ply then carries σ1 = Q11(ε − α1) + Q12(ε − α2), σ2 = Q12(ε − α1) + Q22(ε − α2) in its own axes, and
    // ε3 = α2 − (ν13/E1) σ1 − (ν23/E2) σ2 with ν13 = ν12.
    const p = ply(0);
    const d = 1 - (p.nu12 * p.nu12 * p.e2Pa) / p.e1Pa;
    const Q11 = p.e1Pa / d;
    const Q22 = p.e2Pa / d;
    const Q12 = (p.nu12 * p.e2Pa) / d;
    const eps = (Q11 * A1 + Q12 * (A1 + A2) + Q22 * A2) / (Q11 + 2 * Q12 + Q22);
    const s1 = Q11 * (eps - A1) + Q12 * (eps - A2);
    const s2 = Q12 * (eps - A1) + Q22 * (eps - A2);
    const eps3 = A2 - (p.nu12 / p.e1Pa) * s1 - (p.nu23 / p.e2Pa) * s2;
    const cte = laminateCte([ply(0), ply(90), ply(90), ply(0)], A1, A2);
    expectClose(cte.inPlane[0], eps, 1e-9);
    expectClose(cte.inPlane[1], eps, 1e-9);
    expectClose(cte.throughThickness, eps3, 1e-9);
    // The in-plane constraint squeezes more expansion out through the thickness (common practice, no source).
    expect(cte.throughThickness).toBeGreaterThan(A2);
    for (const k of [0, 1, 2]) expect(Math.abs(cte.curvature[k])).toBeLessThan(1e-12);
  });

  it('is isotropic in plane for a quasi-isotropic laminate', () => {
    // [0/45/−45/90]S is in-plane isotropic (Tsai & Pagano 1968 (memory)): α_x = α_y, no shear coupling.
    const cte = laminateCte([0, 45, -45, 90, 90, -45, 45, 0].map(ply), A1, A2);
    expectClose(cte.inPlane[0], cte.inPlane[1], 1e-9);
    expect(Math.abs(cte.inPlane[2])).toBeLessThan(1e-15);
  });
});
