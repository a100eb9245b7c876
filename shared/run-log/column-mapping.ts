import { z } from 'zod';
import {
  PRESSURE_UNITS,
  TEMPERATURE_UNITS,
  TIME_UNITS,
  VACUUM_REFERENCES,
  VACUUM_UNITS,
  guessPressureUnit,
  guessTemperatureUnit,
  guessTimeUnit,
  guessVacuumReference,
  guessVacuumUnit,
  pressureUnitFromHeader,
  temperatureUnitFromHeader,
  timeUnitFromHeader,
  vacuumUnitFromHeader,
  type ValueRange,
} from './units';
import { MAX_RUN_LOG_COLUMNS } from './limits';

// What each column of a run log is: its role (time, air, tool, part thermocouple, pressure, vacuum, ignore)
// and its unit. `proposeMapping` guesses from headers and values; the user confirms; the server validates
// the confirmed mapping with `runLogMappingSchema` before parsing the whole file with it.

export const CHANNEL_ROLES = ['air', 'tool', 'part', 'pressure', 'vacuum'] as const;
export const COLUMN_ROLES = ['time', ...CHANNEL_ROLES, 'ignore'] as const;
/** Where a part thermocouple sits through the thickness; lets the replay compare it with the right node. */
export const PART_POSITIONS = ['bag-side', 'mid-plane', 'tool-side', 'unknown'] as const;

export type ChannelRole = (typeof CHANNEL_ROLES)[number];
export type ColumnRole = (typeof COLUMN_ROLES)[number];
export type PartPosition = (typeof PART_POSITIONS)[number];

const enumOf = <T extends readonly [string, ...string[]]>(values: T, what: string) =>
  z.enum(values, { error: (iss) => `unknown ${what} ${JSON.stringify(iss.input)}: allowed ${values.map((v) => `'${v}'`).join(', ')}` });

const base = {
  column: z.number().int().min(0).max(MAX_RUN_LOG_COLUMNS - 1),
  header: z.string().max(200),
};
/** A channel hygiene flags is left out unless the uploader keeps it on purpose (stored with the mapping). */
const keepIfFlagged = z.boolean({ error: 'keepIfFlagged must be true or false' }).optional();
const channelLabel = z
  .string({ error: 'a channel needs a label' })
  .trim()
  .min(1, { error: 'a channel needs a label' })
  .max(60, { error: 'label too long: allowed ≤ 60 characters' });

export const columnMappingSchema = z.discriminatedUnion(
  'role',
  [
    z.object({ ...base, role: z.literal('time'), unit: enumOf(TIME_UNITS, 'time unit') }),
    z.object({ ...base, role: z.literal('air'), label: channelLabel, keepIfFlagged, unit: enumOf(TEMPERATURE_UNITS, 'temperature unit') }),
    z.object({ ...base, role: z.literal('tool'), label: channelLabel, keepIfFlagged, unit: enumOf(TEMPERATURE_UNITS, 'temperature unit') }),
    z.object({
      ...base,
      role: z.literal('part'),
      label: channelLabel,
      keepIfFlagged,
      unit: enumOf(TEMPERATURE_UNITS, 'temperature unit'),
      position: enumOf(PART_POSITIONS, 'thermocouple position').default('unknown'),
    }),
    z.object({ ...base, role: z.literal('pressure'), label: channelLabel, keepIfFlagged, unit: enumOf(PRESSURE_UNITS, 'pressure unit') }),
    z.object({
      ...base,
      role: z.literal('vacuum'),
      label: channelLabel,
      keepIfFlagged,
      unit: enumOf(VACUUM_UNITS, 'vacuum unit'),
      reference: enumOf(VACUUM_REFERENCES, 'vacuum reference'),
    }),
    z.object({ ...base, role: z.literal('ignore') }),
  ],
  { error: (iss) => `unknown column role ${JSON.stringify((iss.input as { role?: unknown })?.role)}: allowed ${COLUMN_ROLES.join(', ')}` },
);

const ONLY_ONE: ColumnRole[] = ['time', 'air', 'tool', 'pressure', 'vacuum'];

