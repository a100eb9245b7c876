import Papa from 'papaparse';
import { INSPECT_ROWS, MAX_RUN_LOG_BYTES, MAX_RUN_LOG_COLUMNS, MAX_RUN_LOG_ROWS } from './limits';
import {
  mappingFromProposal,
  proposeMapping,
  runLogMappingSchema,
  type ChannelMapping,
  type ColumnProposal,
  type ColumnSample,
  type RunLogMapping,
} from './column-mapping';
import { RunLogParseError } from './run-log-error';
import { MIDNIGHT_ROLLOVER_S, timestampKind, timestampSeconds } from './timestamps';
import { pressureToPa, temperatureToK, timeToS, vacuumDepthPa } from './units';
import type { RunLog, RunLogChannel } from './types';
import { ROLE_NOUN, withArticle } from './words';

// Reading a run-log CSV: papaparse splits the text (never a hand-written splitter); this module reads the
// cells. `inspectRunLog` looks at the head and tail of the file to propose a mapping; `parseRunLog` reads
// every row with the confirmed mapping into SI series, refusing the file at the first broken cell.

const DELIMITERS = [',', ';', '\t'];
const DELIMITER_NAMES: Record<string, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };
const TAIL_CHARS = 16_384;
/** Most non-blank lines a logger's preamble may take above the table. */
const PREAMBLE_MAX = 20;

/** The most common field count (ties to the wider), i.e. the table's width. */
function usualWidth(counts: number[]): number {
  const tally = new Map<number, number>();
  for (const c of counts) tally.set(c, (tally.get(c) ?? 0) + 1);
  let best = 0;
  let bestCount = 0;
  for (const [width, n] of tally) if (n > bestCount || (n === bestCount && width > best)) [best, bestCount] = [width, n];
  return best;
}

export interface RunLogInspection {
  delimiter: string;
  /** true when numbers use a decimal comma (only with semicolon or tab delimiters) */
  decimalComma: boolean;
  hasHeader: boolean;
  /** the line (1-based) of the header, or of the first data row when there is none; lines above are preamble */
  firstLine: number;
  headers: string[];
  /** the first rows as text, for the mapping step's preview table */
  previewRows: string[][];
  /** the first data row, and the last one when the text read holds it (for the span of the log) */
  firstRow: string[];
  lastRow: string[] | null;
  /** data rows read, and whether that is the whole file */
  rowsSeen: number;
  wholeFile: boolean;
  proposal: ColumnProposal[];
  mapping: RunLogMapping;
}

export interface ParseOptions {
  /** size of the file in bytes when known (the text length is used otherwise) */
  byteLength?: number;
  maxBytes?: number;
  maxRows?: number;
  /** called now and then with the share of the text read, 0..1 */
  onProgress?: (fraction: number) => void;
}

const isBlankRow = (row: string[]) => row.length === 0 || (row.length === 1 && row[0].trim() === '');

/** A number cell: finite number, null for an empty cell, NaN for text that is not a number. */
export function readNumberCell(cell: string, decimalComma: boolean): number | null {
  // Number() ignores surrounding white space and reads '' and '  ' as 0: only a 0 needs the emptiness check.
  // (This runs once per cell of a million-row file, so it avoids trimming every cell.)
  const v = Number(decimalComma ? cell.replace(',', '.') : cell);
  if (v === 0 && cell.trim() === '') return null;
  return v - v === 0 ? v : NaN;
}

function isNumberLike(cell: string, decimalComma: boolean): boolean {
  const v = readNumberCell(cell, decimalComma);
  return v !== null && !Number.isNaN(v);
}

function checkSize(byteLength: number, maxBytes: number) {
  if (byteLength === 0) throw new RunLogParseError('the file is empty', { line: 1 });
  if (byteLength > maxBytes) {
    const mb = (n: number) => `${(n / (1024 * 1024)).toFixed(1)} MB`;
    throw new RunLogParseError(`the file is ${mb(byteLength)}: allowed ≤ ${mb(maxBytes)}`);
  }
}

function stripBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/** Looks at the first rows (and the last few) to find the delimiter, the header and a proposed mapping. */
export function inspectRunLog(input: string, options: Pick<ParseOptions, 'byteLength' | 'maxBytes'> = {}): RunLogInspection {
  checkSize(options.byteLength ?? input.length, options.maxBytes ?? MAX_RUN_LOG_BYTES);
  const text = stripBom(input);
  if (text.trim() === '') throw new RunLogParseError('the file is empty (only blank lines)', { line: 1 });

  // Blank lines stay in as rows of one empty field so that row i is line i + 1.
  const parseHead = (config: Papa.ParseConfig<string[]>) => Papa.parse<string[]>(text, { preview: PREAMBLE_MAX + INSPECT_ROWS + 1, ...config });
  let head = parseHead({ delimitersToGuess: DELIMITERS });
  if (head.errors.some((e) => e.code === 'UndetectableDelimiter')) {
    // papaparse guesses from field counts that agree row by row; a preamble or a broken row defeats that
    // guess, so take the delimiter that splits some early line into the most fields.
    const widest = (d: string) => Math.max(...Papa.parse<string[]>(text, { delimiter: d, preview: PREAMBLE_MAX + 10 }).data.map((r) => r.length));
    const best = DELIMITERS.map((d) => ({ d, fields: widest(d) })).sort((a, b) => b.fields - a.fields)[0];
    if (best.fields >= 2) head = parseHead({ delimiter: best.d });
  }
  const delimiter = head.meta.delimiter;
  const lines = head.data.map((row, i) => ({ row, line: i + 1 })).filter((x) => !isBlankRow(x.row));
  // The table starts at the first line with the usual field count; lines above it are a logger's preamble
  // (job number, vessel, operator…), skipped.
  const width = usualWidth(lines.map((x) => x.row.length));
  const start = lines.findIndex((x) => x.row.length === width);
  if (head.errors.some((e) => e.code === 'UndetectableDelimiter') || !DELIMITERS.includes(delimiter) || width < 2 || start < 0 || start > PREAMBLE_MAX) {
    throw new RunLogParseError(
      'found no comma, semicolon or tab between the fields: a run log needs a time column and at least one channel, separated by one of those',
      { line: 1 },
    );
  }
  if (width > MAX_RUN_LOG_COLUMNS) {
    throw new RunLogParseError(`${width} columns: allowed ≤ ${MAX_RUN_LOG_COLUMNS}`, { line: lines[start].line });
  }
  const quoteError = head.errors.find((e) => e.code === 'MissingQuotes' || e.code === 'InvalidQuotes');
  if (quoteError) throw new RunLogParseError(`broken quoting: ${quoteError.message}`, { line: (quoteError.row ?? 0) + 1 });

  const rows = lines.slice(start).map((x) => x.row);
  const firstLine = lines[start].line;
  const decimalComma = delimiter !== ',' && rows.slice(0, 20).some((r) => r.some((c) => /^\s*-?\d+,\d+\s*$/.test(c)));
  const first = rows[0];
  const hasHeader = first.some((c) => c.trim() !== '' && !isNumberLike(c, decimalComma) && timestampKind(c) === null);
  const headers = hasHeader ? first.map((h, i) => h.trim() || `Column ${i + 1}`) : first.map((_, i) => `Column ${i + 1}`);
  const dataRows = (hasHeader ? rows.slice(1) : rows).slice(0, INSPECT_ROWS);
  if (dataRows.length === 0) throw new RunLogParseError('no data rows under the header', { line: firstLine + 1 });

  // The tail shows the end of the run (span of the time column, the cool-down): the part after the first
  // line break is parsed on its own with the same delimiter.
  let tailRows: string[][] = [];
  if (text.length > TAIL_CHARS * 2) {
    const tailText = text.slice(text.indexOf('\n', text.length - TAIL_CHARS) + 1);
    tailRows = Papa.parse<string[]>(tailText, { delimiter, skipEmptyLines: 'greedy' }).data.filter((r) => r.length === headers.length);
  }
  const sampled = [...dataRows, ...tailRows];
  const samples: ColumnSample[] = headers.map((header, col) => {
    const numbers: number[] = [];
    let timestamps = 0;
    let filled = 0;
    for (const row of sampled) {
      const cell = row[col] ?? '';
      if (cell.trim() === '') continue;
      filled++;
      if (timestampKind(cell) !== null) timestamps++;
      const v = readNumberCell(cell, decimalComma);
      if (v !== null && !Number.isNaN(v)) numbers.push(v);
    }
    return { header, numbers, timestamps, filled };
  });
  const proposal = proposeMapping(samples);
  // papaparse stops at `preview` rows: fewer rows than that means the text ran out, i.e. the whole file
  const wholeFile = head.data.length < PREAMBLE_MAX + INSPECT_ROWS + 1;
  let lastRow: string[] | null = wholeFile ? (dataRows[dataRows.length - 1] ?? null) : (tailRows[tailRows.length - 1] ?? null);
  if (!lastRow) {
    const end = Papa.parse<string[]>(text.slice(text.indexOf('\n', Math.max(0, text.length - 4096)) + 1), { delimiter, skipEmptyLines: 'greedy' }).data;
    lastRow = end.filter((r) => r.length === headers.length).pop() ?? null;
  }
  return {
    delimiter,
    decimalComma,
    hasHeader,
    firstLine,
    headers,
    previewRows: dataRows.slice(0, 10),
    firstRow: dataRows[0],
    lastRow,
    rowsSeen: dataRows.length,
    wholeFile,
    proposal,
    mapping: mappingFromProposal(proposal),
  };
}

