import { describe, expect, it } from 'vitest';
import { expectClose } from '../solver/test-support/expect-close';
import {
  guessPressureUnit,
  guessTemperatureUnit,
  guessTimeUnit,
  guessVacuumReference,
  guessVacuumUnit,
  pressureToPa,
  pressureUnitFromHeader,
  temperatureToK,
  temperatureUnitFromHeader,
  timeToS,
  timeUnitFromHeader,
  vacuumDepthPa,
  vacuumUnitFromHeader,
} from './units';

describe('conversions to SI', () => {
  it('reads °F and K temperatures as kelvin', () => {
    // 350 °F = 176.67 °C = 449.82 K; 212 °F is water's boiling point, 373.15 K (ITS-90, from memory)
    expectClose(temperatureToK(212, '°F'), 373.15, 1e-12);
    expectClose(temperatureToK(350, '°F'), 449.8167, 1e-6);
    expect(temperatureToK(180, '°C')).toBe(453.15);
    expect(temperatureToK(300, 'K')).toBe(300);
  });

  it('reads psi, kPa and bar as pascal', () => {
    // 1 psi = 6894.757 Pa (NIST SP 811, appendix B)
    expectClose(pressureToPa(100, 'psi'), 689_475.7, 1e-6);
    expect(pressureToPa(700, 'kPa')).toBe(700_000);
    expect(pressureToPa(7, 'bar')).toBe(700_000);
  });

  it('reads vacuum as depth below atmosphere whichever way the gauge shows it', () => {
    // 1 inHg = 3386.389 Pa (NIST SP 811, appendix B); gauge −95 kPa and +95 kPa mean the same depth
    expectClose(vacuumDepthPa(28, 'inHg', 'gauge'), 94_818.9, 1e-6);
    expect(vacuumDepthPa(-95, 'kPa', 'gauge')).toBe(95_000);
    expect(vacuumDepthPa(95, 'kPa', 'gauge')).toBe(95_000);
    // 50 mbar absolute in the bag: 1013.25 − 50 mbar below a standard atmosphere (101 325 Pa, from memory)
    expectClose(vacuumDepthPa(50, 'mbar', 'absolute'), 96_325, 1e-12);
  });

  it('reads time in s, min and h', () => {
    expect(timeToS(90, 'min')).toBe(5400);
    expect(timeToS(1.5, 'h')).toBe(5400);
    expect(timeToS(5400, 's')).toBe(5400);
  });
});

describe('units from headers', () => {
  it.each([
    ['Air (°F)', '°F'],
    ['TC1 degC', '°C'],
    ['Part temp [K]', 'K'],
    ['Oven temperature (C)', '°C'],
    ['Pressure', null],
  ])('temperature unit of %s is %s', (header, unit) => {
    expect(temperatureUnitFromHeader(header)).toBe(unit);
  });

  it.each([
    ['Vessel pressure (psi)', 'psi'],
    ['Autoclave pressure [kPa]', 'kPa'],
    ['P barg', 'bar'],
    ['Air (°C)', null],
  ])('pressure unit of %s is %s', (header, unit) => {
    expect(pressureUnitFromHeader(header)).toBe(unit);
  });

  it.each([
    ['Bag vacuum (inHg)', 'inHg'],
    ['Vacuum mbar', 'mbar'],
    ['Vac (kPa)', 'kPa'],
  ])('vacuum unit of %s is %s', (header, unit) => {
    expect(vacuumUnitFromHeader(header)).toBe(unit);
  });

  it.each([
    ['Time (min)', 'min'],
    ['Elapsed time [s]', 's'],
    ['Time h', 'h'],
    ['Timestamp', 'timestamp'],
    ['Date', 'timestamp'],
    ['Time', null],
  ])('time unit of %s is %s', (header, unit) => {
    expect(timeUnitFromHeader(header)).toBe(unit);
  });
});

describe('units from values when the header is silent', () => {
  it('tells °C, °F and K apart from where a cure starts and peaks', () => {
    expect(guessTemperatureUnit({ min: 19, max: 181, first: 20 }).unit).toBe('°C');
    expect(guessTemperatureUnit({ min: 66, max: 357, first: 68 }).unit).toBe('°F');
    expect(guessTemperatureUnit({ min: 293, max: 454, first: 293 }).unit).toBe('K');
  });

  it('tells bar, psi and kPa apart by the peak pressure', () => {
    expect(guessPressureUnit({ min: 0, max: 7, first: 0 }).unit).toBe('bar');
    expect(guessPressureUnit({ min: 0, max: 101.5, first: 0 }).unit).toBe('psi');
    expect(guessPressureUnit({ min: 0, max: 700, first: 0 }).unit).toBe('kPa');
  });

  it('tells inHg, kPa and mbar apart, and gauge from absolute', () => {
    expect(guessVacuumUnit({ min: 27, max: 29, first: 28 }).unit).toBe('inHg');
    expect(guessVacuumUnit({ min: -97, max: -90, first: -95 }).unit).toBe('kPa');
    expect(guessVacuumUnit({ min: -980, max: -900, first: -950 }).unit).toBe('mbar');
    expect(guessVacuumReference('Vacuum', 'mbar', { min: -980, max: -900, first: -950 })).toBe('gauge');
    expect(guessVacuumReference('Vacuum', 'mbar', { min: 20, max: 80, first: 40 })).toBe('absolute');
    expect(guessVacuumReference('Bag pressure abs', 'kPa', { min: 90, max: 95, first: 95 })).toBe('absolute');
  });

  it('reads the time unit from the span of a cure (hours long)', () => {
    expect(guessTimeUnit({ min: 0, max: 23_400, first: 0 }).unit).toBe('s');
    expect(guessTimeUnit({ min: 0, max: 390, first: 0 }).unit).toBe('min');
    expect(guessTimeUnit({ min: 0, max: 6.5, first: 0 }).unit).toBe('h');
  });
});
