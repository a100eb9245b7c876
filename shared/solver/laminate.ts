// Classical and incremental lamination theory (SI). Plies bottom to top, z up from the mid-plane,
// ε(z) = ε⁰ + z κ, engineering shear strain. Plane-stress stiffnesses are stored as six numbers in the order
// [11, 12, 16, 22, 26, 66].
//
// The incremental form (shared/solver/README.md, "Laminate"): every ply has two integration points, at its bottom and top faces;
// stresses vary linearly between them, so the resultants are exact for uniform plies. Each step solves
//   Σ ∫ [σ_old + Q_eff (φ(Δε⁰ + zΔκ) − Δε_free) + Σ (eᵢ − 1) hᵢ] {1, z} dz = 0,  Q_eff = Q̄∞ + Σ sᵢ gᵢ ΔQ̄
// for Δε⁰, Δκ (6×6). Writing the old stress in keeps the laminate in equilibrium without drift and turns a
// tool release into an ordinary step. Growing stiffness enters incrementally: the current stiffness
// multiplies only the current increment; old stress is never rescaled. φ = 1 except in the step where a point
// gels: it then takes up only the part of the step's strain after the crossing, so a gel front is not
// rounded to whole steps.

/** Fraction of its unrelaxed stiffness an ungelled point keeps so the equations stay solvable; it carries no stress. */
export const LIQUID_STIFFNESS_FRACTION = 1e-6;
// The hot loop reads a module-private copy: an exported binding of an ES module is not folded by V8 and a
// number read from it is boxed (kinetics.ts says more).
const LIQUID = LIQUID_STIFFNESS_FRACTION;

// --- Ply stiffness and rotation -------------------------------------------------------------------------

/** Position of entry (i, j) of the symmetric 3×3 stiffness in the six-number storage. */
const FULL_INDEX = [0, 1, 2, 1, 3, 4, 2, 4, 5];

/** Reduced stiffness Q of an orthotropic ply in its own axes (plane stress). */
export function plyStiffness(e1Pa: number, e2Pa: number, g12Pa: number, nu12: number, out = new Float64Array(6)): Float64Array {
  const nu21 = (nu12 * e2Pa) / e1Pa;
  const d = 1 - nu12 * nu21;
  out[0] = e1Pa / d;
  out[1] = (nu12 * e2Pa) / d;
  out[2] = 0;
  out[3] = e2Pa / d;
  out[4] = 0;
  out[5] = g12Pa;
  return out;
}

function full3(q: ArrayLike<number>, o: number): number[] {
  return FULL_INDEX.map((j) => q[o + j]);
}

function mul3(a: number[], b: number[]): number[] {
  const c = new Array<number>(9).fill(0);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) c[3 * i + j] += a[3 * i + k] * b[3 * k + j];
  return c;
}

/** Stress transformation T(θ): laminate-axis stress to ply-axis stress. */
function stressTransform(angleDeg: number): number[] {
  const t = (angleDeg * Math.PI) / 180;
  const c = Math.cos(t);
  const s = Math.sin(t);
  return [c * c, s * s, 2 * s * c, s * s, c * c, -2 * s * c, -s * c, s * c, c * c - s * s];
}

/**
 * Q̄ = T⁻¹ Q R T R⁻¹ with Reuter's matrix R = diag(1, 1, 2) (Reuter, J. Compos. Mater. 5, 1971 (memory)):
 * R turns engineering shear strain into tensor shear so one transformation serves stress and strain.
 * Runs once per ply and material state, so clarity wins over a hand-expanded form.
 */
