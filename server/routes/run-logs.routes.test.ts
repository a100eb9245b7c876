import { createHash } from 'node:crypto';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { call, resetToDemoTeam, signIn, startHarness, type Harness, type SignedIn } from '../test/harness';
import { demoRunLogCsv, inspectRunLog, type RunLogRecord } from '../../shared/run-log/index';
import { parseStudy } from '../../shared/schemas/index';
import { UploadChunk, CHUNK_BYTES } from '../models/upload-chunk.model';
import { readChunks } from '../services/run-logs.service';
import { unpackSeries } from '../services/run-log-series';
import { createMigrator } from '../db/migrator';

// Run logs through the real HTTP stack and the real MariaDB: inspect, upload (atomic), read, download,
// and the lead's review decision with its role checks.

let h: Harness;
let engineer: SignedIn;
let lead: SignedIn;
let viewer: SignedIn;
let studyId: number;
let partId: number;
let demoCsv: string;
let seededRows: number;
let seededChunks: number;

beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h.close());

beforeEach(async () => {
  let study;
  ({ engineer, lead, viewer, study, studyId, partId } = await resetToDemoTeam(h));
  const latest = (await h.db.models.Revision.findOne({ where: { studyId, number: study.latestRevisionNumber } }))!;
  // the run followed the study's latest cycle, except for the second hold (the demo's excursion)
  demoCsv = demoRunLogCsv(parseStudy(latest.params), { start: '2026-04-02T07:10:00' });
  seededRows = await runLogRows();
  seededChunks = await chunkRows();
});

const runLogRows = () => h.db.models.Upload.count({ where: { kind: 'run-log', studyId } });
const chunkRows = () => UploadChunk.count();
/** Nothing was stored beyond what the seed put there. */
async function expectNothingStored() {
  expect(await runLogRows()).toBe(seededRows);
  expect(await chunkRows()).toBe(seededChunks);
}

function upload(who: SignedIn, csv: string | Buffer, mapping: unknown, name = 'job-4471.csv', type = 'text/csv') {
  const req = who.agent.post(`/api/studies/${studyId}/run-logs`).set('X-CSRF-Token', who.csrf);
  const withMapping = mapping === undefined ? req : req.field('mapping', typeof mapping === 'string' ? mapping : JSON.stringify(mapping));
  return withMapping.attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv), { filename: name, contentType: type });
}

describe('the demo run log in the seed', () => {
  it('is there with its one excursion, its replay and no decision yet', async () => {
    const list = await call(viewer, 'get', `/api/parts/${partId}/run-logs`).expect(200);
    expect(list.body).toHaveLength(1);
    expect(list.body[0]).toMatchObject({ uploadedBy: { login: 'tomas.reed' }, findings: { violations: 1, warnings: 0 }, review: null });
    const detail = await call(viewer, 'get', `/api/run-logs/${list.body[0].id}`).expect(200);
    expect(detail.body.record.spec.findings[0].message).toMatch(/^hold 2 at 180 °C lasted 17\d(\.\d+)? min/);
    expect(detail.body.record.replay.summary.finalCureMin).toBeGreaterThan(0.5);
    expect(detail.body.role).toBe('viewer');
    // the baseline by name, not only "r<n>", and its stress beside the replay's
    const part = (await h.db.models.Part.findByPk(partId))!;
    const pinned = (await h.db.models.Revision.findByPk(part.baselineRevisionId!))!;
    const pinnedStudy = (await h.db.models.Study.findByPk(pinned.studyId))!;
    expect(detail.body.baseline).toEqual({
      studyId: pinnedStudy.id,
      studyTitle: pinnedStudy.title,
      number: pinned.number,
      part: { id: partId, partNumber: part.partNumber, name: part.name },
    });
    expect(typeof detail.body.record.replay.baseline.maxTransverseStressMPa).toBe('number');
  });
});

