import { z } from 'zod';
import { describeRange, formatValue, inRange, label, quantity, type Range } from './quantity';

// The study input: what a process engineer types, in engineering units with the unit in the field name.
// The solver converts once at entry (shared/units) and runs in SI. Every rule lives here, once; each error
// names the path (issue path), the value and the allowed range.

/** Air below this needs active cooling; a dwell there must follow a cool segment. */
export const ROOM_TEMPERATURE_C = 20;
/** Finest laminate mesh: nodes per ply (a stored study has at least 2; a quick look may solve with 1). */
export const MAX_NODES_PER_PLY = 6;
/** Upper bound on laminate mesh nodes (plies × nodes per ply); keeps one solve interactive. */
export const MAX_LAMINATE_NODES = 400;
/** Longest cycle a study may schedule (14 days): keeps one solve bounded; real cures are hours to a day or two. */
export const MAX_CYCLE_MIN = 14 * 24 * 60;
/** Prony weights must sum to 1 within this. */
export const WEIGHT_SUM_TOLERANCE = 1e-6;
/** LLS: the low-cure branch switches at α = 0.3 (Lee, Loos & Springer, J. Compos. Mater. 16, 1982). */
export const LLS_SWITCH_ALPHA = 0.3;

// Ranges shared by several fields (one place per rule).
const R = {
  temperatureC: { min: -60, max: 450, unit: '°C' },
  rateCPerMin: { gt: 0, max: 20, unit: '°C/min' },
  pressureBar: { min: 0, max: 25, unit: 'bar' },
  densityKgM3: { min: 100, max: 25_000, unit: 'kg/m³' },
  specificHeat: { min: 50, max: 10_000, unit: 'J/(kg·K)' },
  conductivity: { gt: 0, max: 2_000, unit: 'W/(m·K)' },
  activation: { min: 0, max: 1e6, unit: 'J/mol' },
  exponent: { min: 0, max: 10 },
  preExpPerS: { min: 0, max: 1e30, unit: '1/s' },
  poisson: { min: 0, lt: 0.5 },
  cte: { min: -20, max: 500, unit: 'µ/K' },
  modulusGPa: { gt: 0, max: 1_500, unit: 'GPa' },
  fraction: { min: 0, max: 1 },
} satisfies Record<string, Range>;

export const provenanceSchema = z.object({
  source: label(300),
  note: z.string().max(2000).optional(),
});

// --- Resin card -------------------------------------------------------------------------------------------

const nthOrderKinetics = z.object({
  form: z.literal('nth-order'),
  aPerS: quantity({ gt: 0, max: 1e30, unit: '1/s' }),
  eJPerMol: quantity(R.activation),
  n: quantity(R.exponent),
});

const kamalSourourKinetics = z.object({
  form: z.literal('kamal-sourour'),
  a1PerS: quantity(R.preExpPerS),
  e1JPerMol: quantity(R.activation),
  a2PerS: quantity(R.preExpPerS),
  e2JPerMol: quantity(R.activation),
  m: quantity(R.exponent),
  n: quantity(R.exponent),
});

// Lee–Loos–Springer (J. Compos. Mater. 16, 1982): constants are per minute as published; A2 is negative there.
const leeLoosSpringerKinetics = z.object({
  form: z.literal('lee-loos-springer'),
  a1PerMin: quantity({ min: 0, max: 1e30, unit: '1/min' }),
  a2PerMin: quantity({ min: -1e30, max: 1e30, unit: '1/min' }),
  a3PerMin: quantity({ gt: 0, max: 1e30, unit: '1/min' }),
  e1JPerMol: quantity(R.activation),
  e2JPerMol: quantity(R.activation),
  e3JPerMol: quantity(R.activation),
  // B − α must stay positive up to the branch switch or the low-cure rate turns negative.
  b: quantity({ gt: LLS_SWITCH_ALPHA, max: 5 }),
});

export const kineticsSchema = z.discriminatedUnion('form', [nthOrderKinetics, kamalSourourKinetics, leeLoosSpringerKinetics], {
  error: (iss) =>
    `unknown kinetics form ${formatValue((iss.input as { form?: unknown })?.form)}: allowed 'nth-order', 'kamal-sourour', 'lee-loos-springer'`,
});