/** A Float64Array that grows by doubling while rows arrive. */
class SeriesBuilder {
  values: Float64Array;
  length = 0;
  constructor(capacity: number) {
    this.values = new Float64Array(Math.max(16, capacity));
  }
  push(v: number) {
    if (this.length === this.values.length) {
      const next = new Float64Array(this.values.length * 2);
      next.set(this.values);
      this.values = next;
    }
    this.values[this.length++] = v;
  }
  done(): Float64Array {
    return this.values.slice(0, this.length);
  }
}

function channelKey(c: ChannelMapping): string {
  return c.role === 'part' ? `part:${c.label.trim()}` : c.role;
}

/** SI value of one channel reading, per the channel's confirmed unit. */
function toSI(c: ChannelMapping, v: number): number {
  switch (c.role) {
    case 'pressure':
      return pressureToPa(v, c.unit);
    case 'vacuum':
      return vacuumDepthPa(v, c.unit, c.reference);
    default:
      return temperatureToK(v, c.unit);
  }
}

function fmtTime(s: number, unit: string): string {
  return unit === 'timestamp' ? `${s} s` : `${Number(s.toPrecision(8))} ${unit}`;
}

/**
 * Every row read into SI series with a confirmed mapping. Refuses the file (RunLogParseError naming line,
 * column and why) at a row with a different field count, a time that does not increase, text in a numeric
 * column, too many rows, or no rows at all. Empty channel cells are kept as missing readings (NaN).
 */