describe('listing run logs', () => {
  it('reads the summary columns, not each run\'s stored analysis', async () => {
    const list = await call(viewer, 'get', `/api/studies/${studyId}/run-logs`).expect(200);
    const id = list.body[0].id as number;
    const upload = (await h.db.models.Upload.findByPk(id))!;
    const record = upload.parsed as RunLogRecord;
    const [[row]] = (await h.db.sequelize.query('SELECT `rows`, duration_min, violations, warnings FROM run_log_summaries WHERE upload_id = ?', { replacements: [id] })) as [
      { rows: number; duration_min: number; violations: number; warnings: number }[],
      unknown,
    ];
    // written with the upload, from the same record
    expect(row).toEqual({ rows: record.rows, duration_min: record.durationMin, violations: 1, warnings: 0 });
    // the list answers from the columns: change one and the list follows, the JSON untouched
    await h.db.sequelize.query('UPDATE run_log_summaries SET violations = 9 WHERE upload_id = ?', { replacements: [id] });
    const again = await call(viewer, 'get', `/api/parts/${partId}/run-logs`).expect(200);
    expect(again.body[0].findings).toEqual({ violations: 9, warnings: 0 });
    expect(again.body[0].rows).toBe(record.rows);
  });

  it('fills the summaries of runs stored before the summary table (migration 0102)', async () => {
    const migrator = createMigrator(h.db.sequelize, { quiet: true });
    await migrator.down({ to: '0102-run-log-summaries.ts' });
    await migrator.up();
    const list = await call(viewer, 'get', `/api/parts/${partId}/run-logs`).expect(200);
    expect(list.body[0]).toMatchObject({ findings: { violations: 1, warnings: 0 } });
    expect(list.body[0].rows).toBeGreaterThan(100);
  });
});

describe('inspecting a run log', () => {
  it('proposes a mapping and stores nothing', async () => {
    const res = await engineer.agent
      .post(`/api/studies/${studyId}/run-logs/inspect`)
      .set('X-CSRF-Token', engineer.csrf)
      .attach('file', Buffer.from(demoCsv), { filename: 'job.csv', contentType: 'text/csv' })
      .expect(200);
    expect(res.body.proposal.map((c: { role: string }) => c.role)).toEqual(['time', 'air', 'tool', 'part', 'part', 'part', 'pressure', 'vacuum', 'ignore']);
    expect(res.body.previewRows).toHaveLength(10);
    await expectNothingStored();
  });
});