// Diffusion factor f_d = 1/(1 + exp(C(α − (α_C0 + α_CT·T)))) (Chern & Poehlein 1987); T in kelvin.
const diffusionSchema = z.object({
  c: quantity({ gt: 0, max: 500 }),
  alphaC0: quantity({ min: -5, max: 5 }),
  alphaCTPerK: quantity({ min: -0.1, max: 0.1, unit: '1/K' }),
});

/** A list with a length range whose error says how many came and what is allowed ("0 plies: allowed 1 to 200"). */
function listOf<T extends z.ZodType>(item: T, min: number, max: number, one: string, many: string) {
  const error = (iss: { input?: unknown }) => {
    const n = Array.isArray(iss.input) ? iss.input.length : 0;
    return `${n} ${n === 1 ? one : many}: allowed ${min} to ${max}`;
  };
  return z.array(item).min(min, { error }).max(max, { error });
}

const cureTableSchema = z.object({
  alpha: listOf(quantity(R.fraction), 2, 100, 'point', 'points'),
  log10a: listOf(quantity({ min: -50, max: 50 }), 2, 100, 'point', 'points'),
});

const modulusSchema = z.object({
  model: z.enum(['prony', 'chile'], { error: (iss) => `unknown modulus model ${formatValue(iss.input)}: allowed 'prony', 'chile'` }),
  unrelaxedGPa: quantity({ gt: 0, max: 100, unit: 'GPa' }),
  relaxedGPa: quantity({ gt: 0, max: 100, unit: 'GPa' }),
  poisson: quantity(R.poisson),
  prony: z.object({
    weights: listOf(quantity(R.fraction), 1, 40, 'term', 'terms'),
    timesS: listOf(quantity({ gt: 0, max: 1e40, unit: 's' }), 1, 40, 'term', 'terms'),
  }),
  shift: z.object({
    // WLF (Williams, Landel & Ferry 1955), referenced to T_r = Tg(α) + offset; Arrhenius below T_r.
    wlfC1: quantity({ min: 0, max: 200 }),
    wlfC2K: quantity({ gt: 0, max: 2000, unit: 'K' }),
    offsetC: quantity({ min: -200, max: 200, unit: '°C' }),
    arrheniusEJPerMol: quantity({ min: 0, max: 2e6, unit: 'J/mol' }),
    cureTable: cureTableSchema.optional(),
  }),
  chile: z.object({
    glassyOffsetC: quantity({ min: -300, max: 300, unit: '°C' }),
    rubberyOffsetC: quantity({ min: -300, max: 300, unit: '°C' }),
  }),
});

