// Part distortion from the laminate state (SI): strip warpage from curvature, corner spring-in by the
// Radford–Diefendorf formula, and the laminate's effective in-plane and through-thickness free strains
// (CTEs when the ply free strains are per kelvin) that the formula needs.
// Through-thickness ply properties follow the usual transversely isotropic assumption: α3 = α2 (and the chemical strain alike), ν13 = ν12.

import { elasticFreeResponse, laminateGeometry, plyFreeStrainToLaminate, rotateStiffness, stressToPlyAxes } from './laminate';

/** Deflection at mid-span relative to the ends of a strip of span L bent to curvature κ: w = κL²/8 (signed). */
export function stripWarpageM(curvaturePerM: number, spanM: number): number {
  return (curvaturePerM * spanM * spanM) / 8;
}

/**
 * Spring-in of a corner of angle θ from the laminate's in-plane (I) and through-thickness (T) free strains,
 * thermal and chemical, accumulated from the stress-free state (Radford & Diefendorf 1993 (memory)):
 *   Δθ = θ [ (ε_I − ε_T)/(1 + ε_T) + (φ_I − φ_T)/(1 + φ_T) ]
 * Positive: the corner closes. With constant CTEs, ε = α ΔT gives the published form.
 */
export function springInDeg(cornerAngleDeg: number, thermalI: number, thermalT: number, chemicalI: number, chemicalT: number): number {
  return cornerAngleDeg * ((thermalI - thermalT) / (1 + thermalT) + (chemicalI - chemicalT) / (1 + chemicalT));
}

/** The published form: Δθ = θ [ (α_I − α_T) ΔT/(1 + α_T ΔT) + (φ_I − φ_T)/(1 + φ_T) ]. */
export function radfordDiefendorfSpringInDeg(cornerAngleDeg: number, alphaI: number, alphaT: number, deltaTK: number, phiI: number, phiT: number): number {
  return springInDeg(cornerAngleDeg, alphaI * deltaTK, alphaT * deltaTK, phiI, phiT);
}

/** One ply for the effective-strain helper: its stiffness in its own axes and its through-thickness compliances. */
export interface ThroughThicknessPly {
  angleDeg: number;
  thicknessM: number;
  e1Pa: number;
  e2Pa: number;
  g12Pa: number;
  nu12: number;
  nu23: number;
}

export interface EffectiveFreeStrain {
  /** mid-plane free strain of the laminate, laminate axes [εx, εy, γxy] */
  inPlane: Float64Array;
  /** thickness-averaged through-thickness strain */
  throughThickness: number;
  /** free curvature [κx, κy, κxy] (zero for a symmetric laminate), 1/m */
  curvature: Float64Array;
}

/**
 * Effective free strain of an elastic, unloaded laminate whose plies have free strains (ε1, ε2) in their own
 * axes, ε3 = ε2. In-plane: the mid-plane strain of the free laminate (classical lamination theory).
 * Through the thickness: each ply's ε3 = ε2_free − (ν13/E1) σ1 − (ν23/E2) σ2 under the ply stresses the
 * constraint of its neighbours sets up (σ3 = 0), averaged over the thickness (σ taken at the ply's mid-height).
 * `plyFree` holds ε1, ε2 per ply.
 */
export function laminateEffectiveFreeStrain(plies: ThroughThicknessPly[], plyFree: ArrayLike<number>): EffectiveFreeStrain {
  const n = plies.length;
  const geometry = laminateGeometry(plies.map((p) => p.thicknessM));
  const qbar = new Float64Array(6 * n);
  const q = new Float64Array(6);
  const free = new Float64Array(3 * n);
  plies.forEach((p, k) => {
    const nu21 = (p.nu12 * p.e2Pa) / p.e1Pa;
    const d = 1 - p.nu12 * nu21;
    q.set([p.e1Pa / d, (p.nu12 * p.e2Pa) / d, 0, p.e2Pa / d, 0, p.g12Pa]);
    rotateStiffness(q, p.angleDeg, qbar, 0, 6 * k);
    const r = (p.angleDeg * Math.PI) / 180;
    plyFreeStrainToLaminate(plyFree[2 * k], plyFree[2 * k + 1], Math.cos(r), Math.sin(r), free, 3 * k);
  });
  const x = elasticFreeResponse(geometry, qbar, free);
  let through = 0;
  const sLam = new Float64Array(3);
  const sPly = new Float64Array(3);
  plies.forEach((p, k) => {
    const zMid = 0.5 * (geometry.zBottomM[k] + geometry.zTopM[k]);
    const ex = x[0] + zMid * x[3] - free[3 * k];
    const ey = x[1] + zMid * x[4] - free[3 * k + 1];
    const gxy = x[2] + zMid * x[5] - free[3 * k + 2];
    const o = 6 * k;
    sLam[0] = qbar[o] * ex + qbar[o + 1] * ey + qbar[o + 2] * gxy;
    sLam[1] = qbar[o + 1] * ex + qbar[o + 3] * ey + qbar[o + 4] * gxy;
    sLam[2] = qbar[o + 2] * ex + qbar[o + 4] * ey + qbar[o + 5] * gxy;
    stressToPlyAxes(sLam[0], sLam[1], sLam[2], p.angleDeg, sPly);
    const eps3 = plyFree[2 * k + 1] - (p.nu12 / p.e1Pa) * sPly[0] - (p.nu23 / p.e2Pa) * sPly[1];
    through += eps3 * p.thicknessM;
  });
  return { inPlane: x.slice(0, 3), throughThickness: through / geometry.thicknessM, curvature: x.slice(3, 6) };
}

/** Effective CTEs of the laminate: the effective free strain per kelvin with ply CTEs (α1, α2, α3 = α2). */
export function laminateCte(plies: ThroughThicknessPly[], cte1PerK: number, cte2PerK: number): EffectiveFreeStrain {
  const free = new Float64Array(2 * plies.length);
  for (let k = 0; k < plies.length; k++) {
    free[2 * k] = cte1PerK;
    free[2 * k + 1] = cte2PerK;
  }
  return laminateEffectiveFreeStrain(plies, free);
}
