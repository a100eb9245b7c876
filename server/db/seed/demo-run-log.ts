/**
 * The demo run log in the seed: job 4471 of the 24-ply tailcone panel, cured in autoclave 2 on the study's
 * released cycle except that the 180 °C hold ran 170 min instead of 120 (the deliberate excursion, see
 * shared/run-log/demo-run-log.ts). It is stored exactly as an upload would be, with no decision yet, so a
 * new user can open the findings and the replay and record a decision as the lead.
 */
import type { Sequelize, Transaction } from 'sequelize';
import { analyseRunLog, demoRunLogCsv, DEMO_RUN_LOG_FILE_NAME, inspectRunLog, type RunLogRecord } from '../../../shared/run-log/index';
import { parseStudy } from '../../../shared/schemas/index';
import { Part, Revision, Study, User } from '../../models/index';
import { defineUploadChunk } from '../../models/upload-chunk.model';
import { packSeries } from '../../services/run-log-series';
import { sha256, storeRunLog } from '../../services/run-logs.service';

export const DEMO_RUN_LOG_STUDY_TITLE = 'Two-dwell cycle for the 24-ply panel';
export const DEMO_RUN_LOG_UPLOADER = 'tomas.reed';

// The analysis is deterministic in the study's params: computed once per process (tests reseed often).
const cache = new Map<string, { csv: string; record: RunLogRecord; series: Uint8Array }>();

export async function seedDemoRunLog(sequelize: Sequelize, transaction: Transaction): Promise<void> {
  defineUploadChunk(sequelize);
  const study = await Study.findOne({ where: { title: DEMO_RUN_LOG_STUDY_TITLE }, transaction });
  const uploader = await User.findOne({ where: { login: DEMO_RUN_LOG_UPLOADER }, transaction });
  if (!study || !uploader) return;
  const revision = (await Revision.findOne({ where: { studyId: study.id, number: study.latestRevisionNumber }, transaction }))!;
  const part = await Part.findByPk(study.partId, { transaction });
  const baseline = part?.baselineRevisionId ? await Revision.findByPk(part.baselineRevisionId, { transaction }) : null;

  const key = JSON.stringify([revision.params, baseline?.params ?? null]);
  if (!cache.has(key)) {
    const params = parseStudy(revision.params);
    const csv = demoRunLogCsv(params);
    const { record, log } = analyseRunLog({
      text: csv,
      fileName: DEMO_RUN_LOG_FILE_NAME,
      mapping: inspectRunLog(csv).mapping,
      params,
      checkedAgainst: { studyId: study.id, revisionId: revision.id, number: revision.number },
      baseline: baseline ? { revisionId: baseline.id, studyId: baseline.studyId, number: baseline.number, params: parseStudy(baseline.params) } : null,
    });
    cache.set(key, { csv, record, series: packSeries(log) });
  }
  const { csv, record, series } = cache.get(key)!;
  const bytes = Buffer.from(csv);
  await storeRunLog(
    transaction,
    {
      teamId: study.teamId,
      studyId: study.id,
      userId: uploader.id,
      file: { originalname: DEMO_RUN_LOG_FILE_NAME, mimetype: 'text/csv', size: bytes.byteLength, buffer: bytes },
      checksum: sha256(bytes),
      // ids inside the record follow this seeding (a reseed gives new ids)
      record: { ...record, checkedAgainst: { studyId: study.id, revisionId: revision.id, number: revision.number } },
      series,
    },
    { audit: false },
  );
}