export const resinCardSchema = z
  .object({
    name: label(),
    provenance: provenanceSchema,
    kinetics: kineticsSchema,
    diffusion: diffusionSchema.optional(),
    heatOfReactionKJPerKg: quantity({ min: 0, max: 2000, unit: 'kJ/kg' }),
    densityKgM3: quantity({ min: 500, max: 3000, unit: 'kg/m³' }),
    specificHeatJPerKgK: quantity(R.specificHeat),
    conductivityWPerMK: quantity({ gt: 0, max: 10, unit: 'W/(m·K)' }),
    glassTransition: z.object({
      tg0C: quantity({ min: -150, max: 300, unit: '°C' }),
      tgInfC: quantity({ min: -150, max: 500, unit: '°C' }),
      // DiBenedetto λ = ΔCp∞/ΔCp0 (Pascault & Williams 1990), between 0 and 1.
      lambda: quantity({ gt: 0, max: 1 }),
    }),
    gelPoint: quantity({ min: 0.05, max: 0.95 }),
    modulus: modulusSchema,
    cteMicroPerK: quantity({ min: 0, max: 500, unit: 'µ/K' }),
    totalShrinkagePct: quantity({ min: 0, max: 20, unit: '%' }),
  })
  .superRefine((card, ctx) => {
    const gt = card.glassTransition;
    if (gt.tgInfC <= gt.tg0C) {
      ctx.addIssue({
        code: 'custom',
        path: ['glassTransition', 'tgInfC'],
        input: gt.tgInfC,
        message: `Tg∞ ${formatValue(gt.tgInfC)} °C is out of range: allowed > Tg0 (${formatValue(gt.tg0C)} °C)`,
      });
    }
    const m = card.modulus;
    if (m.relaxedGPa >= m.unrelaxedGPa) {
      ctx.addIssue({
        code: 'custom',
        path: ['modulus', 'relaxedGPa'],
        input: m.relaxedGPa,
        message: `relaxed modulus ${formatValue(m.relaxedGPa)} GPa is out of range: allowed < unrelaxed modulus (${formatValue(m.unrelaxedGPa)} GPa)`,
      });
    }
    const { weights, timesS } = m.prony;
    if (weights.length !== timesS.length) {
      ctx.addIssue({
        code: 'custom',
        path: ['modulus', 'prony', 'timesS'],
        input: timesS.length,
        message: `${timesS.length} relaxation times for ${weights.length} weights: allowed exactly one time per weight`,
      });
    }
    const sum = weights.reduce((s, w) => s + w, 0);
    if (!(Math.abs(sum - 1) <= WEIGHT_SUM_TOLERANCE)) {
      ctx.addIssue({
        code: 'custom',
        path: ['modulus', 'prony', 'weights'],
        input: sum,
        message: `weights sum to ${formatValue(sum)}: allowed a sum of 1 within ±${WEIGHT_SUM_TOLERANCE}`,
      });
    }
    if (m.chile.glassyOffsetC >= m.chile.rubberyOffsetC) {
      ctx.addIssue({
        code: 'custom',
        path: ['modulus', 'chile', 'glassyOffsetC'],
        input: m.chile.glassyOffsetC,
        message: `glassy offset ${formatValue(m.chile.glassyOffsetC)} °C is out of range: allowed < rubbery offset (${formatValue(m.chile.rubberyOffsetC)} °C)`,
      });
    }
    const table = m.shift.cureTable;
    if (table) {
      if (table.alpha.length !== table.log10a.length) {
        ctx.addIssue({
          code: 'custom',
          path: ['modulus', 'shift', 'cureTable', 'log10a'],
          input: table.log10a.length,
          message: `${table.log10a.length} shift values for ${table.alpha.length} cure points: allowed one per cure point`,
        });
      }
      for (let i = 1; i < table.alpha.length; i++) {
        if (!(table.alpha[i] > table.alpha[i - 1])) {
          ctx.addIssue({
            code: 'custom',
            path: ['modulus', 'shift', 'cureTable', 'alpha', i],
            input: table.alpha[i],
            message: `${formatValue(table.alpha[i])} is out of range: allowed > previous cure point (${formatValue(table.alpha[i - 1])})`,
          });
          break;
        }
      }
    }
  });

// --- Fibre card and tool ----------------------------------------------------------------------------------

export const fibreCardSchema = z.object({
  name: label(),
  provenance: provenanceSchema,
  e1GPa: quantity({ gt: 0, max: 1_000, unit: 'GPa' }),
  e2GPa: quantity({ gt: 0, max: 1_000, unit: 'GPa' }),
  g12GPa: quantity({ gt: 0, max: 1_000, unit: 'GPa' }),
  nu12: quantity(R.poisson),
  nu23: quantity({ min: 0, lt: 1 }).optional(),
  cte1MicroPerK: quantity({ min: -20, max: 100, unit: 'µ/K' }),
  cte2MicroPerK: quantity({ min: -20, max: 200, unit: 'µ/K' }),
  densityKgM3: quantity({ min: 500, max: 25_000, unit: 'kg/m³' }),
  specificHeatJPerKgK: quantity(R.specificHeat),
  conductivityAxialWPerMK: quantity(R.conductivity),
  conductivityTransverseWPerMK: quantity(R.conductivity),
});

export const toolSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('none') }),
    z.object({
      kind: z.literal('plate'),
      name: label(),
      thicknessMm: quantity({ gt: 0, max: 200, unit: 'mm' }),
      densityKgM3: quantity(R.densityKgM3),
      specificHeatJPerKgK: quantity(R.specificHeat),
      conductivityWPerMK: quantity(R.conductivity),
      cteMicroPerK: quantity({ min: -20, max: 100, unit: 'µ/K' }),
    }),
  ],
  { error: (iss) => `unknown tool kind ${formatValue((iss.input as { kind?: unknown })?.kind)}: allowed 'none', 'plate'` },
);

