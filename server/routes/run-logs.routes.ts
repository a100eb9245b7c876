import path from 'node:path';
import { Router, type Request } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { Sequelize } from 'sequelize';
import { currentUser, requireTeamRole, roleAllows } from '../auth/access';
import { Study } from '../models/index';
import { defineUploadChunk } from '../models/upload-chunk.model';
import { badRequest, forbidden } from '../middleware/http-error';
import { MAX_RUN_LOG_BYTES, runLogMappingSchema } from '../../shared/run-log/index';
import { createRunLog, decideReview, inspectUpload, listRunLogs, readChunks, runLogDetail, teamOfRunLog } from '../services/run-logs.service';
import { idParam } from './request-schemas';
import { teamOfPart } from './parts.routes';
import { teamOfStudy } from './studies.routes';

// Run-log routes: inspect a file (propose a column mapping, store nothing), upload it with the confirmed
// mapping, read the analysed runs of a study or a part, download the raw file, and record the review.

const TEXT_TYPES = new Set(['text/csv', 'text/plain', 'text/tab-separated-values', 'application/csv', 'application/vnd.ms-excel', 'application/octet-stream']);
const TEXT_EXTENSIONS = new Set(['.csv', '.tsv', '.txt', '.log', '.dat']);

/** multer with every limit set: one file of ≤ 50 MB, a few small fields, text types only. */
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_RUN_LOG_BYTES, files: 1, fields: 4, fieldSize: 512 * 1024, parts: 6 },
  fileFilter: (_req, file, cb) => {
    const ext = path.extname(file.originalname).toLowerCase();
    if (TEXT_EXTENSIONS.has(ext) && TEXT_TYPES.has(file.mimetype)) return cb(null, true);
    cb(
      badRequest(`Invalid file: "${file.originalname}" (${file.mimetype}) is not a run log: allowed a CSV, TSV or text export (${[...TEXT_EXTENSIONS].join(', ')})`, {
        field: 'file',
      }),
    );
  },
});

export const reviewBody = z.object({
  decision: z.enum(['use-as-is', 'rework', 'scrap'], { error: 'allowed use-as-is, rework or scrap' }),
  rationale: z
    .string({ error: 'a decision needs a rationale' })
    .trim()
    .min(20, { error: 'a rationale of at least 20 characters is needed: say why the part can be used, reworked or must be scrapped' })
    .max(4000, { error: 'allowed ≤ 4000 characters' }),
});

const teamOfRunLogParam = async (req: Request) => {
  const id = idParam(req.params.runLogId);
  return id ? teamOfRunLog(id) : null;
};

function requireFile(req: Request) {
  if (!req.file) throw badRequest('Invalid file: no file was sent: attach the run log as the "file" field', { field: 'file' });
  return req.file;
}

function mappingField(req: Request): unknown {
  const raw = (req.body as Record<string, unknown> | undefined)?.mapping;
  if (typeof raw !== 'string') throw badRequest('Invalid mapping: the confirmed column mapping is missing (the "mapping" field, JSON)', { field: 'mapping' });
  let json: unknown;
  try {
    json = JSON.parse(raw);
  } catch {
    throw badRequest('Invalid mapping: the "mapping" field is not JSON', { field: 'mapping' });
  }
  const checked = runLogMappingSchema.safeParse(json);
  if (!checked.success) {
    const issue = checked.error.issues[0];
    const field = ['mapping', ...issue.path.map(String)].join('.');
    throw badRequest(`Invalid ${field}: ${issue.message}`, { field });
  }
  return checked.data;
}

export function runLogRoutes(sequelize: Sequelize): Router {
  defineUploadChunk(sequelize);
  const router = Router();
  const canWriteStudy = requireTeamRole('write', teamOfStudy);
  const canReadRunLog = requireTeamRole('read', teamOfRunLogParam);

  router.post('/studies/:studyId/run-logs/inspect', canWriteStudy, upload.single('file'), (req, res) => {
    res.json(inspectUpload(requireFile(req)));
  });

  router.post('/studies/:studyId/run-logs', canWriteStudy, upload.single('file'), async (req, res) => {
    const file = requireFile(req);
    const mapping = mappingField(req);
    const created = await createRunLog(sequelize, { studyId: idParam(req.params.studyId)!, userId: currentUser(req).id, file, mapping });
    res.status(201).json(await runLogDetail(created.id));
  });

  router.get('/studies/:studyId/run-logs', requireTeamRole('read', teamOfStudy), async (req, res) => {
    res.json(await listRunLogs({ studyId: idParam(req.params.studyId)! }));
  });

  /** The part's run history: every run log of its studies with its decision. */
  router.get('/parts/:partId/run-logs', requireTeamRole('read', teamOfPart), async (req, res) => {
    const studies = await Study.findAll({ where: { partId: idParam(req.params.partId)! }, attributes: ['id'] });
    res.json(studies.length ? await listRunLogs({ studyIds: studies.map((s) => s.id) }) : []);
  });

  router.get('/run-logs/:runLogId', canReadRunLog, async (req, res) => {
    res.json({ ...(await runLogDetail(idParam(req.params.runLogId)!)), role: req.teamAccess!.role });
  });

  /** The raw file exactly as uploaded, with its SHA-256 so a reader can verify it. */
  router.get('/run-logs/:runLogId/file', canReadRunLog, async (req, res) => {
    const detail = await runLogDetail(idParam(req.params.runLogId)!);
    const bytes = await readChunks(detail.id, 'raw');
    res
      .set('Content-Type', 'text/csv; charset=utf-8')
      .set('Content-Disposition', `attachment; filename="${detail.fileName.replace(/["\\\r\n]/g, '_')}"`)
      .set('X-Checksum-Sha256', detail.checksumSha256)
      .send(bytes);
  });

  /** A lead's decision: use-as-is, rework or scrap, with a rationale; once made it cannot be changed. */
  router.post('/run-logs/:runLogId/review', canReadRunLog, async (req, res) => {
    const role = req.teamAccess!.role;
    if (!roleAllows(role, 'review')) {
      throw forbidden(`Only a lead records a review decision; your role is ${role ?? 'none'}.`);
    }
    const body = reviewBody.parse(req.body);
    const review = await decideReview(sequelize, { uploadId: idParam(req.params.runLogId)!, userId: currentUser(req).id, ...body });
    res.status(201).json({ id: review.id, decision: review.decision, rationale: review.rationale, decidedAt: review.createdAt });
  });

  return router;
}
