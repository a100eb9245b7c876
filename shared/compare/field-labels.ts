import { formatValue } from '../schemas/quantity';

// Plain-word names and units of study fields, for the parameter diff and the printed report.
// Paths are dotted with array indices written as '#', e.g. 'resin.modulus.prony.weights.#'.

export interface FieldLabel {
  label: string;
  /** unit written after numbers; '' for dimensionless */
  unit: string;
}

const L = (label: string, unit = ''): FieldLabel => ({ label, unit });

const RESIN: Record<string, FieldLabel> = {
  name: L('name'),
  'provenance.source': L('source'),
  'provenance.note': L('provenance note'),
  'kinetics.form': L('kinetics form'),
  'kinetics.aPerS': L('pre-exponential factor A', '1/s'),
  'kinetics.eJPerMol': L('activation energy E', 'J/mol'),
  'kinetics.n': L('reaction order n'),
  'kinetics.m': L('reaction order m'),
  'kinetics.a1PerS': L('pre-exponential factor A1', '1/s'),
  'kinetics.a2PerS': L('pre-exponential factor A2', '1/s'),
  'kinetics.e1JPerMol': L('activation energy E1', 'J/mol'),
  'kinetics.e2JPerMol': L('activation energy E2', 'J/mol'),
  'kinetics.e3JPerMol': L('activation energy E3', 'J/mol'),
  'kinetics.a1PerMin': L('pre-exponential factor A1', '1/min'),
  'kinetics.a2PerMin': L('pre-exponential factor A2', '1/min'),
  'kinetics.a3PerMin': L('pre-exponential factor A3', '1/min'),
  'kinetics.b': L('constant B'),
  'diffusion.c': L('diffusion constant C'),
  'diffusion.alphaC0': L('critical cure αC0'),
  'diffusion.alphaCTPerK': L('critical cure slope αCT', '1/K'),
  heatOfReactionKJPerKg: L('heat of reaction', 'kJ/kg'),
  densityKgM3: L('density', 'kg/m³'),
  specificHeatJPerKgK: L('specific heat', 'J/(kg·K)'),
  conductivityWPerMK: L('conductivity', 'W/(m·K)'),
  'glassTransition.tg0C': L('Tg0', '°C'),
  'glassTransition.tgInfC': L('Tg∞', '°C'),
  'glassTransition.lambda': L('DiBenedetto λ'),
  gelPoint: L('gel point (degree of cure)'),
  'modulus.model': L('modulus model'),
  'modulus.unrelaxedGPa': L('unrelaxed modulus', 'GPa'),
  'modulus.relaxedGPa': L('relaxed modulus', 'GPa'),
  'modulus.poisson': L('Poisson ratio'),
  'modulus.prony.weights.#': L('Prony weight #'),
  'modulus.prony.timesS.#': L('Prony relaxation time #', 's'),
  'modulus.shift.wlfC1': L('WLF C1'),
  'modulus.shift.wlfC2K': L('WLF C2', 'K'),
  'modulus.shift.offsetC': L('shift reference offset from Tg', '°C'),
  'modulus.shift.arrheniusEJPerMol': L('Arrhenius activation energy below the reference', 'J/mol'),
  'modulus.shift.cureTable.alpha.#': L('cure-table degree of cure #'),
  'modulus.shift.cureTable.log10a.#': L('cure-table log10 shift #'),
  'modulus.chile.glassyOffsetC': L('CHILE glassy offset', '°C'),
  'modulus.chile.rubberyOffsetC': L('CHILE rubbery offset', '°C'),
  cteMicroPerK: L('CTE', 'µ/K'),
  totalShrinkagePct: L('total volumetric shrinkage', '%'),
};

const FIBRE: Record<string, FieldLabel> = {
  name: L('name'),
  'provenance.source': L('source'),
  'provenance.note': L('provenance note'),
  e1GPa: L('E1', 'GPa'),
  e2GPa: L('E2', 'GPa'),
  g12GPa: L('G12', 'GPa'),
  nu12: L('ν12'),
  nu23: L('ν23'),
  cte1MicroPerK: L('CTE1', 'µ/K'),
  cte2MicroPerK: L('CTE2', 'µ/K'),
  densityKgM3: L('density', 'kg/m³'),
  specificHeatJPerKgK: L('specific heat', 'J/(kg·K)'),
  conductivityAxialWPerMK: L('axial conductivity', 'W/(m·K)'),
  conductivityTransverseWPerMK: L('transverse conductivity', 'W/(m·K)'),
};