// --- Cycle ------------------------------------------------------------------------------------------------

const rampSegment = z.object({
  kind: z.literal('ramp'),
  rateCPerMin: quantity(R.rateCPerMin),
  targetC: quantity(R.temperatureC),
  pressureBar: quantity(R.pressureBar),
});

const holdSegment = z.object({
  kind: z.literal('hold'),
  holdMin: quantity({ gt: 0, max: 10_000, unit: 'min' }),
  pressureBar: quantity(R.pressureBar),
  /** 'lagging-part': the hold clock starts when the lagging part point has entered the band. */
  start: z
    .enum(['clock', 'lagging-part'], { error: (iss) => `unknown hold start ${formatValue(iss.input)}: allowed 'clock', 'lagging-part'` })
    .default('clock'),
  bandC: quantity({ gt: 0, max: 50, unit: '°C' }).default(5),
});

const coolSegment = z.object({
  kind: z.literal('cool'),
  rateCPerMin: quantity(R.rateCPerMin),
  /** the demould temperature when this is the last segment */
  targetC: quantity(R.temperatureC),
  pressureBar: quantity(R.pressureBar),
});

export const segmentSchema = z.discriminatedUnion('kind', [rampSegment, holdSegment, coolSegment], {
  error: (iss) => `unknown segment kind ${formatValue((iss.input as { kind?: unknown })?.kind)}: allowed 'ramp', 'hold', 'cool'`,
});

const recordPoint = z.object({
  timeMin: quantity({ min: 0, max: 100_000, unit: 'min' }),
  airC: quantity(R.temperatureC),
  toolC: quantity(R.temperatureC).optional(),
  pressureBar: quantity(R.pressureBar).optional(),
});

export const cycleSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({
      kind: z.literal('segments'),
      startC: quantity({ min: -60, max: 300, unit: '°C' }),
      segments: listOf(segmentSchema, 1, 40, 'segment', 'segments'),
    }),
    z.object({
      kind: z.literal('record'),
      points: listOf(recordPoint, 2, 20_000, 'point', 'points'),
    }),
  ],
  { error: (iss) => `unknown cycle kind ${formatValue((iss.input as { kind?: unknown })?.kind)}: allowed 'segments', 'record'` },
);

export const limitsSchema = z.object({
  minFinalCure: quantity(R.fraction),
  maxOvershootC: quantity({ min: 0, max: 500, unit: '°C' }),
  maxGradientC: quantity({ min: 0, max: 500, unit: '°C' }),
  maxHeatRateCPerMin: quantity({ gt: 0, max: 100, unit: '°C/min' }),
  maxCoolRateCPerMin: quantity({ gt: 0, max: 100, unit: '°C/min' }),
  maxWarpageMm: quantity({ min: 0, max: 10_000, unit: 'mm' }),
  maxSpringInDeg: quantity({ min: 0, max: 90, unit: '°' }),
  maxCycleMin: quantity({ gt: 0, max: 100_000, unit: 'min' }),
});

// --- The whole study --------------------------------------------------------------------------------------