describe('uploading a run log', () => {
  it('stores the raw file with its checksum, the parsed series, the findings and the replay, in one go', async () => {
    const mapping = inspectRunLog(demoCsv).mapping;
    const res = await upload(engineer, demoCsv, mapping).expect(201);
    const record = res.body.record as RunLogRecord;
    expect(res.body.uploadedBy.login).toBe('tomas.reed');
    expect(res.body.checksumSha256).toBe(createHash('sha256').update(demoCsv).digest('hex'));
    expect(record.spec.findings.map((f) => `${f.rule} ${f.channel}`)).toEqual(['spec.hold-long TC3 lagging tool-side']);
    expect(record.hygiene.findings).toEqual([]);
    expect(record.replay).not.toBeNull();
    expect(record.replay!.atTcs.map((t) => t.position)).toEqual(['bag-side', 'mid-plane', 'tool-side']);
    // the part has a pinned baseline: its prediction is there to overlay
    expect(record.replay!.baseline).not.toBeNull();
    expect(record.replay!.predicted.timeMin.length).toBeGreaterThan(100);
    // the raw file comes back byte for byte, with the checksum to verify it
    const file = await viewer.agent.get(`/api/run-logs/${res.body.id}/file`).expect(200);
    expect(file.text).toBe(demoCsv);
    expect(file.headers['x-checksum-sha256']).toBe(res.body.checksumSha256);
    expect(await chunkRows()).toBeGreaterThanOrEqual(seededChunks + 2);
    const audit = await h.db.models.AuditEvent.findOne({ where: { action: 'run-log.upload', subjectId: res.body.id } });
    expect(audit).not.toBeNull();
    // listed on the study and in the part's history
    const list = await call(viewer, 'get', `/api/studies/${studyId}/run-logs`).expect(200);
    expect(list.body).toHaveLength(seededRows + 1);
    expect(list.body[0]).toMatchObject({ id: res.body.id, findings: { violations: 1, warnings: 0 } });
    const history = await call(viewer, 'get', `/api/parts/${partId}/run-logs`).expect(200);
    expect(history.body[0].id).toBe(res.body.id);
  });

  it('leaves a noisy TC out of the checks and the replay, unless the uploader kept it; the choice is stored', async () => {
    // TC1 (column 4) with ±3 °C of alternating noise: far above the 1 °C noise limit
    const noisy = (csv: string) =>
      csv
        .split('\n')
        .map((line, i) => {
          if (i === 0 || line === '') return line;
          const cells = line.split(',');
          cells[3] = (Number(cells[3]) + (i % 2 ? 3 : -3)).toFixed(1);
          return cells.join(',');
        })
        .join('\n');
    const left = noisy(demoCsv);
    const mapping = inspectRunLog(left).mapping;
    const res = await upload(engineer, left, mapping).expect(201);
    let record = res.body.record as RunLogRecord;
    expect(record.hygiene.flagged).toMatchObject([{ label: 'TC1 leading bag-side', rules: ['hygiene.noisy'], excluded: true }]);
    expect(record.spec.rates.map((r) => r.channel)).not.toContain('TC1 leading bag-side');
    expect(record.replay!.atTcs.map((t) => t.channel)).not.toContain('TC1 leading bag-side');

    const kept = noisy(demoRunLogCsv(parseStudy((await h.db.models.Revision.findOne({ where: { studyId }, order: [['number', 'DESC']] }))!.params), { start: '2026-04-03T07:10:00' }));
    const keepMapping = { columns: inspectRunLog(kept).mapping.columns.map((c) => (c.column === 3 ? { ...c, keepIfFlagged: true } : c)) };
    const res2 = await upload(engineer, kept, keepMapping).expect(201);
    record = res2.body.record as RunLogRecord;
    expect(record.mapping.columns[3]).toMatchObject({ role: 'part', keepIfFlagged: true });
    expect(record.hygiene.flagged).toMatchObject([{ label: 'TC1 leading bag-side', excluded: false }]);
    expect(record.spec.rates.map((r) => r.channel)).toContain('TC1 leading bag-side');
    // stored with the upload: read back the same
    const detail = await call(viewer, 'get', `/api/run-logs/${res2.body.id}`).expect(200);
    expect(detail.body.record.mapping.columns[3].keepIfFlagged).toBe(true);
  });

  it('keeps a file larger than one database chunk intact, and its parsed series with it', async () => {
    // 220 000 rows at 0.1 s: about 7 MB, so the raw file spans two chunks and the series three
    const rows = ['Time (s),Air (°C),TC1 (°C),TC2 (°C),Pressure (bar)'];
    for (let i = 0; i < 220_000; i++) {
      const t = i * 0.1;
      const air = Math.min(180, 20 + t / 30);
      rows.push(`${t.toFixed(1)},${air.toFixed(2)},${(air - 3).toFixed(2)},${(air - 6).toFixed(2)},7.00`);
    }
    const csv = rows.join('\n');
    expect(Buffer.byteLength(csv)).toBeGreaterThan(CHUNK_BYTES);
    const res = await upload(engineer, csv, inspectRunLog(csv).mapping, 'long.csv').expect(201);
    expect(res.body.rows).toBe(220_000);
    expect((await readChunks(res.body.id, 'raw')).toString('utf8')).toBe(csv);
    expect(await UploadChunk.count({ where: { uploadId: res.body.id, part: 'raw' } })).toBe(Math.ceil(Buffer.byteLength(csv) / CHUNK_BYTES));
    const series = unpackSeries(await readChunks(res.body.id, 'series'));
    expect(series.timeS).toHaveLength(220_000);
    expect(series.timeS[219_999]).toBeCloseTo(21_999.9, 6);
    // 180 − 6 °C in kelvin, stored as Float32
    expect(series.channels['part:TC2'][219_999]).toBeCloseTo(174 + 273.15, 3);
    expect(series.channels.pressure[0]).toBe(7e5);
  });

  it('reads a UTF-16 export from a Windows logger', async () => {
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(demoCsv, 'utf16le')]);
    const res = await upload(engineer, utf16, inspectRunLog(demoCsv).mapping, 'job-utf16.csv').expect(201);
    expect(res.body.record.spec.findings.map((f: { rule: string }) => f.rule)).toEqual(['spec.hold-long']);
  });

  it('refuses the same file twice for the same study', async () => {
    const mapping = inspectRunLog(demoCsv).mapping;
    const first = await upload(engineer, demoCsv, mapping).expect(201);
    const again = await upload(engineer, demoCsv, mapping).expect(409);
    expect(again.body).toMatchObject({ runLogId: first.body.id });
  });

  const broken: [string, string, { line: number | null; column: string | null; reason: RegExp }][] = [
    ['time that goes backwards', 'Time (min),Air (°C)\n0,20\n2,24\n1,22\n', { line: 4, column: 'Time (min)', reason: /not after the previous row/ }],
    ['text in a numeric column', 'Time (min),Air (°C),TC1 (°C)\n0,20,20\n1,22,21\n2,24,OPEN\n3,26,24\n', { line: 4, column: 'TC1 (°C)', reason: /"OPEN" is not a number/ }],
    ['a delimiter it does not read', 'Time (min)|Air (°C)\n0|20\n1|22\n', { line: 1, column: null, reason: /no comma, semicolon or tab/ }],
    ['a row with another delimiter', 'Time (min),Air (°C)\n0,20\n1;22\n', { line: 3, column: null, reason: /fields where the header has 2/ }],
    ['an empty file', '', { line: 1, column: null, reason: /the file is empty/ }],
  ];
  it.each(broken)('refuses %s with 400 naming line, column and why, and stores nothing', async (_name, csv, where) => {
    const mapping = csv.includes('TC1')
      ? inspectRunLog(csv).mapping
      : { columns: [{ column: 0, header: 'Time (min)', role: 'time', unit: 'min' }, { column: 1, header: 'Air (°C)', role: 'air', label: 'Air', unit: '°C' }] };
    const res = await upload(engineer, csv, mapping).expect(400);
    expect(res.body).toMatchObject({ field: 'file', line: where.line, column: where.column });
    expect(res.body.reason).toMatch(where.reason);
    expect(res.body.error).toMatch(/^The run log was refused: /);
    await expectNothingStored();
  });

  it('refuses a file over 50 MB with 413 and stores nothing', async () => {
    const big = Buffer.alloc(50 * 1024 * 1024 + 1, 'a');
    const res = await upload(engineer, big, inspectRunLog(demoCsv).mapping).expect(413);
    expect(res.body.error).toMatch(/too large/i);
    await expectNothingStored();
  });

  it('refuses a file that is not a text export', async () => {
    const res = await upload(engineer, Buffer.from([0x89, 0x50, 0x4e, 0x47]), inspectRunLog(demoCsv).mapping, 'trace.png', 'image/png').expect(400);
    expect(res.body.field).toBe('file');
    expect(res.body.error).toContain('allowed a CSV, TSV or text export');
  });

  it('refuses an upload without a confirmed mapping, or with a mapping that breaks a rule', async () => {
    const none = await upload(engineer, demoCsv, undefined).expect(400);
    expect(none.body.field).toBe('mapping');
    const twoAirs = inspectRunLog(demoCsv).mapping;
    twoAirs.columns[2] = { ...twoAirs.columns[2], role: 'air' } as (typeof twoAirs.columns)[number];
    const bad = await upload(engineer, demoCsv, twoAirs).expect(400);
    expect(bad.body.error).toContain('2 columns mapped as air: allowed at most one');
    await expectNothingStored();
  });

  it('lets only engineers and leads upload; outsiders do not see the study', async () => {
    const mapping = inspectRunLog(demoCsv).mapping;
    await upload(viewer, demoCsv, mapping).expect(403);
    const outsider = await signIn(h, { login: 'lou.stranger', name: 'Lou Stranger', email: 'lou@elsewhere.example' });
    await upload(outsider, demoCsv, mapping).expect(404);
    await call(outsider, 'get', `/api/studies/${studyId}/run-logs`).expect(404);
    await expectNothingStored();
  });
});

