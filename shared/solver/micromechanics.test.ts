import { describe, expect, it } from 'vitest';
import { expectClose } from './test-support/expect-close';
import { chamis, halpinTsai, plyProperties, resinShrinkageStrain, type FibreSI, type MatrixSI } from './micromechanics';

// Constituent set of the check: E_f 230 GPa, ν_f 0.30, α_f1 −0.41e-6 /K; E_m 2.9 GPa, ν_m 0.36, α_m 41.4e-6 /K; V_f 0.5.
const fibre: FibreSI = { e1Pa: 230e9, e2Pa: 15e9, g12Pa: 20e9, nu12: 0.3, nu23: 0.3, cte1PerK: -0.41e-6, cte2PerK: 7e-6 };
const matrix: MatrixSI = { ePa: 2.9e9, nu: 0.36, ctePerK: 41.4e-6 };

describe('micromechanics', () => {
  it('gives E1 and ν12 by the rule of mixtures and α1 by Schapery', () => {
    // E1 = 116.45 GPa (rule of mixtures); α1 = 1.1061e-7 /K (Schapery, J. Compos. Mater. 2, 1968).
    const ply = plyProperties(fibre, matrix, 0.5);
    expectClose(ply.e1Pa / 1e9, 116.45, 1e-6);
    expectClose(ply.cte1PerK, 1.1061e-7, 5e-5);
    // ν12 = 0.30·0.5 + 0.36·0.5 (rule of mixtures).
    expectClose(ply.nu12, 0.33, 1e-12);
  });

  it('gives uniform expansion when both constituents share one CTE and one Poisson ratio', () => {
    // A two-phase body whose phases have equal CTE expands freely without stress, so α1 = α2 = α
    // (Levin's theorem, Mech. Solids 2, 1967 (memory)); Schapery's formulas must honour it.
    const same: FibreSI = { ...fibre, nu12: 0.36, cte1PerK: 41.4e-6, cte2PerK: 41.4e-6 };
    const ply = plyProperties(same, matrix, 0.6);
    expectClose(ply.cte1PerK, 41.4e-6, 1e-12);
    expectClose(ply.cte2PerK, 41.4e-6, 1e-12);
  });

  it('bounds Halpin–Tsai between the Reuss (ξ = 0) and Voigt (ξ → ∞) estimates', () => {
    // Halpin & Kardos, Polym. Eng. Sci. 16, 1976 (memory): ξ = 0 is the series (inverse rule of mixtures)
    // model, ξ → ∞ the parallel (rule of mixtures) model.
    const vf = 0.55;
    expectClose(halpinTsai(15e9, 2.9e9, vf, 0), 1 / (vf / 15e9 + (1 - vf) / 2.9e9), 1e-12);
    expectClose(halpinTsai(15e9, 2.9e9, vf, 1e12), vf * 15e9 + (1 - vf) * 2.9e9, 1e-9);
    const e2 = halpinTsai(15e9, 2.9e9, vf, 2);
    expect(e2).toBeGreaterThan(halpinTsai(15e9, 2.9e9, vf, 0));
    expect(e2).toBeLessThan(vf * 15e9 + (1 - vf) * 2.9e9);
    // Chamis (NASA TM-83320, 1983 (memory)) meets both constituents at V_f = 0 and 1.
    expectClose(chamis(15e9, 2.9e9, 0), 2.9e9, 1e-12);
    expectClose(chamis(15e9, 2.9e9, 1), 15e9, 1e-12);
  });

  it('makes the ply chemical strains from the same formulas with a non-shrinking fibre', () => {
    // Chemical strains of the ply by Schapery's formulas with the resin's shrinkage strain in
    // place of α_m ΔT and fibre shrinkage zero: the same as CTEs of a ply whose fibre has zero CTE and whose
    // resin has a CTE of 1.
    const ply = plyProperties(fibre, matrix, 0.5);
    const unit = plyProperties({ ...fibre, cte1PerK: 0, cte2PerK: 0 }, { ...matrix, ctePerK: 1 }, 0.5);
    expectClose(ply.chem1, unit.cte1PerK, 1e-12);
    expectClose(ply.chem2, unit.cte2PerK, 1e-12);
    // The fibre holds the ply back along 1: far less shrinkage there than across (common practice, no source).
    expect(ply.chem1).toBeLessThan(0.05 * ply.chem2);
  });

  it('turns volumetric shrinkage linear in α into a linear strain', () => {
    // Shrinkage rule (shared/solver/README.md, "Resin state"): ΔV/V = −S α; linear strain (1 + ΔV/V)^(1/3) − 1. S = 4 %: −0.0135152 at α = 1.
    expectClose(resinShrinkageStrain(1, 0.04), Math.cbrt(0.96) - 1, 1e-12);
    expectClose(resinShrinkageStrain(1, 0.04), -0.0135152, 1e-5);
    expectClose(resinShrinkageStrain(0.5, 0.04), Math.cbrt(0.98) - 1, 1e-12);
    expect(resinShrinkageStrain(0, 0.04)).toBe(0);
  });

  it('refuses a fibre volume fraction outside (0, 1) naming the field', () => {
    expect(() => plyProperties(fibre, matrix, 1.2)).toThrow(/fibreVolumeFraction: 1.2 is out of range/);
  });
});
