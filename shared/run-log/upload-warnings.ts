import { SHORT_LOG_MIN, SHORT_LOG_ROWS } from './limits';
import type { RunLogMapping } from './column-mapping';
import type { RunLogInspection } from './parse-run-log';
import { timestampSeconds } from './timestamps';
import { timeToS, timeUnitFromHeader } from './units';
import { round } from './series';
import type { Finding, RunLog } from './types';

// Logs that parse but deserve a second look before they are trusted: a time column whose unit was guessed
// from its values (a wrong guess stretches every rate and hold by 60), and logs too short to hold a cure
// cycle. They are allowed once the uploader confirms; the stored record keeps them as findings.

const UNIT_WORD = { s: 'seconds', min: 'minutes', h: 'hours' } as const;

/** The time column's unit was not in its header: which unit is used, and why. Null when the header names it. */
function inferredTimeUnit(mapping: RunLogMapping, headers: string[], reason: string | null): string | null {
  const time = mapping.columns.find((c) => c.role === 'time');
  if (!time || time.unit === 'timestamp') return null;
  const header = headers[time.column] ?? time.header;
  if (timeUnitFromHeader(header) !== null) return null;
  return `the time column “${header}” names no unit; it is read as ${UNIT_WORD[time.unit]} (${reason ?? 'as set in the mapping'}): a wrong unit stretches or squeezes every rate and hold`;
}

function spanS(mapping: RunLogMapping, first: string[], last: string[], decimalComma: boolean): number | null {
  const time = mapping.columns.find((c) => c.role === 'time');
  if (!time) return null;
  const a = first[time.column] ?? '';
  const b = last[time.column] ?? '';
  if (time.unit === 'timestamp') {
    const s = timestampSeconds(b) - timestampSeconds(a);
    return Number.isFinite(s) ? s : null;
  }
  const num = (c: string) => Number(decimalComma ? c.replace(',', '.') : c);
  const s = timeToS(num(b), time.unit) - timeToS(num(a), time.unit);
  return Number.isFinite(s) ? s : null;
}

/** What the uploader must confirm before sending this file with this mapping (empty: nothing). */
export function uploadWarnings(inspection: RunLogInspection, mapping: RunLogMapping): string[] {
  const out: string[] = [];
  const proposal = inspection.proposal.find((p) => p.role === 'time');
  const chosen = mapping.columns.find((c) => c.role === 'time');
  const reason = proposal && chosen && proposal.column === chosen.column && proposal.unit === chosen.unit ? proposal.reason : null;
  const unit = inferredTimeUnit(mapping, inspection.headers, reason);
  if (unit) out.push(`${unit[0].toUpperCase()}${unit.slice(1)}.`);
  if (inspection.wholeFile && inspection.rowsSeen < SHORT_LOG_ROWS) {
    out.push(`Only ${inspection.rowsSeen} data row${inspection.rowsSeen === 1 ? '' : 's'} (fewer than ${SHORT_LOG_ROWS}): too few to show a cure cycle's ramps and holds.`);
  }
  const span = inspection.lastRow ? spanS(mapping, inspection.firstRow, inspection.lastRow, inspection.decimalComma) : null;
  if (span !== null && span < SHORT_LOG_MIN * 60) {
    out.push(`The log covers only ${round(span / 60, 3)} min (less than ${SHORT_LOG_MIN} min): too short for a cure cycle; check the time unit or that the whole record was exported.`);
  }
  return out;
}

/** The same warnings as findings on the stored record, from the whole parsed log. */
export function logWarningFindings(log: RunLog, mapping: RunLogMapping): Finding[] {
  const out: Finding[] = [];
  const base = { channel: 'record', atMin: 0, untilMin: null, severity: 'warning' as const };
  const time = mapping.columns.find((c) => c.role === 'time');
  const unit = time ? inferredTimeUnit(mapping, [], null) : null;
  if (unit) out.push({ ...base, rule: 'hygiene.time-unit-inferred', value: null, limit: null, unit: '', message: `${unit}; the uploader confirmed it` });
  const durationMin = (log.timeS[log.rows - 1] - log.timeS[0]) / 60;
  if (log.rows < SHORT_LOG_ROWS) {
    out.push({ ...base, rule: 'hygiene.short-log', value: log.rows, limit: SHORT_LOG_ROWS, unit: 'rows', message: `only ${log.rows} data rows (fewer than ${SHORT_LOG_ROWS}): too few to show the cycle's ramps and holds` });
  } else if (durationMin < SHORT_LOG_MIN) {
    out.push({ ...base, rule: 'hygiene.short-log', value: round(durationMin), limit: SHORT_LOG_MIN, unit: 'min', message: `the log covers only ${round(durationMin, 3)} min (less than ${SHORT_LOG_MIN} min): too short for a cure cycle` });
  }
  return out;
}