export function parseRunLog(input: string, mappingInput: unknown, options: ParseOptions = {}): RunLog {
  const inspection = inspectRunLog(input, options);
  const checked = runLogMappingSchema.safeParse(mappingInput);
  if (!checked.success) {
    const issue = checked.error.issues[0];
    throw new RunLogParseError(`column mapping: ${issue.path.length ? `${issue.path.join('.')}: ` : ''}${issue.message}`);
  }
  const mapping = checked.data;
  const { delimiter, decimalComma, hasHeader, headers, firstLine } = inspection;
  for (const c of mapping.columns) {
    if (c.column >= headers.length) {
      throw new RunLogParseError(`column mapping names column ${c.column + 1}, but the file has ${headers.length} columns`);
    }
  }
  const timeMap = mapping.columns.find((c) => c.role === 'time')!;
  const channels = mapping.columns.filter((c): c is ChannelMapping => c.role !== 'time' && c.role !== 'ignore');
  const maxRows = options.maxRows ?? MAX_RUN_LOG_ROWS;
  const text = stripBom(input);

  const estimate = Math.min(maxRows, Math.ceil(text.length / Math.max(8, text.indexOf('\n') + 1)) + 16);
  const time = new SeriesBuilder(estimate);
  const series = channels.map(() => new SeriesBuilder(estimate));
  const timeHeader = headers[timeMap.column];

  let line = 0;
  let failure: RunLogParseError | null = null;
  let prevS = -Infinity;
  let prevRaw = NaN;
  let t0 = NaN;
  let dayOffsetS = 0;
  let startedAt: string | null = null;
  const progressEvery = 50_000;

  let activeParser: Papa.Parser | null = null;
  // One closure for the whole parse (not one per row): records the first failure and stops papaparse.
  const fail = (reason: string, column: string | null) => {
    failure = new RunLogParseError(reason, { line, column });
    activeParser?.abort();
  };

  Papa.parse<string[]>(text, {
    delimiter,
    step: (result, parser) => {
      activeParser = parser;
      line++;
      const row = result.data;
      if (line < firstLine || (line === firstLine && hasHeader)) return;
      if (isBlankRow(row)) return;
      if (result.errors.length > 0) {
        const quote = result.errors.find((e) => e.code === 'MissingQuotes' || e.code === 'InvalidQuotes');
        if (quote) return fail(`broken quoting: ${quote.message}`, null);
      }
      if (row.length !== headers.length) {
        return fail(
          `${row.length} fields where the header has ${headers.length}: the fields must be separated by ${DELIMITER_NAMES[delimiter]}s throughout (a different delimiter or a broken row)`,
          null,
        );
      }
      if (time.length >= maxRows) return fail(`more than ${maxRows.toLocaleString('en-US')} data rows: allowed ≤ ${maxRows.toLocaleString('en-US')}`, null);

      // Time: elapsed seconds from the first row, strictly increasing.
      const cell = row[timeMap.column];
      let s: number;
      if (timeMap.unit === 'timestamp') {
        const kind = timestampKind(cell);
        const raw = timestampSeconds(cell);
        if (kind === null || Number.isNaN(raw)) return fail(`${JSON.stringify(cell.trim())} is not a time stamp (expected e.g. 2026-03-14 08:00:05 or 08:00:05)`, timeHeader);
        if (Number.isNaN(t0)) {
          t0 = raw;
          if (kind === 'date-time') startedAt = new Date(raw * 1000).toISOString();
        }
        if (kind === 'clock' && raw + dayOffsetS < prevRaw - MIDNIGHT_ROLLOVER_S) dayOffsetS += 86_400;
        prevRaw = raw + dayOffsetS;
        s = raw + dayOffsetS - t0;
      } else {
        const v = readNumberCell(cell, decimalComma);
        if (v === null) return fail('the time cell is empty: every row needs a time', timeHeader);
        if (Number.isNaN(v)) return fail(`${JSON.stringify(cell.trim())} is not a number (the time column must be numeric in ${timeMap.unit})`, timeHeader);
        if (Number.isNaN(t0)) t0 = timeToS(v, timeMap.unit);
        s = timeToS(v, timeMap.unit) - t0;
      }
      if (!(s > prevS)) {
        const unit = timeMap.unit === 'timestamp' ? 's' : timeMap.unit;
        const shown = (x: number) => (timeMap.unit === 'timestamp' ? x : x / timeToS(1, timeMap.unit as 's'));
        return fail(
          `time ${fmtTime(shown(s), unit)} is not after the previous row's ${fmtTime(shown(prevS), unit)}: times must increase row by row`,
          timeHeader,
        );
      }
      prevS = s;

      // Channels: SI values; empty cells are missing readings, text is refused.
      for (let k = 0; k < channels.length; k++) {
        const c = channels[k];
        const v = readNumberCell(row[c.column], decimalComma);
        if (v === null) {
          series[k].push(NaN);
          continue;
        }
        if (Number.isNaN(v)) {
          return fail(`${JSON.stringify(row[c.column].trim())} is not a number: ${withArticle(ROLE_NOUN[c.role])} column must hold numbers (or be empty where a reading is missing)`, headers[c.column]);
        }
        series[k].push(toSI(c, v));
      }
      time.push(s);
      if (options.onProgress && time.length % progressEvery === 0) options.onProgress(result.meta.cursor / text.length);
    },
  });
  if (failure) throw failure;
  if (time.length === 0) throw new RunLogParseError('no data rows under the header', { line: hasHeader ? firstLine + 1 : firstLine });
  if (time.length < 2) throw new RunLogParseError('only one data row: a run log needs at least two', { line: line });
  options.onProgress?.(1);

  const out: RunLogChannel[] = channels.map((c, k) => ({
    key: channelKey(c),
    role: c.role,
    label: c.label.trim(),
    column: c.column,
    header: headers[c.column],
    sourceUnit: c.role === 'vacuum' ? `${c.unit} ${c.reference}` : c.unit,
    ...(c.role === 'part' ? { position: c.position } : {}),
    ...(c.keepIfFlagged ? { keepIfFlagged: true } : {}),
    values: series[k].done(),
  }));
  return { timeS: time.done(), channels: out, startedAt, rows: time.length };
}