export const runLogMappingSchema = z
  .object({ columns: z.array(columnMappingSchema).min(2).max(MAX_RUN_LOG_COLUMNS) })
  .superRefine((mapping, ctx) => {
    const count = (role: ColumnRole) => mapping.columns.filter((c) => c.role === role).length;
    for (const role of ONLY_ONE) {
      if (count(role) > 1) {
        ctx.addIssue({ code: 'custom', path: ['columns'], message: `${count(role)} columns mapped as ${role}: allowed at most one` });
      }
    }
    if (count('time') !== 1) ctx.addIssue({ code: 'custom', path: ['columns'], message: 'no column mapped as time: exactly one is needed' });
    if (count('air') !== 1) {
      ctx.addIssue({ code: 'custom', path: ['columns'], message: 'no column mapped as air: exactly one is needed (the replay runs from it)' });
    }
    const seenColumns = new Set<number>();
    const seenLabels = new Set<string>();
    mapping.columns.forEach((c, i) => {
      if (seenColumns.has(c.column)) {
        ctx.addIssue({ code: 'custom', path: ['columns', i, 'column'], message: `column ${c.column + 1} is mapped twice` });
      }
      seenColumns.add(c.column);
      if ('label' in c) {
        const key = c.label.trim().toLowerCase();
        if (seenLabels.has(key)) {
          ctx.addIssue({ code: 'custom', path: ['columns', i, 'label'], message: `label "${c.label}" is used twice: each channel needs its own` });
        }
        seenLabels.add(key);
      }
    });
  });

export type ColumnMapping = z.infer<typeof columnMappingSchema>;
export type RunLogMapping = z.infer<typeof runLogMappingSchema>;
export type ChannelMapping = Exclude<ColumnMapping, { role: 'time' } | { role: 'ignore' }>;

export type ColumnProposal = ColumnMapping & {
  /** why this role and unit were proposed, shown beside the column in the mapping step */
  reason: string;
  /** false when the unit came from values alone and deserves a look */
  confident: boolean;
};

/** Header without its unit, e.g. "TC3 lagging (°F)" → "TC3 lagging". */
export function labelFromHeader(header: string): string {
  const stripped = header
    .replace(/[([][^)\]]*[)\]]/g, ' ')
    .replace(/\s*\b(deg\s*[cf]|degc|degf|°\s*[cf]|psi[ga]?|kpa|mbar|bar|inhg)\b\s*/gi, ' ')
    .replace(/°[CF]?/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
  return stripped || header.trim();
}

