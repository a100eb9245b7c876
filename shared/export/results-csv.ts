import Papa from 'papaparse';
import type { StudyParams } from '../schemas/study';
import type { SimulationResult } from '../solver/simulate';
import { kToC, paToBar, paToMpa, sToMin, mToMm } from '../units';
import { formatQuantity } from '../compare/field-labels';
import { describeSegmentSettings, segmentNames } from '../compare/segment-names';

// Results as one CSV file for people who will not open the tool: a header block (what was run, with which
// material cards and model version, in which units), then the time histories, the final ply stresses and the
// limit verdicts. Engineering units throughout; each column header carries its unit in brackets.

export interface CsvMeta {
  study: string;
  /** revision number; null for unsaved edits */
  revision: number | null;
  /** written instead of the number when given, e.g. 'demo study (not in the library)' */
  revisionLabel?: string;
  part?: string;
  params: StudyParams;
  exportedAt: Date;
}

export type CsvResult = Pick<SimulationResult, 'modelVersion' | 'history' | 'plyStresses' | 'summary'>;

/** First cell of each section's title row; readers find sections by it. */
export const CSV_SECTION = 'section';
export const CSV_TITLE = 'Dwellform results';

type HistoryKey = keyof SimulationResult['history'];

/** History columns in order: field, header with unit, conversion from SI. */
export const HISTORY_COLUMNS: readonly { key: HistoryKey; header: string; fromSi: (v: number) => number }[] = [
  { key: 'timeS', header: 'time [min]', fromSi: sToMin },
  { key: 'setpointK', header: 'air set point [°C]', fromSi: kToC },
  { key: 'airK', header: 'air [°C]', fromSi: kToC },
  { key: 'toolK', header: 'tool [°C]', fromSi: kToC },
  { key: 'toolSideSurfaceK', header: 'part tool-side surface [°C]', fromSi: kToC },
  { key: 'midPlaneK', header: 'part mid-plane [°C]', fromSi: kToC },
  { key: 'bagSurfaceK', header: 'part bag-side surface [°C]', fromSi: kToC },
  { key: 'pressurePa', header: 'pressure [bar]', fromSi: paToBar },
  { key: 'alphaMin', header: 'degree of cure min [-]', fromSi: (v) => v },
  { key: 'alphaMax', header: 'degree of cure max [-]', fromSi: (v) => v },
  { key: 'tgMidK', header: 'Tg mid-plane [°C]', fromSi: kToC },
  { key: 'resinModulusMidPa', header: 'resin modulus mid-plane [MPa]', fromSi: paToMpa },
];

export const PLY_STRESS_HEADER = ['ply', 'position', 'angle [°]', 'z from tool side [mm]', 'sigma1 [MPa]', 'sigma2 [MPa]', 'tau12 [MPa]'];
export const LIMITS_HEADER = ['limit', 'value', 'limit value', 'unit', 'verdict', 'at time [min]', 'at z [mm]'];

/** Nine significant digits: well inside the solver's accuracy, and round-trips through a spreadsheet. */
function num(v: number): number {
  return Number(v.toPrecision(9));
}

function describeCard(card: { name: string; provenance: { source: string } }): string {
  return `${card.name} (source: ${card.provenance.source})`;
}

/** The cycle in the header block, a row per segment named as on the cycle editor ("Ramp 1", "Dwell 1"). */
function cycleRows(cycle: StudyParams['cycle']): string[][] {
  if (cycle.kind === 'record') return [['cycle', `measured record of ${cycle.points.length} points`]];
  const names = segmentNames(cycle.segments);
  return [['cycle start', formatQuantity(cycle.startC, '°C')], ...cycle.segments.map((s, i) => [names[i], describeSegmentSettings(s)])];
}

export function resultsToCsv(result: CsvResult, meta: CsvMeta): string {
  const { history, plyStresses, summary } = result;
  const rowsOfHistory = history.timeS.length;
  const plyPoints = plyStresses.zM.length;
  const angles = meta.params.layup.plies.map((p) => p.angleDeg);

  const rows: (string | number)[][] = [
    // Two cells, so a reader that guesses the delimiter from the first lines finds the comma.
    [CSV_TITLE, 'comma-separated, UTF-8, one header block then sections'],
    ['study', meta.study],
    ['revision', meta.revisionLabel ?? (meta.revision === null ? 'unsaved edits' : meta.revision)],
    ...(meta.part ? [['part', meta.part]] : []),
    ['resin card', describeCard(meta.params.resin)],
    ['fibre card', describeCard(meta.params.fibre)],
    ['fibre volume fraction', meta.params.fibreVolumeFraction],
    ['plies', meta.params.layup.plies.length],
    ['model version', result.modelVersion],
    ['exported at', meta.exportedAt.toISOString()],
    ['units', 'time in min; temperatures in °C; pressure in bar; stresses and modulus in MPa; z in mm from the tool side; degree of cure as a fraction 0..1'],
    ['time history rows', rowsOfHistory],
    ['ply stress rows', plyPoints],
    ...(summary.warnings ?? []).map((w) => ['solver note', w]),
    ['caution', 'Predictions support, and never replace, part qualification, process specifications, local codes and licensed engineering practice.'],
    // Last in the block, so the fixed rows above keep their places for readers that count them.
    ...cycleRows(meta.params.cycle),
    [],
    [CSV_SECTION, 'time histories'],
    HISTORY_COLUMNS.map((c) => c.header),
  ];
  for (let i = 0; i < rowsOfHistory; i++) {
    rows.push(HISTORY_COLUMNS.map((c) => num(c.fromSi(history[c.key][i]))));
  }

  rows.push([], [CSV_SECTION, 'final ply stresses'], PLY_STRESS_HEADER);
  for (let i = 0; i < plyPoints; i++) {
    const ply = plyStresses.plyIndex[i];
    // Two points per ply, bottom then top (the solver contract).
    const position = i > 0 && plyStresses.plyIndex[i - 1] === ply ? 'top' : 'bottom';
    rows.push([
      ply + 1,
      position,
      angles[ply] ?? '',
      num(mToMm(plyStresses.zM[i])),
      num(paToMpa(plyStresses.sigma1Pa[i])),
      num(paToMpa(plyStresses.sigma2Pa[i])),
      num(paToMpa(plyStresses.tau12Pa[i])),
    ]);
  }

  rows.push([], [CSV_SECTION, 'limits'], LIMITS_HEADER);
  for (const l of summary.limits) {
    rows.push([l.label, num(l.value), num(l.limit), l.unit, l.pass ? 'pass' : 'fail', l.atTimeMin ?? '', l.atZMm ?? '']);
  }

  // CRLF per RFC 4180; papaparse quotes fields holding commas, quotes or line breaks.
  return Papa.unparse(rows, { newline: '\r\n' });
}

/** A file name that sorts by study and revision: "dwellform-two-dwell-cycle-r3.csv". */
export function csvFileName(study: string, revision: number | null, withoutRevision = 'unsaved'): string {
  const slug = study
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '') // drop accents: "Ö" → "o"
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `dwellform-${slug || 'study'}-${revision === null ? withoutRevision : `r${revision}`}.csv`;
}
