import { describe, expect, it } from 'vitest';
import * as u from './index';

// Definitions: 0 °C = 273.15 K (ITS-90); 1 bar = 1e5 Pa; 1 psi = 6894.757 Pa (NIST SP 811, appendix B);
// 1 in = 25.4 mm (international inch, 1959). Water boils near 212 °F = 100 °C (definition of the °F scale).
describe('units', () => {
  it('converts temperatures between °C, K and °F', () => {
    expect(u.cToK(180)).toBeCloseTo(453.15, 12);
    expect(u.kToC(273.15)).toBeCloseTo(0, 12);
    expect(u.cToF(100)).toBeCloseTo(212, 12);
    expect(u.fToC(-40)).toBeCloseTo(-40, 12);
    expect(u.convert('temperature', 350, '°F', '°C')).toBeCloseTo(176.6667, 4);
    // A difference of 10 °C is 10 K and 18 °F.
    expect(u.convert('temperatureDifference', 10, '°C', '°F')).toBeCloseTo(18, 12);
  });

  it('converts times and heating rates', () => {
    expect(u.minToS(120)).toBe(7200);
    expect(u.sToMin(90)).toBe(1.5);
    expect(u.cPerMinToKPerS(3)).toBeCloseTo(0.05, 15);
    expect(u.kPerSToCPerMin(0.05)).toBeCloseTo(3, 12);
    expect(u.convert('heatingRate', 2, '°C/min', 'K/s')).toBeCloseTo(2 / 60, 15);
    expect(u.convert('time', 6, 'h', 'min')).toBeCloseTo(360, 12);
  });

  it('converts lengths, stresses and pressures', () => {
    expect(u.mmToM(0.125)).toBeCloseTo(1.25e-4, 18);
    expect(u.mToMm(0.003)).toBeCloseTo(3, 12);
    expect(u.gpaToPa(3.5)).toBe(3.5e9);
    expect(u.paToMpa(4.2e7)).toBeCloseTo(42, 12);
    expect(u.barToPa(7)).toBe(7e5);
    expect(u.kpaToPa(101.325)).toBeCloseTo(u.ATM_PA, 9);
    // 100 psi ≈ 6.895 bar (NIST SP 811).
    expect(u.psiToBar(100)).toBeCloseTo(6.894757, 6);
    expect(u.barToPsi(u.psiToBar(85))).toBeCloseTo(85, 10);
    expect(u.convert('length', 1, 'in', 'mm')).toBeCloseTo(25.4, 12);
    expect(u.convert('stress', 1, 'Msi', 'GPa')).toBeCloseTo(6.894757, 6);
  });

  it('converts expansion coefficients, energies and angles', () => {
    expect(u.microPerKToPerK(55)).toBeCloseTo(55e-6, 18);
    expect(u.perKToMicroPerK(-4e-7)).toBeCloseTo(-0.4, 12);
    expect(u.kjPerKgToJPerKg(473.6)).toBeCloseTo(473_600, 9);
    expect(u.jPerKgToKjPerKg(500_000)).toBe(500);
    expect(u.degToRad(180)).toBeCloseTo(Math.PI, 15);
    expect(u.radToDeg(Math.PI / 2)).toBeCloseTo(90, 12);
  });

  it('round-trips every unit of every quantity through SI', () => {
    for (const q of Object.keys(u.UNIT_TABLE) as u.Quantity[]) {
      const units = u.unitsOf(q);
      for (const a of units) {
        for (const b of units) {
          const x = 37.5;
          const back = u.convert(q, u.convert(q, x, a as never, b as never), b as never, a as never);
          expect(back).toBeCloseTo(x, 9);
        }
      }
    }
  });

  it('refuses an unknown unit with a message naming the allowed units', () => {
    expect(() => u.convert('pressure', 1, 'bar', 'mmHg' as never)).toThrow(/mmHg.*Pa, kPa, bar, psi, atm/);
  });
});