const TOOL: Record<string, FieldLabel> = {
  name: L('name'),
  thicknessMm: L('thickness', 'mm'),
  densityKgM3: L('density', 'kg/m³'),
  specificHeatJPerKgK: L('specific heat', 'J/(kg·K)'),
  conductivityWPerMK: L('conductivity', 'W/(m·K)'),
  cteMicroPerK: L('CTE', 'µ/K'),
};

const SEGMENT: Record<string, FieldLabel> = {
  rateCPerMin: L('rate', '°C/min'),
  targetC: L('target', '°C'),
  pressureBar: L('pressure', 'bar'),
  // as the segment table's columns name them ("Dwell 1 length", "Dwell 1 band")
  holdMin: L('length', 'min'),
  start: L('start'),
  bandC: L('band ±', '°C'),
};

const STUDY: Record<string, FieldLabel> = {
  fibreVolumeFraction: L('fibre volume fraction'),
  'heatTransfer.bagSideWPerM2K': L('bag-side heat transfer coefficient', 'W/(m²·K)'),
  'heatTransfer.toolSideWPerM2K': L('tool-side heat transfer coefficient', 'W/(m²·K)'),
  'mesh.nodesPerPly': L('nodes per ply'),
  constraint: L('part constraint'),
  'geometry.stripSpanMm': L('strip span', 'mm'),
  'geometry.cornerAngleDeg': L('corner angle', '°'),
  'limits.minFinalCure': L('minimum final degree of cure'),
  'limits.maxOvershootC': L('maximum exotherm overshoot', '°C'),
  'limits.maxGradientC': L('maximum through-thickness temperature difference', '°C'),
  'limits.maxHeatRateCPerMin': L('maximum heat-up rate', '°C/min'),
  'limits.maxCoolRateCPerMin': L('maximum cool-down rate', '°C/min'),
  'limits.maxWarpageMm': L('maximum warpage', 'mm'),
  'limits.maxSpringInDeg': L('maximum spring-in', '°'),
  'limits.maxCycleMin': L('maximum cycle time', 'min'),
  'cycle.startC': L('start temperature', '°C'),
};

/** The kinetics forms by their published names (the card stores a code key). */
export const KINETICS_NAMES: Record<'nth-order' | 'kamal-sourour' | 'lee-loos-springer', string> = {
  'nth-order': 'nth order',
  'kamal-sourour': 'Kamal–Sourour',
  'lee-loos-springer': 'Lee–Loos–Springer',
};

export const FIELD_LABELS = { resin: RESIN, fibre: FIBRE, tool: TOOL, segment: SEGMENT, study: STUDY } as const;

/**
 * The label of a field within one of the tables; '#' in a label is replaced by the 1-based index found in the
 * path. Unknown fields fall back to their key, so a field added to the schema later still shows up in a diff.
 */
export function fieldLabel(table: Record<string, FieldLabel>, path: string): FieldLabel {
  const pattern = path.replace(/\.\d+(?=\.|$)/g, '.#');
  const found = table[pattern];
  if (!found) return { label: path, unit: '' };
  const index = /\.(\d+)(?:\.|$)/.exec(path);
  return index ? { ...found, label: found.label.replace('#', String(Number(index[1]) + 1)) } : found;
}

/** "45°", "0.19 mm", "0.9", "'DF-E180'" — units follow numbers with a space except degrees of angle. */
export function formatQuantity(value: unknown, unit: string): string {
  if (typeof value !== 'number') return typeof value === 'string' ? `'${value}'` : formatValue(value);
  const text = formatValue(value).replace(/^-/, '−');
  if (!unit) return text;
  return unit === '°' ? `${text}°` : `${text} ${unit}`;
}

/** "+20 kJ/kg", "−15°" */
export function formatDelta(delta: number, unit: string): string {
  const body = formatQuantity(Math.abs(delta), unit);
  return `${delta < 0 ? '−' : '+'}${body}`;
}
