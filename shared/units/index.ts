// Unit conversions at the edges of the solver. Users type engineering units (°C, min, mm, GPa, bar...);
// the solver runs in SI (K, s, m, Pa, J). Every conversion lives here so there is one place per rule.

/** 0 °C in kelvin (ITS-90 definition). */
export const ZERO_CELSIUS_K = 273.15;
/** 1 psi in pascal (avoirdupois pound-force per square inch). */
export const PSI_PA = 6894.757293168361;
/** 1 bar in pascal (exact by definition). */
export const BAR_PA = 1e5;
/** Standard atmosphere in pascal. */
export const ATM_PA = 101_325;

// Temperature (absolute values; a temperature *difference* is the same number in °C and K).
export const cToK = (c: number): number => c + ZERO_CELSIUS_K;
export const kToC = (k: number): number => k - ZERO_CELSIUS_K;
export const fToC = (f: number): number => ((f - 32) * 5) / 9;
export const cToF = (c: number): number => (c * 9) / 5 + 32;

// Time.
export const minToS = (min: number): number => min * 60;
export const sToMin = (s: number): number => s / 60;
export const hToS = (h: number): number => h * 3600;
export const sToH = (s: number): number => s / 3600;

// Rates.
export const cPerMinToKPerS = (r: number): number => r / 60;
export const kPerSToCPerMin = (r: number): number => r * 60;
export const perMinToPerS = (r: number): number => r / 60;
export const perSToPerMin = (r: number): number => r * 60;

// Length.
export const mmToM = (mm: number): number => mm / 1000;
export const mToMm = (m: number): number => m * 1000;

// Stress and pressure.
export const gpaToPa = (gpa: number): number => gpa * 1e9;
export const paToGpa = (pa: number): number => pa / 1e9;
export const mpaToPa = (mpa: number): number => mpa * 1e6;
export const paToMpa = (pa: number): number => pa / 1e6;
export const kpaToPa = (kpa: number): number => kpa * 1e3;
export const paToKpa = (pa: number): number => pa / 1e3;
export const barToPa = (bar: number): number => bar * BAR_PA;
export const paToBar = (pa: number): number => pa / BAR_PA;
export const psiToPa = (psi: number): number => psi * PSI_PA;
export const paToPsi = (pa: number): number => pa / PSI_PA;
export const barToPsi = (bar: number): number => paToPsi(barToPa(bar));
export const psiToBar = (psi: number): number => paToBar(psiToPa(psi));

// Expansion coefficients: µ/K (ppm/K) ↔ 1/K.
export const microPerKToPerK = (u: number): number => u * 1e-6;
export const perKToMicroPerK = (a: number): number => a * 1e6;

// Energy per mass.
export const kjPerKgToJPerKg = (kj: number): number => kj * 1e3;
export const jPerKgToKjPerKg = (j: number): number => j / 1e3;
export const kjPerMolToJPerMol = (kj: number): number => kj * 1e3;
export const jPerMolToKjPerMol = (j: number): number => j / 1e3;

// Angles.
export const degToRad = (deg: number): number => (deg * Math.PI) / 180;
export const radToDeg = (rad: number): number => (rad * 180) / Math.PI;

/**
 * Units the UI can switch between, grouped by quantity. Each unit maps to SI by `si = value * scale + offset`.
 * Keeping the table as data lets the UI list the choices of a quantity and convert generically.
 */
export const UNIT_TABLE = {
  temperature: {
    K: { scale: 1, offset: 0 },
    '°C': { scale: 1, offset: ZERO_CELSIUS_K },
    '°F': { scale: 5 / 9, offset: ZERO_CELSIUS_K - (32 * 5) / 9 },
  },
  temperatureDifference: {
    K: { scale: 1, offset: 0 },
    '°C': { scale: 1, offset: 0 },
    '°F': { scale: 5 / 9, offset: 0 },
  },
  time: {
    s: { scale: 1, offset: 0 },
    min: { scale: 60, offset: 0 },
    h: { scale: 3600, offset: 0 },
  },
  heatingRate: {
    'K/s': { scale: 1, offset: 0 },
    '°C/min': { scale: 1 / 60, offset: 0 },
    '°F/min': { scale: 5 / 9 / 60, offset: 0 },
  },
  length: {
    m: { scale: 1, offset: 0 },
    mm: { scale: 1e-3, offset: 0 },
    µm: { scale: 1e-6, offset: 0 },
    in: { scale: 0.0254, offset: 0 },
  },
  pressure: {
    Pa: { scale: 1, offset: 0 },
    kPa: { scale: 1e3, offset: 0 },
    bar: { scale: BAR_PA, offset: 0 },
    psi: { scale: PSI_PA, offset: 0 },
    atm: { scale: ATM_PA, offset: 0 },
  },
  stress: {
    Pa: { scale: 1, offset: 0 },
    MPa: { scale: 1e6, offset: 0 },
    GPa: { scale: 1e9, offset: 0 },
    psi: { scale: PSI_PA, offset: 0 },
    ksi: { scale: PSI_PA * 1e3, offset: 0 },
    Msi: { scale: PSI_PA * 1e6, offset: 0 },
  },
  expansion: {
    '1/K': { scale: 1, offset: 0 },
    'µ/K': { scale: 1e-6, offset: 0 },
  },
  specificEnergy: {
    'J/kg': { scale: 1, offset: 0 },
    'kJ/kg': { scale: 1e3, offset: 0 },
    'J/g': { scale: 1e3, offset: 0 },
  },
  angle: {
    rad: { scale: 1, offset: 0 },
    '°': { scale: Math.PI / 180, offset: 0 },
  },
} as const;

export type Quantity = keyof typeof UNIT_TABLE;
export type UnitOf<Q extends Quantity> = keyof (typeof UNIT_TABLE)[Q] & string;

/** Units available for a quantity, SI first. */
export function unitsOf<Q extends Quantity>(quantity: Q): UnitOf<Q>[] {
  return Object.keys(UNIT_TABLE[quantity]) as UnitOf<Q>[];
}

/** Convert a value of a quantity between two of its units, e.g. convert('pressure', 7, 'bar', 'psi'). */
export function convert<Q extends Quantity>(quantity: Q, value: number, from: UnitOf<Q>, to: UnitOf<Q>): number {
  const table = UNIT_TABLE[quantity] as Record<string, { scale: number; offset: number }>;
  const a = table[from];
  const b = table[to];
  if (!a || !b) {
    throw new RangeError(`unknown unit for ${quantity}: ${!a ? from : to} (allowed: ${Object.keys(table).join(', ')})`);
  }
  const si = value * a.scale + a.offset;
  return (si - b.offset) / b.scale;
}
