import { createHash } from 'node:crypto';
import type { Sequelize, Transaction } from 'sequelize';
import { inspectRunLog, RunLogParseError, type RunLogInspection, type RunLogRecord } from '../../shared/run-log/index';
import { parseStudy, type StudyParams } from '../../shared/schemas/index';
import { AuditEvent, Part, Review, Revision, Study, Upload, User } from '../models/index';
import type { ReviewDecision } from '../models/review.model';
import { UploadChunk, CHUNK_BYTES, type UploadChunkPart } from '../models/upload-chunk.model';
import { badRequest, conflict, notFound } from '../middleware/http-error';
import { spawnTsWorker } from './ts-worker';
import { decodeRunLogBytes } from './run-log-text';
import { defineRunLogSummary } from './run-log-summary';

// Run logs in the library: an upload is read, checked and replayed in a worker thread, then stored in one
// transaction (row, raw file, parsed series, audit event) or not at all. Review decisions are made once by a
// lead and never changed.

export interface UploadedFile {
  originalname: string;
  mimetype: string;
  size: number;
  buffer: Buffer;
}

/** A refused file: 400 naming the line, the column and why (nothing was stored). */
function refusal(e: { line: number | null; column: string | null; reason: string; message: string }) {
  return badRequest(`The run log was refused: ${e.message}`, { field: 'file', line: e.line, column: e.column, reason: e.reason });
}

/** The file's text; binary files are refused before any parsing. */
export function decodeText(file: UploadedFile): string {
  const text = decodeRunLogBytes(file.buffer);
  if (text === null) {
    throw badRequest('The run log was refused: the file is not text (it holds NUL bytes); export the log as CSV', { field: 'file', line: null, column: null, reason: 'not a text file' });
  }
  return text;
}

export function inspectUpload(file: UploadedFile): RunLogInspection {
  try {
    return inspectRunLog(decodeText(file), { byteLength: file.size });
  } catch (e) {
    if (e instanceof RunLogParseError) throw refusal(e.toJSON());
    throw e;
  }
}

/** The study's latest revision (what the run is checked against) and its part's baseline, if pinned. */
export async function studyContext(studyId: number) {
  const study = await Study.findByPk(studyId);
  if (!study) throw notFound(`Study ${studyId} does not exist.`);
  const revision = await Revision.findOne({ where: { studyId, number: study.latestRevisionNumber } });
  if (!revision) throw badRequest(`Study ${studyId} has no saved revision to check a run against.`);
  const part = await Part.findByPk(study.partId);
  const baselineRevision = part?.baselineRevisionId ? await Revision.findByPk(part.baselineRevisionId) : null;
  return { study, revision, part, baselineRevision };
}

// At most two analyses at once: each holds a file and its series in memory and runs the solver twice.
const MAX_CONCURRENT = 2;
let running = 0;
const waiting: (() => void)[] = [];
async function withSlot<T>(job: () => Promise<T>): Promise<T> {
  if (running >= MAX_CONCURRENT) await new Promise<void>((resolve) => waiting.push(resolve));
  running++;
  try {
    return await job();
  } finally {
    running--;
    waiting.shift()?.();
  }
}

type WorkerReply =
  | { ok: true; record: RunLogRecord; series: Uint8Array }
  | { ok: false; refusal?: { line: number | null; column: string | null; reason: string; message: string }; error?: string };

function analyseInWorker(data: Record<string, unknown>): Promise<WorkerReply> {
  return withSlot(
    () =>
      new Promise<WorkerReply>((resolve, reject) => {
        const worker = spawnTsWorker(new URL('./run-log.worker.ts', import.meta.url), { workerData: data });
        let replied = false;
        worker.once('message', (reply: WorkerReply) => {
          replied = true;
          resolve(reply);
          void worker.terminate();
        });
        worker.once('error', reject);
        worker.once('exit', (code) => {
          if (!replied) reject(new Error(`run-log worker exited with code ${code} before answering`));
        });
      }),
  );
}

async function storeChunks(uploadId: number, part: UploadChunkPart, bytes: Uint8Array, transaction: Transaction) {
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let seq = 0, at = 0; at < buffer.byteLength || seq === 0; seq++, at += CHUNK_BYTES) {
    await UploadChunk.create({ uploadId, part, seq, data: buffer.subarray(at, at + CHUNK_BYTES) }, { transaction });
  }
}

export async function readChunks(uploadId: number, part: UploadChunkPart): Promise<Buffer> {
  const chunks = await UploadChunk.findAll({ where: { uploadId, part }, order: [['seq', 'ASC']] });
  return Buffer.concat(chunks.map((c) => c.data));
}