describe('review decisions', () => {
  let runLogId: number;
  beforeEach(async () => {
    runLogId = (await upload(engineer, demoCsv, inspectRunLog(demoCsv).mapping).expect(201)).body.id;
  });

  const decision = { decision: 'use-as-is', rationale: 'Hold 2 ran 50 min long at 180 °C; replay shows full cure and Tg within the baseline band. Coupons to confirm.' };

  it('records the lead\'s decision once, with who and when, in the part history and the audit trail', async () => {
    const res = await call(lead, 'post', `/api/run-logs/${runLogId}/review`, decision).expect(201);
    expect(res.body).toMatchObject({ decision: 'use-as-is' });
    const detail = await call(viewer, 'get', `/api/run-logs/${runLogId}`).expect(200);
    expect(detail.body.review).toMatchObject({ decision: 'use-as-is', rationale: decision.rationale, decidedBy: { login: 'amara.okafor' } });
    const history = await call(viewer, 'get', `/api/parts/${partId}/run-logs`).expect(200);
    expect(history.body[0].review.decision).toBe('use-as-is');
    expect(await h.db.models.AuditEvent.count({ where: { action: 'review.decide' } })).toBe(1);
  });

  it('holds one decision per run in the database itself', async () => {
    await call(lead, 'post', `/api/run-logs/${runLogId}/review`, decision).expect(201);
    const { Review, Upload } = h.db.models;
    const { teamId } = (await Upload.findByPk(runLogId))!;
    await expect(Review.create({ teamId, uploadId: runLogId, decision: 'scrap', rationale: 'written around the API', decidedBy: null })).rejects.toMatchObject({
      name: 'SequelizeUniqueConstraintError',
    });
  });

  it('never changes a decision once made', async () => {
    await call(lead, 'post', `/api/run-logs/${runLogId}/review`, decision).expect(201);
    const again = await call(lead, 'post', `/api/run-logs/${runLogId}/review`, { ...decision, decision: 'scrap' }).expect(409);
    expect(again.body.error).toContain('decisions cannot be changed');
    expect((await call(viewer, 'get', `/api/run-logs/${runLogId}`)).body.review.decision).toBe('use-as-is');
  });

  it('refuses engineers and viewers with 403, and a decision without a real rationale with 400', async () => {
    await call(engineer, 'post', `/api/run-logs/${runLogId}/review`, decision).expect(403);
    await call(viewer, 'post', `/api/run-logs/${runLogId}/review`, decision).expect(403);
    const short = await call(lead, 'post', `/api/run-logs/${runLogId}/review`, { decision: 'scrap', rationale: 'bad' }).expect(400);
    expect(short.body.field).toBe('rationale');
    const unknown = await call(lead, 'post', `/api/run-logs/${runLogId}/review`, { ...decision, decision: 'ship-it' }).expect(400);
    expect(unknown.body.field).toBe('decision');
    expect(await h.db.models.Review.count()).toBe(0);
  });
});
