import type { ChannelRole, PartPosition } from './column-mapping';

/** One measured channel in SI: kelvin for temperatures, Pa gauge for pressure, Pa below atmosphere for vacuum. */
export interface RunLogChannel {
  /** unique within the log: 'air', 'tool', 'pressure', 'vacuum', or 'part:<label>' */
  key: string;
  role: ChannelRole;
  /** what findings and charts call the channel, e.g. "TC3 lagging" */
  label: string;
  /** 0-based column in the file and its header, for messages */
  column: number;
  header: string;
  /** the unit the file was written in (the values are SI) */
  sourceUnit: string;
  position?: PartPosition;
  /** the uploader asked to keep this channel in the checks and the replay even if hygiene flags it */
  keepIfFlagged?: boolean;
  /** one value per row; NaN where the cell was empty (a missing reading) */
  values: Float64Array;
}

/** A parsed run log: strictly increasing elapsed time from the first row, and its channels. */
export interface RunLog {
  timeS: Float64Array;
  channels: RunLogChannel[];
  /** the first row's time stamp when the file carried dates, ISO 8601 (naive, written as UTC) */
  startedAt: string | null;
  rows: number;
}

export type FindingSeverity = 'violation' | 'warning' | 'note';

/** One thing the checks saw: what, where (channel), when (minutes from the first row), how far off. */
export interface Finding {
  /** stable rule key, e.g. 'hygiene.dead', 'spec.hold-time' */
  rule: string;
  severity: FindingSeverity;
  /** the channel's label, or 'record' for the whole log */
  channel: string;
  atMin: number;
  untilMin: number | null;
  /** the measured value and the limit it broke, in `unit` (null when the rule has no number) */
  value: number | null;
  limit: number | null;
  unit: string;
  message: string;
}