export interface CreateRunLogInput {
  studyId: number;
  userId: number;
  file: UploadedFile;
  mapping: unknown;
}

/** Reads, checks and replays the file, then stores everything in one transaction (or nothing). */
export async function createRunLog(sequelize: Sequelize, input: CreateRunLogInput) {
  const { study, revision, baselineRevision } = await studyContext(input.studyId);
  decodeText(input.file); // refuse binary files before spending a worker on them
  const checksum = sha256(input.file.buffer);
  const existing = await Upload.findOne({ where: { teamId: study.teamId, studyId: study.id, checksumSha256: checksum, kind: 'run-log' } });
  if (existing) throw conflict(`This file is already run log ${existing.id} of this study.`, { runLogId: existing.id });

  let baseline: { revisionId: number; studyId: number; number: number; params: StudyParams } | null = null;
  if (baselineRevision) {
    baseline = { revisionId: baselineRevision.id, studyId: baselineRevision.studyId, number: baselineRevision.number, params: parseStudy(baselineRevision.params) };
  }
  const reply = await analyseInWorker({
    bytes: new Uint8Array(input.file.buffer.buffer, input.file.buffer.byteOffset, input.file.buffer.byteLength),
    fileName: input.file.originalname,
    mapping: input.mapping,
    params: parseStudy(revision.params),
    checkedAgainst: { studyId: study.id, revisionId: revision.id, number: revision.number },
    baseline,
  });
  if (!reply.ok) {
    if (reply.refusal) throw refusal(reply.refusal);
    throw new Error(`run-log analysis failed: ${reply.error}`);
  }

  return sequelize.transaction((transaction) =>
    storeRunLog(transaction, { teamId: study.teamId, studyId: study.id, userId: input.userId, file: input.file, checksum, record: reply.record, series: reply.series }),
  );
}

export interface StoreRunLogInput {
  teamId: number;
  studyId: number;
  userId: number;
  file: UploadedFile;
  checksum: string;
  record: RunLogRecord;
  series: Uint8Array;
}

/** The upload row, the raw file, the parsed series and the audit event, inside the caller's transaction. */
export async function storeRunLog(transaction: Transaction, input: StoreRunLogInput, options: { audit?: boolean } = {}) {
  const upload = await Upload.create(
    {
      teamId: input.teamId,
      kind: 'run-log',
      fileName: input.file.originalname.slice(0, 255),
      mimeType: input.file.mimetype.slice(0, 120),
      sizeBytes: input.file.size,
      checksumSha256: input.checksum,
      parsed: input.record,
      uploadedBy: input.userId,
      studyId: input.studyId,
    },
    { transaction },
  );
  const counts = countFindings(input.record);
  await defineRunLogSummary(Upload.sequelize!).create(
    { uploadId: upload.id, rows: input.record.rows, durationMin: input.record.durationMin, ...counts },
    { transaction },
  );
  await storeChunks(upload.id, 'raw', input.file.buffer, transaction);
  await storeChunks(upload.id, 'series', input.series, transaction);
  if (options.audit === false) return upload; // the demo seed records its own single event
  await AuditEvent.create(
    {
      teamId: input.teamId,
      actorId: input.userId,
      action: 'run-log.upload',
      subjectType: 'upload',
      subjectId: upload.id,
      details: { studyId: input.studyId, fileName: upload.fileName, checksumSha256: input.checksum, findings: counts },
    },
    { transaction },
  );
  return upload;
}

export const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

function countFindings(record: RunLogRecord) {
  const all = [...record.hygiene.findings, ...record.spec.findings];
  return { violations: all.filter((f) => f.severity === 'violation').length, warnings: all.filter((f) => f.severity === 'warning').length };
}

const person = (u: User | null | undefined) => (u ? { id: u.id, login: u.login, name: u.name } : null);

function reviewView(r: Review & { decider?: User }) {
  return { id: r.id, decision: r.decision, rationale: r.rationale, decidedBy: person(r.decider), decidedAt: r.createdAt };
}

type UploadWith = Upload & { uploader?: User; reviews?: (Review & { decider?: User })[] };

type ListFigures = { rows: number; durationMin: number; violations: number; warnings: number };

const figuresOf = (record: RunLogRecord): ListFigures => ({ rows: record.rows, durationMin: record.durationMin, ...countFindings(record) });

/** The list entry: who, when, what file, how many findings, the decision if made. */
export function runLogSummaryView(u: UploadWith, figures: ListFigures) {
  const review = u.reviews?.[0];
  return {
    id: u.id,
    studyId: u.studyId,
    fileName: u.fileName,
    sizeBytes: u.sizeBytes,
    checksumSha256: u.checksumSha256,
    uploadedAt: u.createdAt,
    uploadedBy: person(u.uploader),
    rows: figures.rows,
    durationMin: figures.durationMin,
    findings: { violations: figures.violations, warnings: figures.warnings },
    review: review ? reviewView(review) : null,
  };
}

