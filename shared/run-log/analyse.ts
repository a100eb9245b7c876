import type { StudyParams } from '../schemas/study';
import { simulate } from '../solver/simulate';
import { runLogMappingSchema } from './column-mapping';
import { checkHygiene } from './hygiene';
import { parseRunLog, type ParseOptions } from './parse-run-log';
import { chartSeries, maxTransverseStressMPa, predictionTrace, predictionsAtTcs, type RunLogRecord } from './record';
import { replayInput } from './replay';
import { round } from './series';
import { checkSpec } from './spec-check';
import type { RunLog } from './types';
import { logWarningFindings } from './upload-warnings';

// The whole analysis of one uploaded run log, in the order the checks depend on each other: read the file
// with the confirmed mapping (refusing it whole if broken), hygiene first, then the spec check and the
// replay on the channels hygiene kept, and the part's baseline prediction to overlay.

export interface AnalyseInput {
  text: string;
  fileName: string;
  mapping: unknown;
  params: StudyParams;
  checkedAgainst: RunLogRecord['checkedAgainst'];
  baseline: { revisionId: number; studyId: number; number: number; params: StudyParams } | null;
  parse?: ParseOptions;
}

export function analyseRunLog(input: AnalyseInput): { record: RunLogRecord; log: RunLog } {
  const log = parseRunLog(input.text, input.mapping, input.parse);
  const hygiene = checkHygiene(log);
  // a guessed time unit or a very short log: allowed after the uploader confirmed, kept on the record
  hygiene.findings.unshift(...logWarningFindings(log, runLogMappingSchema.parse(input.mapping)));
  const spec = checkSpec(log, input.params, { excluded: hygiene.excluded });
  let replay: RunLogRecord['replay'] = null;
  let replayError: string | null = null;
  try {
    const replayParams = replayInput(log, input.params, { excluded: hygiene.excluded });
    const result = simulate(replayParams, { recordProfiles: true });
    let baseline: NonNullable<RunLogRecord['replay']>['baseline'] = null;
    if (input.baseline) {
      const b = simulate(input.baseline.params);
      const { params: _params, ...ids } = input.baseline;
      baseline = { ...ids, summary: b.summary, maxTransverseStressMPa: maxTransverseStressMPa(b), predicted: predictionTrace(b) };
    }
    replay = {
      modelVersion: result.modelVersion,
      summary: result.summary,
      maxTransverseStressMPa: maxTransverseStressMPa(result),
      predicted: predictionTrace(result),
      // flagged TCs hygiene left out are not compared with the model either
      atTcs: predictionsAtTcs({ ...log, channels: log.channels.filter((c) => !hygiene.excluded.includes(c.key)) }, result, replayParams),
      baseline,
    };
  } catch (error) {
    replayError = (error as Error).message;
  }
  const record: RunLogRecord = {
    format: 'run-log/1',
    fileName: input.fileName,
    rows: log.rows,
    durationMin: round((log.timeS[log.rows - 1] - log.timeS[0]) / 60),
    startedAt: log.startedAt,
    mapping: JSON.parse(JSON.stringify(input.mapping)),
    channels: log.channels.map(({ key, label, role, sourceUnit, position }) => ({ key, label, role, sourceUnit, ...(position ? { position } : {}) })),
    checkedAgainst: input.checkedAgainst,
    hygiene,
    spec,
    chart: chartSeries(log),
    replay,
    replayError,
  };
  return { record, log };
}