export function rotateStiffness(q: ArrayLike<number>, angleDeg: number, out = new Float64Array(6), qOffset = 0, outOffset = 0): Float64Array {
  const T = stressTransform(angleDeg);
  const Tinv = stressTransform(-angleDeg);
  const R = [1, 0, 0, 0, 1, 0, 0, 0, 2];
  const Rinv = [1, 0, 0, 0, 1, 0, 0, 0, 0.5];
  const qb = mul3(mul3(mul3(mul3(Tinv, full3(q, qOffset)), R), T), Rinv);
  out[outOffset] = qb[0];
  out[outOffset + 1] = 0.5 * (qb[1] + qb[3]);
  out[outOffset + 2] = 0.5 * (qb[2] + qb[6]);
  out[outOffset + 3] = qb[4];
  out[outOffset + 4] = 0.5 * (qb[5] + qb[7]);
  out[outOffset + 5] = qb[8];
  return out;
}

/** Free strain given in ply axes (γ12 = 0) to laminate axes, engineering shear; written at out[o..o+2]. */
export function plyFreeStrainToLaminate(eps1: number, eps2: number, cos: number, sin: number, out: Float64Array, o: number): void {
  out[o] = cos * cos * eps1 + sin * sin * eps2;
  out[o + 1] = sin * sin * eps1 + cos * cos * eps2;
  out[o + 2] = 2 * sin * cos * (eps1 - eps2);
}

/** Laminate-axis stress (σx, σy, τxy) to ply axes (σ1, σ2, τ12). */
export function stressToPlyAxes(sx: number, sy: number, txy: number, angleDeg: number, out: Float64Array, o = 0): void {
  const T = stressTransform(angleDeg);
  out[o] = T[0] * sx + T[1] * sy + T[2] * txy;
  out[o + 1] = T[3] * sx + T[4] * sy + T[5] * txy;
  out[o + 2] = T[6] * sx + T[7] * sy + T[8] * txy;
}

/** σ += Q ε for a stiffness stored as six numbers at q[o]. */
function addProduct(q: Float64Array, o: number, ex: number, ey: number, gxy: number, scale: number, out: Float64Array, oo: number): void {
  out[oo] += scale * (q[o] * ex + q[o + 1] * ey + q[o + 2] * gxy);
  out[oo + 1] += scale * (q[o + 1] * ex + q[o + 3] * ey + q[o + 4] * gxy);
  out[oo + 2] += scale * (q[o + 2] * ex + q[o + 4] * ey + q[o + 5] * gxy);
}

// --- Geometry --------------------------------------------------------------------------------------------

export interface LaminateGeometry {
  plyCount: number;
  thicknessM: number;
  /** ply faces, z from the mid-plane (bottom ply first) */
  zBottomM: Float64Array;
  zTopM: Float64Array;
  /** integration points: two per ply, bottom then top face */
  pointZM: Float64Array;
  /** weights for ∫σ dz and ∫σ z dz with σ linear between a ply's two points */
  w0: Float64Array;
  w1: Float64Array;
}

export function laminateGeometry(thicknessesM: ArrayLike<number>): LaminateGeometry {
  const n = thicknessesM.length;
  let total = 0;
  for (let k = 0; k < n; k++) total += thicknessesM[k];
  const g: LaminateGeometry = {
    plyCount: n,
    thicknessM: total,
    zBottomM: new Float64Array(n),
    zTopM: new Float64Array(n),
    pointZM: new Float64Array(2 * n),
    w0: new Float64Array(2 * n),
    w1: new Float64Array(2 * n),
  };
  let z = -total / 2;
  for (let k = 0; k < n; k++) {
    const t = thicknessesM[k];
    const zb = z;
    g.zBottomM[k] = zb;
    g.zTopM[k] = zb + t;
    g.pointZM[2 * k] = zb;
    g.pointZM[2 * k + 1] = zb + t;
    // ∫(1 − s) dz, ∫ s dz and ∫(1 − s) z dz, ∫ s z dz over the ply, z = zb + s t.
    g.w0[2 * k] = t / 2;
    g.w0[2 * k + 1] = t / 2;
    g.w1[2 * k] = t * (zb / 2 + t / 6);
    g.w1[2 * k + 1] = t * (zb / 2 + t / 3);
    z += t;
  }
  return g;
}

// --- 6×6 solve -------------------------------------------------------------------------------------------

