import { describe, expect, it } from 'vitest';
import { prepareKinetics } from './kinetics';
import { dscPeakTemperatureK, firstOrderPeakTemperatureK, kissingerFit } from './kissinger';
import { expectClose } from './test-support/expect-close';

// First order, A = 1e10 /min, E = 80 kJ/mol; β = 2, 5, 10, 20 K/min → Tp = 383.943, 397.381, 408.162, 419.520 K
// (Kissinger, Anal. Chem. 29, 1957)
const A_PER_S = 1e10 / 60;
const E = 80e3;
const RATES_PER_MIN = [2, 5, 10, 20];
const PEAKS_K = [383.943, 397.381, 408.162, 419.52];

describe('Kissinger analysis', () => {
  it('first-order peak temperatures at 2, 5, 10, 20 K/min are 383.943, 397.381, 408.162, 419.520 K', () => {
    // Kissinger, Anal. Chem. 29, 1957
    RATES_PER_MIN.forEach((b, i) => expectClose(firstOrderPeakTemperatureK({ aPerS: A_PER_S, eJPerMol: E }, b / 60), PEAKS_K[i], 0, 6e-4));
  });

  it('a simulated DSC ramp of the first-order law peaks where the Kissinger condition says', () => {
    // Kissinger, Anal. Chem. 29, 1957: the peak condition is exact for first order, whatever the start
    const k = prepareKinetics({ kinetics: { form: 'nth-order', aPerS: A_PER_S, eJPerMol: E, n: 1 } });
    RATES_PER_MIN.forEach((b, i) => expectClose(dscPeakTemperatureK(k, b / 60, 300), PEAKS_K[i], 0, 1e-3));
  });

  it('the fit of ln(β/Tp²) against 1/Tp through the tabulated peaks recovers E = 80.0 kJ/mol and A', () => {
    // Kissinger, Anal. Chem. 29, 1957 (first-order case with E = 80.0 kJ/mol, which the fit must recover)
    const fit = kissingerFit(RATES_PER_MIN.map((b, i) => ({ heatingRateKPerS: b / 60, peakK: PEAKS_K[i] })));
    expectClose(fit.eJPerMol, 80e3, 5e-4);
    expectClose(fit.aPerS, A_PER_S, 0.01);
    expect(fit.rSquared).toBeGreaterThan(0.99999);
  });

  it('refuses a single run or a bad point, naming it', () => {
    expect(() => kissingerFit([{ heatingRateKPerS: 0.1, peakK: 400 }])).toThrow(/points: 1 runs/);
    expect(() => kissingerFit([{ heatingRateKPerS: 0.1, peakK: 400 }, { heatingRateKPerS: -1, peakK: 410 }])).toThrow(/points\.1\.heatingRateKPerS: -1/);
    expect(() => firstOrderPeakTemperatureK({ aPerS: 1, eJPerMol: 8e4 }, 0)).toThrow(/heating rate: 0 K\/s/);
  });
});
