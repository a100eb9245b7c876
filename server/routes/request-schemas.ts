import { z } from 'zod';
import { studyParamsSchema } from '../../shared/schemas/index';
import { TEAM_ROLES } from '../models/index';

// Bodies the library API accepts. Study params are checked by the shared
// schema, the same one the client's editor uses; errors name the field path
// (e.g. `params.cycle.segments.1.holdMin`) and the allowed range.

const message = z.string().trim().max(500, { error: 'allowed ≤ 500 characters' });
const title = z.string().trim().min(1, { error: 'must not be empty' }).max(160, { error: 'allowed ≤ 160 characters' });
const revisionNumber = z.number({ error: 'must be a revision number' }).int().min(0);

export const createStudyBody = z.object({ title, message: message.default('First revision'), params: studyParamsSchema });
export const saveRevisionBody = z.object({ baseRevision: revisionNumber, message: message.default(''), params: studyParamsSchema });
export const restoreBody = z.object({ baseRevision: revisionNumber, message: message.optional() });
export const forkBody = z.object({ partId: z.number().int().positive().optional(), title: title.optional() });
export const pinBaselineBody = z.object({
  revisionId: z.number().int().positive(),
  note: z.string().trim().min(1, { error: 'a baseline needs a note saying why' }).max(500, { error: 'allowed ≤ 500 characters' }),
});
export const createPartBody = z.object({
  partNumber: z.string().trim().min(1, { error: 'must not be empty' }).max(40, { error: 'allowed ≤ 40 characters' }),
  name: title,
  description: z.string().max(2000).optional(),
});
export const roleBody = z.object({ role: z.enum(TEAM_ROLES, { error: `allowed ${TEAM_ROLES.join(', ')}` }) });
export const inviteBody = z.object({
  email: z.email({ error: 'must be an e-mail address' }).max(254),
  role: z.enum(TEAM_ROLES, { error: `allowed ${TEAM_ROLES.join(', ')}` }),
});
export const createTeamBody = z.object({
  slug: z.string().regex(/^[a-z0-9][a-z0-9-]{1,62}$/, { error: 'lowercase letters, digits and dashes, 2–63 characters' }),
  name: title,
  description: z.string().max(2000).optional(),
  /** a new team's first lead, invited by e-mail in the same step */
  leadEmail: z.email({ error: 'must be an e-mail address' }).max(254).optional(),
});

/** A positive integer id from the URL, or null (which the routes answer with 404). */
export function idParam(value: string | string[] | undefined): number | null {
  if (typeof value !== 'string' || !/^[1-9][0-9]{0,9}$/.test(value)) return null;
  return Number(value);
}