/** Solve K x = b (6×6, row-major) by Gaussian elimination with partial pivoting; K and b are overwritten. */
export function solve6(K: Float64Array, b: Float64Array, x: Float64Array): void {
  for (let c = 0; c < 6; c++) {
    let p = c;
    for (let r = c + 1; r < 6; r++) if (Math.abs(K[6 * r + c]) > Math.abs(K[6 * p + c])) p = r;
    if (!(Math.abs(K[6 * p + c]) > 0)) throw new RangeError('laminate stiffness is singular: no ply carries load in some direction');
    if (p !== c) {
      for (let j = 0; j < 6; j++) {
        const t = K[6 * c + j];
        K[6 * c + j] = K[6 * p + j];
        K[6 * p + j] = t;
      }
      const t = b[c];
      b[c] = b[p];
      b[p] = t;
    }
    for (let r = c + 1; r < 6; r++) {
      const f = K[6 * r + c] / K[6 * c + c];
      if (f === 0) continue;
      for (let j = c; j < 6; j++) K[6 * r + j] -= f * K[6 * c + j];
      b[r] -= f * b[c];
    }
  }
  for (let r = 5; r >= 0; r--) {
    let s = b[r];
    for (let j = r + 1; j < 6; j++) s -= K[6 * r + j] * x[j];
    x[r] = s / K[6 * r + r];
  }
}

// --- Classical (elastic) lamination theory ----------------------------------------------------------------

/** ABD matrix (row-major 6×6: [A B; B D]) from Q̄ per ply (six numbers each). */
export function abdMatrix(geometry: LaminateGeometry, qbar: Float64Array, out = new Float64Array(36)): Float64Array {
  out.fill(0);
  for (let k = 0; k < geometry.plyCount; k++) {
    const zb = geometry.zBottomM[k];
    const zt = geometry.zTopM[k];
    const a = zt - zb;
    const b = (zt * zt - zb * zb) / 2;
    const d = (zt * zt * zt - zb * zb * zb) / 3;
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        const q = qbar[6 * k + FULL_INDEX[3 * i + j]];
        out[6 * i + j] += q * a;
        out[6 * i + j + 3] += q * b;
        out[6 * (i + 3) + j] += q * b;
        out[6 * (i + 3) + j + 3] += q * d;
      }
    }
  }
  return out;
}

/**
 * Mid-plane strain and curvature [ε⁰x, ε⁰y, γ⁰xy, κx, κy, κxy] of a free elastic laminate whose plies have
 * uniform free strains (laminate axes, three per ply): ABD x = {N_T, M_T}.
 */
export function elasticFreeResponse(geometry: LaminateGeometry, qbar: Float64Array, freeStrain: Float64Array, out = new Float64Array(6)): Float64Array {
  const K = abdMatrix(geometry, qbar);
  const rhs = new Float64Array(6);
  const n = new Float64Array(3);
  for (let k = 0; k < geometry.plyCount; k++) {
    const zb = geometry.zBottomM[k];
    const zt = geometry.zTopM[k];
    n.fill(0);
    addProduct(qbar, 6 * k, freeStrain[3 * k], freeStrain[3 * k + 1], freeStrain[3 * k + 2], 1, n, 0);
    for (let i = 0; i < 3; i++) {
      rhs[i] += n[i] * (zt - zb);
      rhs[i + 3] += (n[i] * (zt * zt - zb * zb)) / 2;
    }
  }
  solve6(K, rhs, out);
  return out;
}

/** Laminate-axis stress at height z in ply k of an elastic laminate: Q̄ (ε⁰ + zκ − ε_free). */
export function elasticPlyStress(qbar: Float64Array, k: number, strain: Float64Array, zM: number, freeStrain: Float64Array, out = new Float64Array(3)): Float64Array {
  out.fill(0);
  addProduct(
    qbar,
    6 * k,
    strain[0] + zM * strain[3] - freeStrain[3 * k],
    strain[1] + zM * strain[4] - freeStrain[3 * k + 1],
    strain[2] + zM * strain[5] - freeStrain[3 * k + 2],
    1,
    out,
    0,
  );
  return out;
}

