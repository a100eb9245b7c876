// Ply properties from fibre and resin (SI throughout).
//   E1, ν12: rule of mixtures.
//   E2 (ξ = 2) and G12 (ξ = 1): Halpin–Tsai (Halpin & Kardos, Polym. Eng. Sci. 16, 1976), or Chamis
//   (NASA TM-83320, 1983) as an option.
//   α1, α2: Schapery (J. Compos. Mater. 2, 1968). The ply's chemical strains use the same formulas with the
//   resin's shrinkage strain in place of α_m·ΔT and zero fibre shrinkage, so they come out as two
//   coefficients β1, β2 that multiply the resin's linear shrinkage strain.

export interface FibreSI {
  e1Pa: number;
  e2Pa: number;
  g12Pa: number;
  nu12: number;
  /** transverse Poisson ratio of the fibre; ν12 stands in when the card has none */
  nu23: number;
  cte1PerK: number;
  cte2PerK: number;
}

export interface MatrixSI {
  ePa: number;
  nu: number;
  ctePerK: number;
}

export type TransverseModel = 'halpin-tsai' | 'chamis';

/** Orthotropic ply in its own axes (1 along the fibre, 3 through the thickness; transversely isotropic). */
export interface PlyProperties {
  e1Pa: number;
  e2Pa: number;
  g12Pa: number;
  nu12: number;
  /** ply ν23, by rule of mixtures of the fibre's ν23 and the resin's ν (a simple estimate, used only through the thickness) */
  nu23: number;
  cte1PerK: number;
  cte2PerK: number;
  /** chemical strain of the ply along 1 per unit linear shrinkage strain of the resin */
  chem1: number;
  /** chemical strain of the ply along 2 (and 3) per unit linear shrinkage strain of the resin */
  chem2: number;
}

/** Halpin–Tsai: M/M_m = (1 + ξηV_f)/(1 − ηV_f), η = (M_f/M_m − 1)/(M_f/M_m + ξ). */
export function halpinTsai(fibre: number, matrix: number, vf: number, xi: number): number {
  if (!(matrix > 0)) return 0;
  const ratio = fibre / matrix;
  const eta = (ratio - 1) / (ratio + xi);
  return (matrix * (1 + xi * eta * vf)) / (1 - eta * vf);
}

/** Chamis: M = M_m / (1 − √V_f (1 − M_m/M_f)). */
export function chamis(fibre: number, matrix: number, vf: number): number {
  if (!(matrix > 0)) return 0;
  return matrix / (1 - Math.sqrt(vf) * (1 - matrix / fibre));
}

/**
 * Free-strain coefficients of the ply for a resin of modulus E_m, written into out[0..3]:
 * α1, α2 (Schapery 1968) and the chemical coefficients β1, β2 from the same formulas with a unit resin
 * strain and a fibre that does not shrink:
 *   α1 = (E_f1 α_f1 V_f + E_m α_m V_m) / E1,   α2 = (1 + ν_f) α_f2 V_f + (1 + ν_m) α_m V_m − α1 ν12,
 *   β1 = E_m V_m / E1,                          β2 = (1 + ν_m) V_m − β1 ν12.
 * Allocation-free: the mechanics step calls it per point with the resin's effective modulus over the step.
 */
export function freeStrainCoefficients(fibre: FibreSI, matrixEPa: number, matrixNu: number, matrixCte: number, vf: number, out: Float64Array): void {
  const vm = 1 - vf;
  const e1 = fibre.e1Pa * vf + matrixEPa * vm;
  const nu12 = fibre.nu12 * vf + matrixNu * vm;
  const cte1 = (fibre.e1Pa * fibre.cte1PerK * vf + matrixEPa * matrixCte * vm) / e1;
  const chem1 = (matrixEPa * vm) / e1;
  out[0] = cte1;
  out[1] = (1 + fibre.nu12) * fibre.cte2PerK * vf + (1 + matrixNu) * matrixCte * vm - cte1 * nu12;
  out[2] = chem1;
  out[3] = (1 + matrixNu) * vm - chem1 * nu12;
}

/**
 * Ply properties for one resin modulus. The viscoelastic ply uses this twice, with E_m = E_u (unrelaxed) and
 * E_m = E∞ (relaxed); the difference relaxes with the resin's normalised spectrum (shared/solver/README.md, "Two ply stiffnesses").
 */
export function plyProperties(fibre: FibreSI, matrix: MatrixSI, vf: number, transverse: TransverseModel = 'halpin-tsai'): PlyProperties {
  if (!(vf > 0 && vf < 1)) throw new RangeError(`fibreVolumeFraction: ${String(vf)} is out of range: allowed > 0 and < 1`);
  const vm = 1 - vf;
  const e1Pa = fibre.e1Pa * vf + matrix.ePa * vm;
  const nu12 = fibre.nu12 * vf + matrix.nu * vm;
  const gm = matrix.ePa / (2 * (1 + matrix.nu));
  const e2Pa = transverse === 'chamis' ? chamis(fibre.e2Pa, matrix.ePa, vf) : halpinTsai(fibre.e2Pa, matrix.ePa, vf, 2);
  const g12Pa = transverse === 'chamis' ? chamis(fibre.g12Pa, gm, vf) : halpinTsai(fibre.g12Pa, gm, vf, 1);
  const coeff = new Float64Array(4);
  freeStrainCoefficients(fibre, matrix.ePa, matrix.nu, matrix.ctePerK, vf, coeff);
  return {
    e1Pa,
    e2Pa,
    g12Pa,
    nu12,
    nu23: fibre.nu23 * vf + matrix.nu * vm,
    cte1PerK: coeff[0],
    cte2PerK: coeff[1],
    chem1: coeff[2],
    chem2: coeff[3],
  };
}

/**
 * Linear shrinkage strain of the resin at cure α: volume change linear in α, ΔV/V = −S·α, turned into a
 * linear strain by (1 + ΔV/V)^(1/3) − 1. S is the total volumetric shrinkage as a fraction.
 */
export function resinShrinkageStrain(alpha: number, totalVolumetricShrinkage: number): number {
  const a = alpha < 0 ? 0 : alpha > 1 ? 1 : alpha;
  return Math.cbrt(1 - totalVolumetricShrinkage * a) - 1;
}