export const studyParamsSchema = z
  .object({
    schemaVersion: z.literal(1, { error: (iss) => `unsupported schema version ${formatValue(iss.input)}: allowed 1` }),
    resin: resinCardSchema,
    fibre: fibreCardSchema,
    fibreVolumeFraction: quantity({ min: 0.3, max: 0.75 }),
    layup: z.object({
      plies: listOf(
        z.object({
          angleDeg: quantity({ min: -90, max: 90, unit: '°' }),
          thicknessMm: quantity({ min: 0.02, max: 2, unit: 'mm' }),
        }),
        1,
        200,
        'ply',
        'plies',
      ),
    }),
    tool: toolSchema,
    heatTransfer: z.object({
      bagSideWPerM2K: quantity({ min: 1, max: 5000, unit: 'W/(m²·K)' }),
      toolSideWPerM2K: quantity({ min: 1, max: 5000, unit: 'W/(m²·K)' }),
    }),
    mesh: z.object({ nodesPerPly: quantity({ min: 2, max: MAX_NODES_PER_PLY, int: true }) }),
    cycle: cycleSchema,
    constraint: z.enum(['free', 'tool-held'], {
      error: (iss) => `unknown constraint ${formatValue(iss.input)}: allowed 'free', 'tool-held'`,
    }),
    geometry: z.object({
      stripSpanMm: quantity({ gt: 0, max: 10_000, unit: 'mm' }),
      cornerAngleDeg: quantity({ gt: 0, max: 180, unit: '°' }),
    }),
    limits: limitsSchema,
  })
  .superRefine((study, ctx) => {
    const plies = study.layup.plies.length;
    const nodes = plies * study.mesh.nodesPerPly;
    if (nodes > MAX_LAMINATE_NODES) {
      const fits = Math.floor(MAX_LAMINATE_NODES / plies);
      ctx.addIssue({
        code: 'custom',
        path: ['mesh', 'nodesPerPly'],
        input: study.mesh.nodesPerPly,
        message:
          `${plies} plies × ${study.mesh.nodesPerPly} nodes per ply = ${nodes} nodes: allowed ≤ ${MAX_LAMINATE_NODES} nodes in the laminate` +
          (fits >= 2 ? ` (use ≤ ${fits} nodes per ply)` : ''),
      });
    }
    if (study.constraint === 'tool-held' && study.tool.kind !== 'plate') {
      ctx.addIssue({
        code: 'custom',
        path: ['constraint'],
        input: study.constraint,
        message: `'tool-held' needs a tool plate to hold the part: set a tool, or choose 'free'`,
      });
    }
    if (study.cycle.kind === 'segments') checkSegments(study.cycle.startC, study.cycle.segments, ctx);
    else checkRecord(study.cycle.points, ctx);
  });

type Segment = z.infer<typeof segmentSchema>;

/** Rules that need the whole schedule: direction of ramps and cools, dwells below room temperature, demould. */
function checkSegments(startC: number, segments: Segment[], ctx: z.RefinementCtx) {
  let currentC = startC;
  let cooledBefore = false;
  segments.forEach((seg, i) => {
    const path = ['cycle', 'segments', i];
    if (seg.kind === 'ramp') {
      if (!(seg.targetC > currentC)) {
        ctx.addIssue({
          code: 'custom',
          path: [...path, 'targetC'],
          input: seg.targetC,
          message: `ramp target ${formatValue(seg.targetC)} °C is out of range: allowed > ${formatValue(currentC)} °C (the temperature the ramp starts from); use a cool segment to go down`,
        });
      }
      currentC = seg.targetC;
    } else if (seg.kind === 'cool') {
      if (!(seg.targetC < currentC)) {
        ctx.addIssue({
          code: 'custom',
          path: [...path, 'targetC'],
          input: seg.targetC,
          message: `cool target ${formatValue(seg.targetC)} °C is out of range: allowed < ${formatValue(currentC)} °C (the temperature the cool starts from); use a ramp to go up`,
        });
      }
      currentC = seg.targetC;
      cooledBefore = true;
    } else if (currentC < ROOM_TEMPERATURE_C && !cooledBefore) {
      ctx.addIssue({
        code: 'custom',
        path,
        input: currentC,
        message: `hold at ${formatValue(currentC)} °C is below room temperature (${ROOM_TEMPERATURE_C} °C) with no cool segment before it: allowed ≥ ${ROOM_TEMPERATURE_C} °C, or add a cool segment that brings the air there`,
      });
    }
  });
  const totalMin = segments.reduce((sum, seg, i) => {
    if (seg.kind === 'hold') return sum + seg.holdMin;
    if (!(seg.rateCPerMin > 0)) return sum; // refused on its own field
    const from = i === 0 ? startC : targetBefore(startC, segments, i);
    return sum + Math.abs(seg.targetC - from) / seg.rateCPerMin;
  }, 0);
  if (totalMin > MAX_CYCLE_MIN) {
    ctx.addIssue({
      code: 'custom',
      path: ['cycle', 'segments'],
      input: totalMin,
      message: `the schedule lasts ${formatValue(totalMin)} min: allowed ≤ ${MAX_CYCLE_MIN} min (14 days)`,
    });
  }
  const last = segments[segments.length - 1];
  if (last && last.kind !== 'cool') {
    ctx.addIssue({
      code: 'custom',
      path: ['cycle', 'segments', segments.length - 1, 'kind'],
      input: last.kind,
      message: `the cycle ends with a '${last.kind}' segment: allowed only 'cool' as the last segment (it sets the demould temperature)`,
    });
  }
}