// --- Incremental viscoelastic laminate --------------------------------------------------------------------

export interface IncrementalLaminate {
  geometry: LaminateGeometry;
  termCount: number;
  /** relaxed stiffness Q̄∞ and relaxing part ΔQ̄ = Q̄_u − Q̄∞ per ply (six numbers each) */
  qRelaxed: Float64Array;
  qRelaxing: Float64Array;
  /** stress state per point: σ∞ (3) and hᵢ (3 per term), Pa */
  sigmaRelaxed: Float64Array;
  h: Float64Array;
  /** total stress per point, σ∞ + Σ hᵢ (laminate axes), kept with the update */
  stress: Float64Array;
  // Inputs for the next step, written by the caller:
  /** 1 where the point carries stress (gelled resin), 0 where it is liquid */
  active: Uint8Array;
  /** eᵢ per point and term */
  e: Float64Array;
  /** sᵢ·gᵢ per point and term: the term's share of ΔQ̄ times its step factor */
  sg: Float64Array;
  /** free-strain increment Δε_free per point, laminate axes */
  freeStrain: Float64Array;
  /**
   * Share φ of the step's laminate strain increment (Δε⁰ + zΔκ) a point takes up: 1, except in the step where
   * the point gels, where it is the part of the step after the crossing (the strain is taken linear in time
   * over the step). Kept at 1 unless the caller writes it.
   */
  strainShare: Float64Array;
  // Accumulated kinematics:
  midPlaneStrain: Float64Array;
  curvature: Float64Array;
  /** increments of the last step: [Δε⁰ (3), Δκ (3)] */
  lastIncrement: Float64Array;
  /** plies with identical stiffness share a group: the 6×6 is assembled per group, not per point */
  plyGroup: Int32Array;
  groupFirstPly: Int32Array;
  // Scratch, allocated once:
  /** Σ sᵢ gᵢ per point: the relaxing stiffness's share in Q_eff this step */
  share: Float64Array;
  groupWeights: Float64Array;
  history: Float64Array;
  K: Float64Array;
  rhs: Float64Array;
  x: Float64Array;
}

export function createIncrementalLaminate(geometry: LaminateGeometry, qRelaxed: Float64Array, qRelaxing: Float64Array, termCount: number): IncrementalLaminate {
  const points = 2 * geometry.plyCount;
  const plyGroup = new Int32Array(geometry.plyCount);
  const firsts: number[] = [];
  for (let k = 0; k < geometry.plyCount; k++) {
    let g = firsts.findIndex((f) => {
      for (let j = 0; j < 6; j++) if (qRelaxed[6 * f + j] !== qRelaxed[6 * k + j] || qRelaxing[6 * f + j] !== qRelaxing[6 * k + j]) return false;
      return true;
    });
    if (g < 0) g = firsts.push(k) - 1;
    plyGroup[k] = g;
  }
  return {
    geometry,
    termCount,
    qRelaxed,
    qRelaxing,
    sigmaRelaxed: new Float64Array(3 * points),
    h: new Float64Array(3 * points * termCount),
    stress: new Float64Array(3 * points),
    active: new Uint8Array(points),
    e: new Float64Array(points * termCount),
    sg: new Float64Array(points * termCount),
    freeStrain: new Float64Array(3 * points),
    strainShare: new Float64Array(points).fill(1),
    midPlaneStrain: new Float64Array(3),
    curvature: new Float64Array(3),
    lastIncrement: new Float64Array(6),
    plyGroup,
    groupFirstPly: Int32Array.from(firsts),
    share: new Float64Array(points),
    groupWeights: new Float64Array(8 * firsts.length),
    history: new Float64Array(3 * points),
    K: new Float64Array(36),
    rhs: new Float64Array(6),
    x: new Float64Array(6),
  };
}