const withPeople = [
  { model: User, as: 'uploader', attributes: ['id', 'login', 'name'] },
  { model: Review, as: 'reviews', include: [{ model: User, as: 'decider', attributes: ['id', 'login', 'name'] }] },
];

/** A study's or a part's runs from the metadata columns only: the stored analysis JSON is not read. */
export async function listRunLogs(where: { studyId?: number; studyIds?: number[] }) {
  const uploads = await Upload.findAll({
    where: { kind: 'run-log', studyId: where.studyIds ?? where.studyId! },
    attributes: { exclude: ['parsed'] },
    include: withPeople,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  const summaries = await defineRunLogSummary(Upload.sequelize!).findAll({ where: { uploadId: uploads.map((u) => u.id) } });
  const byId = new Map(summaries.map((x) => [x.uploadId, x]));
  return uploads.map((u) => {
    const figures = byId.get(u.id);
    // every run log gets its summary row in the upload's transaction (and by migration 0102 before that)
    if (!figures) throw new Error(`run log ${u.id} has no summary row`);
    return runLogSummaryView(u as UploadWith, figures);
  });
}

export async function runLogDetail(id: number) {
  const u = (await Upload.findOne({ where: { id, kind: 'run-log' }, include: withPeople })) as UploadWith | null;
  if (!u) throw notFound(`Run log ${id} does not exist.`);
  const study = u.studyId ? await Study.findByPk(u.studyId, { attributes: ['id', 'title', 'partId'] }) : null;
  const part = study ? await Part.findByPk(study.partId, { attributes: ['id', 'partNumber', 'name'] }) : null;
  const record = u.parsed as RunLogRecord;
  return {
    ...runLogSummaryView(u, figuresOf(record)),
    study: study ? { id: study.id, title: study.title } : null,
    part: part ? { id: part.id, partNumber: part.partNumber, name: part.name } : null,
    baseline: await baselineName(record),
    record,
  };
}

/** The replay's baseline by name (study title, revision, part): "r2" alone does not say which study's r2. */
async function baselineName(record: RunLogRecord) {
  const b = record.replay?.baseline;
  if (!b) return null;
  const study = await Study.findByPk(b.studyId, { attributes: ['id', 'title', 'partId'] });
  const part = study ? await Part.findByPk(study.partId, { attributes: ['id', 'partNumber', 'name'] }) : null;
  return {
    studyId: b.studyId,
    studyTitle: study?.title ?? null,
    number: b.number,
    part: part ? { id: part.id, partNumber: part.partNumber, name: part.name } : null,
  };
}

export async function teamOfRunLog(id: number): Promise<number | null> {
  const u = await Upload.findOne({ where: { id, kind: 'run-log' }, attributes: ['teamId'] });
  return u?.teamId ?? null;
}

export interface DecideInput {
  uploadId: number;
  userId: number;
  decision: ReviewDecision;
  rationale: string;
}

/** Records the one decision on a run; a second attempt is refused (decisions are immutable). */
export async function decideReview(sequelize: Sequelize, input: DecideInput) {
  return sequelize.transaction(async (transaction) => {
    // Lock the run log's row so two leads deciding at once cannot both win.
    const upload = await Upload.findOne({ where: { id: input.uploadId, kind: 'run-log' }, lock: transaction.LOCK.UPDATE, transaction });
    if (!upload) throw notFound(`Run log ${input.uploadId} does not exist.`);
    const earlier = await Review.findOne({ where: { uploadId: upload.id }, transaction });
    if (earlier) throw conflict(`Run log ${upload.id} already has a decision (${earlier.decision}); decisions cannot be changed.`, { reviewId: earlier.id });
    const review = await Review.create(
      { teamId: upload.teamId, uploadId: upload.id, decision: input.decision, rationale: input.rationale, decidedBy: input.userId },
      { transaction },
    ).catch((err: unknown) => {
      // the unique index on reviews.upload_id: another decision landed first
      if ((err as { name?: string }).name === 'SequelizeUniqueConstraintError') throw conflict(`Run log ${upload.id} already has a decision; decisions cannot be changed.`);
      throw err;
    });
    await AuditEvent.create(
      {
        teamId: upload.teamId,
        actorId: input.userId,
        action: 'review.decide',
        subjectType: 'review',
        subjectId: review.id,
        details: { runLogId: upload.id, studyId: upload.studyId, decision: input.decision },
      },
      { transaction },
    );
    return review;
  });
}