/** Role from the header's words; null when the header says nothing we know. */
export function roleFromHeader(header: string): ColumnRole | null {
  const h = header.toLowerCase();
  if (/\b(time|elapsed|date|timestamp|clock|datetime)\b/.test(h) || /^t\s*[([]/.test(h)) return 'time';
  // A thermocouple's name first: "TC1 bag-side" is a part TC, not the bag vacuum.
  if (/^tc\s*\d|\btc\d|thermocouple/.test(h)) return 'part';
  if (/vac|inhg/.test(h) || (/\bbag\b/.test(h) && !temperatureUnitFromHeader(header))) return 'vacuum';
  if (/press|\bpsi|\bbar[ga]?\b|\bkpa\b/.test(h)) return 'pressure';
  if (/^(tool|mould|mold|fixture)\b/.test(h)) return 'tool';
  // Part TCs before the tool anywhere: "TC3 tool-side" is a part TC near the tool.
  if (/\b(tc|ptc|part|lagging|leading|lag|lead|thermocouple|t\/c)\b|^tc\s*\d|^t\d|\btc\d/.test(h)) return 'part';
  if (/\b(tool|mould|mold|fixture)\b/.test(h)) return 'tool';
  if (/\b(air|gas|oven|vessel|ambient|control)\b/.test(h)) return 'air';
  if (/\b(comment|note|event|step|segment|alarm|status)\b/.test(h)) return 'ignore';
  return null;
}

function positionFromHeader(header: string): PartPosition {
  const h = header.toLowerCase();
  if (/\bbag\b|\btop\b|bag[- ]side/.test(h)) return 'bag-side';
  if (/\bmid|\bcent(re|er)\b|\bcore\b/.test(h)) return 'mid-plane';
  if (/tool[- ]side|\bbottom\b/.test(h)) return 'tool-side';
  return 'unknown';
}

export interface ColumnSample {
  header: string;
  /** finite numbers read from the sampled rows, in file order */
  numbers: number[];
  /** how many sampled cells were time stamps (date-time or clock) */
  timestamps: number;
  /** how many sampled cells were non-empty */
  filled: number;
}

function rangeOf(values: number[]): ValueRange {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max, first: values[0] };
}

/**
 * Proposed role and unit for every column, from headers first and value ranges second. The time column is
 * the one named so, or the first column holding time stamps, or else the first column.
 */
export function proposeMapping(columns: ColumnSample[]): ColumnProposal[] {
  const roles = columns.map((c) => roleFromHeader(c.header));
  let timeIndex = roles.indexOf('time');
  if (timeIndex < 0) timeIndex = columns.findIndex((c) => c.filled > 0 && c.timestamps === c.filled);
  if (timeIndex < 0) timeIndex = 0;

  let airTaken = false;
  const taken = new Set<ColumnRole>();
  return columns.map((col, column): ColumnProposal => {
    const { header } = col;
    if (column === timeIndex) {
      if (col.timestamps > 0 && col.timestamps === col.filled) {
        return { column, header, role: 'time', unit: 'timestamp', reason: 'cells are time stamps', confident: true };
      }
      const fromHeader = timeUnitFromHeader(header);
      if (fromHeader && fromHeader !== 'timestamp') {
        return { column, header, role: 'time', unit: fromHeader, reason: `header names ${fromHeader}`, confident: true };
      }
      const guess = guessTimeUnit(rangeOf(col.numbers));
      return { column, header, role: 'time', unit: guess.unit, reason: guess.reason, confident: false };
    }
    let role = roles[column];
    if (role === 'time') role = 'ignore'; // a second time-like column (e.g. a date beside elapsed time)
    const numeric = col.numbers.length > 0 && col.numbers.length >= col.filled * 0.5;
    if (!numeric) return { column, header, role: 'ignore', reason: 'not numeric', confident: true };
    // Unnamed numeric columns are read as thermocouples; the first becomes the air when none is named so.
    if (role === null) role = 'part';
    if ((role === 'air' && airTaken) || (role !== 'part' && role !== 'ignore' && taken.has(role))) role = 'part';
    if (role === 'air') airTaken = true;
    taken.add(role);
    const range = rangeOf(col.numbers);
    const label = labelFromHeader(header);
    switch (role) {
      case 'pressure': {
        const unit = pressureUnitFromHeader(header);
        if (unit) return { column, header, role, label, unit, reason: `header names ${unit}`, confident: true };
        const g = guessPressureUnit(range);
        return { column, header, role, label, unit: g.unit, reason: g.reason, confident: false };
      }
      case 'vacuum': {
        const named = vacuumUnitFromHeader(header);
        const unit = named ?? guessVacuumUnit(range).unit;
        const reference = guessVacuumReference(header, unit, range);
        const reason = `${named ? `header names ${named}` : guessVacuumUnit(range).reason}; read as ${reference}`;
        return { column, header, role, label, unit, reference, reason, confident: named !== null };
      }
      case 'ignore':
        return { column, header, role, reason: 'header names a non-measurement column', confident: true };
      default: {
        const named = temperatureUnitFromHeader(header);
        const g = named ? null : guessTemperatureUnit(range);
        const unit = named ?? g!.unit;
        const reason = named ? `header names ${named}` : g!.reason;
        if (role === 'part') {
          return { column, header, role, label, unit, position: positionFromHeader(header), reason, confident: named !== null };
        }
        return { column, header, role, label, unit, reason, confident: named !== null };
      }
    }
  }).map((p, _i, all) => {
    // No column named air: the first temperature column is the air (loggers usually list it first).
    if (all.some((c) => c.role === 'air')) return p;
    const firstTemp = all.find((c) => c.role === 'part');
    if (p === firstTemp && p.role === 'part') {
      const { position: _position, ...rest } = p;
      return { ...rest, role: 'air', reason: `${p.reason}; first temperature column taken as the air` } as ColumnProposal;
    }
    return p;
  });
}

/** The mapping to send for confirmation: proposals without their reasons. */
export function mappingFromProposal(proposals: ColumnProposal[]): RunLogMapping {
  return {
    columns: proposals.map((p) => {
      const { reason: _reason, confident: _confident, ...mapping } = p;
      return mapping as ColumnMapping;
    }),
  };
}