/** Current stress at point p (laminate axes): σ∞ + Σ hᵢ. */
export function pointStress(lam: IncrementalLaminate, p: number, out: Float64Array, o = 0): void {
  out[o] = lam.stress[3 * p];
  out[o + 1] = lam.stress[3 * p + 1];
  out[o + 2] = lam.stress[3 * p + 2];
}

/** Force and moment resultants [Nx, Ny, Nxy, Mx, My, Mxy] of the current stresses (N/m, N). */
export function stressResultants(lam: IncrementalLaminate, out = new Float64Array(6)): Float64Array {
  out.fill(0);
  const s = lam.x;
  const g = lam.geometry;
  for (let p = 0; p < 2 * g.plyCount; p++) {
    pointStress(lam, p, s, 0);
    for (let i = 0; i < 3; i++) {
      out[i] += g.w0[p] * s[i];
      out[i + 3] += g.w1[p] * s[i];
    }
  }
  return out;
}

/**
 * One step. `held`: the mid-plane strain follows `heldStrainIncrement` (equal in x and y, no shear) and the
 * curvature is restrained (tool-held); otherwise the laminate is free and in equilibrium with no load.
 */
export function laminateStep(lam: IncrementalLaminate, held: boolean, heldStrainIncrement = 0): void {
  const g = lam.geometry;
  const points = 2 * g.plyCount;
  const m = lam.termCount;
  const { share, history, K, rhs, x } = lam;

  // The relaxing stiffness's share and the history term Σ(eᵢ − 1)hᵢ per point.
  for (let p = 0; p < points; p++) {
    const oh = 3 * p;
    if (!lam.active[p]) {
      share[p] = 0;
      history[oh] = history[oh + 1] = history[oh + 2] = 0;
      continue;
    }
    let sgSum = 0;
    let hx = 0;
    let hy = 0;
    let hxy = 0;
    for (let i = 0; i < m; i++) {
      const t = p * m + i;
      sgSum += lam.sg[t];
      const em1 = lam.e[t] - 1;
      hx += em1 * lam.h[3 * t];
      hy += em1 * lam.h[3 * t + 1];
      hxy += em1 * lam.h[3 * t + 2];
    }
    share[p] = sgSum;
    history[oh] = hx;
    history[oh + 1] = hy;
    history[oh + 2] = hxy;
  }

  const inc = lam.lastIncrement;
  if (held) {
    inc[0] = heldStrainIncrement;
    inc[1] = heldStrainIncrement;
    inc[2] = inc[3] = inc[4] = inc[5] = 0;
  } else {
    // Assemble [A B; B' D] {Δε⁰; H·Δκ} = r, with moment rows divided by H and curvature scaled by H so all
    // entries share one magnitude (H the laminate thickness). Q_eff = Q̄∞ + share·ΔQ̄ (a liquid point keeps
    // LIQUID_STIFFNESS_FRACTION of Q̄∞ + ΔQ̄), so the matrix needs only four weights per stiffness and group.
    const H = g.thicknessM;
    const gw = lam.groupWeights;
    gw.fill(0);
    rhs.fill(0);
    const r = x; // scratch 3-vector for one point's right-hand side
    for (let p = 0; p < points; p++) {
      const o = 6 * (p >> 1);
      const zH = g.pointZM[p] / H;
      const a0 = g.w0[p];
      const a1 = g.w1[p] / H;
      const active = lam.active[p] === 1;
      // A point that gels inside the step takes up only the share φ of the step's strain increment; the
      // floor keeps the matrix solvable when every stress-carrying point gelled at the very end of the step.
      const phi = active ? Math.max(lam.strainShare[p], LIQUID) : 0;
      const cR = active ? phi : LIQUID;
      const cD = active ? share[p] * phi : LIQUID;
      const b = 8 * lam.plyGroup[p >> 1];
      gw[b] += a0 * cR;
      gw[b + 1] += a0 * zH * cR;
      gw[b + 2] += a1 * cR;
      gw[b + 3] += a1 * zH * cR;
      gw[b + 4] += a0 * cD;
      gw[b + 5] += a0 * zH * cD;
      gw[b + 6] += a1 * cD;
      gw[b + 7] += a1 * zH * cD;
      if (!active) continue;
      // r = Q_eff Δε_free − Σ(eᵢ − 1)hᵢ − σ_old
      const fx = lam.freeStrain[3 * p];
      const fy = lam.freeStrain[3 * p + 1];
      const fxy = lam.freeStrain[3 * p + 2];
      r[0] = r[1] = r[2] = 0;
      addProduct(lam.qRelaxed, o, fx, fy, fxy, 1, r, 0);
      addProduct(lam.qRelaxing, o, fx, fy, fxy, share[p], r, 0);
      for (let i = 0; i < 3; i++) {
        const ri = r[i] - history[3 * p + i] - lam.stress[3 * p + i];
        rhs[i] += a0 * ri;
        rhs[i + 3] += a1 * ri;
      }
    }
    K.fill(0);
    for (let grp = 0; grp < lam.groupFirstPly.length; grp++) {
      const o = 6 * lam.groupFirstPly[grp];
      const b = 8 * grp;
      for (let i = 0; i < 3; i++) {
        for (let j = 0; j < 3; j++) {
          const qr = lam.qRelaxed[o + FULL_INDEX[3 * i + j]];
          const qd = lam.qRelaxing[o + FULL_INDEX[3 * i + j]];
          K[6 * i + j] += gw[b] * qr + gw[b + 4] * qd;
          K[6 * i + j + 3] += gw[b + 1] * qr + gw[b + 5] * qd;
          K[6 * (i + 3) + j] += gw[b + 2] * qr + gw[b + 6] * qd;
          K[6 * (i + 3) + j + 3] += gw[b + 3] * qr + gw[b + 7] * qd;
        }
      }
    }
    solve6(K, rhs, x);
    inc[0] = x[0];
    inc[1] = x[1];
    inc[2] = x[2];
    inc[3] = x[3] / H;
    inc[4] = x[4] / H;
    inc[5] = x[5] / H;
  }

  // Update the stress state of every stress-carrying point.
  for (let p = 0; p < points; p++) {
    if (!lam.active[p]) continue;
    const o = 6 * (p >> 1);
    const z = g.pointZM[p];
    const phi = Math.max(lam.strainShare[p], LIQUID);
    const dx = phi * (inc[0] + z * inc[3]) - lam.freeStrain[3 * p];
    const dy = phi * (inc[1] + z * inc[4]) - lam.freeStrain[3 * p + 1];
    const dxy = phi * (inc[2] + z * inc[5]) - lam.freeStrain[3 * p + 2];
    addProduct(lam.qRelaxed, o, dx, dy, dxy, 1, lam.sigmaRelaxed, 3 * p);
    const qd = lam.qRelaxing;
    const vx = qd[o] * dx + qd[o + 1] * dy + qd[o + 2] * dxy;
    const vy = qd[o + 1] * dx + qd[o + 3] * dy + qd[o + 4] * dxy;
    const vxy = qd[o + 2] * dx + qd[o + 4] * dy + qd[o + 5] * dxy;
    let sx = lam.sigmaRelaxed[3 * p];
    let sy = lam.sigmaRelaxed[3 * p + 1];
    let sxy = lam.sigmaRelaxed[3 * p + 2];
    for (let i = 0; i < m; i++) {
      const t = p * m + i;
      const e = lam.e[t];
      const sg = lam.sg[t];
      sx += lam.h[3 * t] = e * lam.h[3 * t] + sg * vx;
      sy += lam.h[3 * t + 1] = e * lam.h[3 * t + 1] + sg * vy;
      sxy += lam.h[3 * t + 2] = e * lam.h[3 * t + 2] + sg * vxy;
    }
    lam.stress[3 * p] = sx;
    lam.stress[3 * p + 1] = sy;
    lam.stress[3 * p + 2] = sxy;
  }
  for (let i = 0; i < 3; i++) {
    lam.midPlaneStrain[i] += inc[i];
    lam.curvature[i] += inc[i + 3];
  }
}