/** Air set point at the start of segment i (the target of the last ramp or cool before it). */
function targetBefore(startC: number, segments: Segment[], i: number): number {
  for (let j = i - 1; j >= 0; j--) {
    const seg = segments[j];
    if (seg.kind !== 'hold') return seg.targetC;
  }
  return startC;
}

function checkRecord(points: { timeMin: number }[], ctx: z.RefinementCtx) {
  const spanMin = points[points.length - 1].timeMin - points[0].timeMin;
  if (spanMin > MAX_CYCLE_MIN) {
    ctx.addIssue({
      code: 'custom',
      path: ['cycle', 'points', points.length - 1, 'timeMin'],
      input: spanMin,
      message: `the record spans ${formatValue(spanMin)} min: allowed ≤ ${MAX_CYCLE_MIN} min (14 days)`,
    });
  }
  for (let i = 1; i < points.length; i++) {
    if (!(points[i].timeMin > points[i - 1].timeMin)) {
      ctx.addIssue({
        code: 'custom',
        path: ['cycle', 'points', i, 'timeMin'],
        input: points[i].timeMin,
        message: `${formatValue(points[i].timeMin)} min is out of range: allowed > ${formatValue(points[i - 1].timeMin)} min (times must increase)`,
      });
      return;
    }
  }
}

export type StudyParams = z.infer<typeof studyParamsSchema>;
/** What a client may send: defaults (hold start, band) may be left out. */
export type StudyParamsInput = z.input<typeof studyParamsSchema>;
export type ResinCard = z.infer<typeof resinCardSchema>;
export type FibreCard = z.infer<typeof fibreCardSchema>;
export type Kinetics = z.infer<typeof kineticsSchema>;
export type Tool = z.infer<typeof toolSchema>;
export type ToolPlate = Extract<Tool, { kind: 'plate' }>;
export type Cycle = z.infer<typeof cycleSchema>;
export type SegmentCycle = Extract<Cycle, { kind: 'segments' }>;
export type RecordCycle = Extract<Cycle, { kind: 'record' }>;
export type CycleSegment = Segment;
export type Limits = z.infer<typeof limitsSchema>;

export interface StudyIssue {
  /** dotted path to the field, e.g. 'cycle.segments.0.rateCPerMin' ('' for the whole study) */
  path: string;
  /** names the value and the allowed range */
  message: string;
}

export type StudyValidation = { ok: true; params: StudyParams } | { ok: false; issues: StudyIssue[] };

export function pathToString(path: readonly PropertyKey[]): string {
  return path.map((p) => String(p)).join('.');
}

export function validateStudy(x: unknown): StudyValidation {
  const result = studyParamsSchema.safeParse(x);
  if (result.success) return { ok: true, params: result.data };
  return {
    ok: false,
    issues: result.error.issues.map((iss) => ({ path: pathToString(iss.path), message: iss.message })),
  };
}

/** Thrown by the solver when its input is not a valid study; `issues` says which fields and why. */
export class StudyInputError extends Error {
  readonly issues: StudyIssue[];
  constructor(issues: StudyIssue[]) {
    const head = issues.slice(0, 5).map((i) => `${i.path || '(study)'}: ${i.message}`);
    const more = issues.length > 5 ? [`…and ${issues.length - 5} more`] : [];
    super(`invalid study input: ${[...head, ...more].join('; ')}`);
    this.name = 'StudyInputError';
    this.issues = issues;
  }
}

/** Validate or throw StudyInputError. */
export function parseStudy(x: unknown): StudyParams {
  const v = validateStudy(x);
  if (!v.ok) throw new StudyInputError(v.issues);
  return v.params;
}

export { describeRange, inRange };
