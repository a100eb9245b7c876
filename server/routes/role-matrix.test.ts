/**
 * The role × route matrix: every API route, called by an anonymous visitor,
 * a viewer, an engineer and a lead of the demo team, a site admin, and the
 * lead of another team. Each cell's status is asserted. Write requests carry
 * valid bodies built from the current database state (run-log uploads are
 * multipart bodies built from the demo run-log CSV), so a refusal can only
 * come from the role check. A last check proves the table lists every route
 * the app registers, with no exceptions.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { anonymous, call, resetToDemo, signIn, startHarness, type Harness, type SignedIn } from '../test/harness';
import { referenceStudy } from '../../shared/solver/demo-cards';
import { createInvite, type InviteContext } from '../services/invite.service';
import { createMailer } from '../mail/mailer';
import { demoRunLogCsv, inspectRunLog } from '../../shared/run-log/index';
import { parseStudy } from '../../shared/schemas/index';

const PERSONAS = ['anonymous', 'viewer', 'engineer', 'lead', 'admin', 'other'] as const;
type Persona = (typeof PERSONAS)[number];
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

interface Ctx {
  teamId: number;
  partId: number;
  studyId: number;
  viewerId: number;
  latest: () => Promise<number>;
  inviteToken: (email?: string) => Promise<string>;
  emailOf: Record<Persona, string>;
  runLogId: number;
  /** the demo run log as a CSV, with its start moved so each upload is a new file (same file twice is a 409) */
  runLogCsv: (fresh: boolean) => string;
  inviteId: () => Promise<number>;
  throwawayMember: () => Promise<number>;
}

interface Multipart {
  fields: Record<string, string>;
  file: { bytes: Buffer; name: string; type: string };
}

interface Row {
  method: Method;
  route: string; // as registered, e.g. /api/studies/:studyId
  path: (c: Ctx, persona: Persona) => Promise<string> | string;
  body?: (c: Ctx) => Promise<unknown> | unknown;
  multipart?: (c: Ctx) => Multipart;
  expect: Record<Persona, number>;
}

// anonymous, viewer, engineer, lead, admin, other-team lead
const s = (anonymous: number, viewer: number, engineer: number, lead: number, admin: number, other: number) => ({ anonymous, viewer, engineer, lead, admin, other });

let counter = 0;
const unique = () => `${Date.now().toString(36)}${(counter++).toString(36)}`;

const ROWS: Row[] = [
  { method: 'get', route: '/api/health', path: () => '/api/health', expect: s(200, 200, 200, 200, 200, 200) },
  { method: 'get', route: '/api/me', path: () => '/api/me', expect: s(200, 200, 200, 200, 200, 200) },
  { method: 'get', route: '/api/auth/csrf', path: () => '/api/auth/csrf', expect: s(200, 200, 200, 200, 200, 200) },
  { method: 'get', route: '/api/auth/github', path: () => '/api/auth/github', expect: s(302, 302, 302, 302, 302, 302) },
  { method: 'get', route: '/api/auth/github/callback', path: () => '/api/auth/github/callback', expect: s(302, 302, 302, 302, 302, 302) },
  // the caught mails hold working invitation links: signed-in people only
  { method: 'get', route: '/api/dev/mailbox', path: () => '/api/dev/mailbox', expect: s(401, 200, 200, 200, 200, 200) },
  { method: 'get', route: '/api/teams', path: () => '/api/teams', expect: s(401, 200, 200, 200, 200, 200) },
  {
    method: 'post', route: '/api/teams', path: () => '/api/teams',
    body: () => ({ slug: `cell-${unique()}`, name: 'Nacelle Cell' }),
    expect: s(401, 403, 403, 403, 201, 403),
  },
  { method: 'get', route: '/api/teams/:teamId', path: (c) => `/api/teams/${c.teamId}`, expect: s(401, 200, 200, 200, 403, 404) },
  { method: 'get', route: '/api/teams/:teamId/parts', path: (c) => `/api/teams/${c.teamId}/parts`, expect: s(401, 200, 200, 200, 403, 404) },
  {
    method: 'post', route: '/api/teams/:teamId/parts', path: (c) => `/api/teams/${c.teamId}/parts`,
    body: () => ({ partNumber: `TB-${unique()}`, name: 'Rib cap, 12 plies' }),
    expect: s(401, 403, 201, 201, 403, 404),
  },
  { method: 'get', route: '/api/teams/:teamId/members', path: (c) => `/api/teams/${c.teamId}/members`, expect: s(401, 200, 200, 200, 200, 404) },
  {
    method: 'patch', route: '/api/teams/:teamId/members/:userId', path: (c) => `/api/teams/${c.teamId}/members/${c.viewerId}`,
    body: () => ({ role: 'viewer' }),
    expect: s(401, 403, 403, 200, 200, 404),
  },
  {
    method: 'delete', route: '/api/teams/:teamId/members/:userId',
    path: async (c) => `/api/teams/${c.teamId}/members/${await c.throwawayMember()}`,
    expect: s(401, 403, 403, 204, 204, 404),
  },
  { method: 'get', route: '/api/teams/:teamId/invites', path: (c) => `/api/teams/${c.teamId}/invites`, expect: s(401, 403, 403, 200, 200, 404) },
  {
    method: 'post', route: '/api/teams/:teamId/invites', path: (c) => `/api/teams/${c.teamId}/invites`,
    body: () => ({ email: `new-${unique()}@example.test`, role: 'viewer' }),
    expect: s(401, 403, 403, 201, 201, 404),
  },
  {
    method: 'post', route: '/api/teams/:teamId/invites/:inviteId/resend',
    path: async (c) => `/api/teams/${c.teamId}/invites/${await c.inviteId()}/resend`,
    expect: s(401, 403, 403, 200, 200, 404),
  },
  { method: 'get', route: '/api/teams/:teamId/audit', path: (c) => `/api/teams/${c.teamId}/audit`, expect: s(401, 403, 403, 200, 200, 404) },
  { method: 'get', route: '/api/parts/:partId', path: (c) => `/api/parts/${c.partId}`, expect: s(401, 200, 200, 200, 403, 404) },
  {
    method: 'post', route: '/api/parts/:partId/studies', path: (c) => `/api/parts/${c.partId}/studies`,
    body: () => ({ title: 'Matrix study', params: referenceStudy() }),
    expect: s(401, 403, 201, 201, 403, 404),
  },
  {
    method: 'put', route: '/api/parts/:partId/baseline', path: (c) => `/api/parts/${c.partId}/baseline`,
    body: async (c) => ({ revisionId: await revisionId(c.studyId, 1), note: 'Matrix pin' }),
    expect: s(401, 403, 403, 200, 403, 404),
  },
  { method: 'get', route: '/api/studies/:studyId', path: (c) => `/api/studies/${c.studyId}`, expect: s(401, 200, 200, 200, 403, 404) },
  { method: 'get', route: '/api/studies/:studyId/revisions', path: (c) => `/api/studies/${c.studyId}/revisions`, expect: s(401, 200, 200, 200, 403, 404) },
  { method: 'get', route: '/api/studies/:studyId/revisions/:number', path: (c) => `/api/studies/${c.studyId}/revisions/1`, expect: s(401, 200, 200, 200, 403, 404) },
  {
    method: 'post', route: '/api/studies/:studyId/revisions', path: (c) => `/api/studies/${c.studyId}/revisions`,
    body: async (c) => ({ baseRevision: await c.latest(), message: 'Matrix save', params: referenceStudy() }),
    expect: s(401, 403, 201, 201, 403, 404),
  },
  {
    method: 'post', route: '/api/studies/:studyId/revisions/:number/restore', path: (c) => `/api/studies/${c.studyId}/revisions/1/restore`,
    body: async (c) => ({ baseRevision: await c.latest() }),
    expect: s(401, 403, 201, 201, 403, 404),
  },
  {
    method: 'post', route: '/api/studies/:studyId/revisions/:number/fork', path: (c) => `/api/studies/${c.studyId}/revisions/1/fork`,
    body: () => ({}),
    expect: s(401, 403, 201, 201, 403, 404),
  },
  { method: 'get', route: '/api/studies/:studyId/run-logs', path: (c) => `/api/studies/${c.studyId}/run-logs`, expect: s(401, 200, 200, 200, 403, 404) },
  { method: 'get', route: '/api/parts/:partId/run-logs', path: (c) => `/api/parts/${c.partId}/run-logs`, expect: s(401, 200, 200, 200, 403, 404) },
  {
    method: 'post', route: '/api/studies/:studyId/run-logs/inspect', path: (c) => `/api/studies/${c.studyId}/run-logs/inspect`,
    multipart: (c) => ({ fields: {}, file: { bytes: Buffer.from(c.runLogCsv(false)), name: 'job-4471.csv', type: 'text/csv' } }),
    expect: s(401, 403, 200, 200, 403, 404),
  },
  {
    method: 'post', route: '/api/studies/:studyId/run-logs', path: (c) => `/api/studies/${c.studyId}/run-logs`,
    multipart: (c) => {
      const csv = c.runLogCsv(true);
      return { fields: { mapping: JSON.stringify(inspectRunLog(csv).mapping) }, file: { bytes: Buffer.from(csv), name: 'job-4472.csv', type: 'text/csv' } };
    },
    expect: s(401, 403, 201, 201, 403, 404),
  },
  { method: 'get', route: '/api/run-logs/:runLogId', path: (c) => `/api/run-logs/${c.runLogId}`, expect: s(401, 200, 200, 200, 403, 404) },
  { method: 'get', route: '/api/run-logs/:runLogId/file', path: (c) => `/api/run-logs/${c.runLogId}/file`, expect: s(401, 200, 200, 200, 403, 404) },
  {
    // the seeded run log has no decision yet; the lead's is the one that lands
    method: 'post', route: '/api/run-logs/:runLogId/review', path: (c) => `/api/run-logs/${c.runLogId}/review`,
    body: () => ({ decision: 'use-as-is', rationale: 'Second hold ran long; cure is past the minimum and warpage inside the window.' }),
    expect: s(401, 403, 403, 201, 403, 404),
  },
  { method: 'get', route: '/api/invites/:token', path: async (c) => `/api/invites/${await c.inviteToken()}`, expect: s(200, 200, 200, 200, 200, 200) },
  // These two change who belongs where and who is signed in, so they run last.
  // Each signed-in persona accepts an invitation sent to their own address
  // (one sent to someone else is refused with 403: invites.routes.test.ts).
  {
    method: 'post', route: '/api/invites/:token/accept', path: async (c, persona) => `/api/invites/${await c.inviteToken(c.emailOf[persona])}/accept`,
    expect: s(401, 200, 200, 200, 200, 200),
  },
  { method: 'post', route: '/api/auth/logout', path: () => '/api/auth/logout', expect: s(204, 204, 204, 204, 204, 204) },
];

let h: Harness;
let ctx: Ctx;
const who = {} as Record<Persona, SignedIn>;

async function revisionId(studyId: number, number: number) {
  return (await h.db.models.Revision.findOne({ where: { studyId, number } }))!.id;
}

beforeAll(async () => {
  h = await startHarness();
  await resetToDemo(h.db);
  const { Team, Study, User, Membership, Revision, Upload } = h.db.models;
  const team = (await Team.findOne({ where: { slug: 'tail-structures' } }))!;
  const study = (await Study.findOne({ where: { title: 'Two-dwell cycle for the 24-ply panel' } }))!;
  const viewer = (await User.findOne({ where: { login: 'ines.varga' } }))!;

  who.anonymous = await anonymous(h.app);
  who.viewer = await signIn(h, 'ines.varga');
  who.engineer = await signIn(h, 'tomas.reed');
  who.lead = await signIn(h, 'amara.okafor');
  who.admin = await signIn(h, 'site.admin');
  who.other = await signIn(h, { login: 'rhea.outsider', name: 'Rhea Outsider', email: 'rhea@radome.example' });
  const otherTeam = await Team.create({ slug: 'radome-cell', name: 'Radome Cell', description: null });
  await Membership.create({ teamId: otherTeam.id, userId: who.other.userId!, role: 'lead' });

  const inviteCtx: InviteContext = { sequelize: h.db.sequelize, mailer: createMailer(h.db.config.mail), publicUrl: 'http://127.0.0.1:5180', ttlHours: 1 };
  const lead = (await User.findOne({ where: { login: 'amara.okafor' } }))!;
  let throwaway = 0;
  const latestParams = parseStudy((await Revision.findOne({ where: { studyId: study.id, number: study.latestRevisionNumber } }))!.params);
  let uploads = 0;
  const emailOf = {} as Record<Persona, string>;
  for (const persona of PERSONAS) {
    const id = who[persona].userId;
    emailOf[persona] = (id ? (await User.findByPk(id))!.email : null) ?? 'nobody@example.test';
  }
  ctx = {
    emailOf,
    runLogId: (await Upload.findOne({ where: { kind: 'run-log', studyId: study.id } }))!.id,
    runLogCsv: (fresh) => {
      const start = fresh ? new Date(Date.UTC(2026, 5, 1, 6) + uploads++ * 86_400_000).toISOString().slice(0, 19) : '2026-04-02T07:10:00';
      return demoRunLogCsv(latestParams, { start });
    },
    teamId: team.id,
    partId: study.partId,
    studyId: study.id,
    viewerId: viewer.id,
    latest: async () => (await Study.findByPk(study.id))!.latestRevisionNumber,
    inviteToken: async (to?: string) => {
      // the token is only in the mail; read it from the fake mailbox like a person would (newest mail to that address)
      const email = to ?? `matrix-${unique()}@example.test`;
      await createInvite(inviteCtx, { teamId: team.id, email, role: 'viewer', invitedBy: { id: lead.id, name: lead.name } });
      const mail = h.mail.messages.findLast((m) => m.to.includes(email))!;
      return mail.text.match(/\/invite\/([A-Za-z0-9_-]+)/)![1];
    },
    inviteId: async () => {
      const invite = await createInvite(inviteCtx, { teamId: team.id, email: `resend-${unique()}@example.test`, role: 'engineer', invitedBy: { id: lead.id, name: lead.name } });
      return invite.id;
    },
    throwawayMember: async () => {
      const u = await User.create({ providerId: null, login: `gone-${throwaway++}-${unique()}`, name: 'Short Stay', email: null, avatarUrl: null, isAdmin: false });
      await Membership.create({ teamId: team.id, userId: u.id, role: 'viewer' });
      return u.id;
    },
  };
});
afterAll(() => h.close());

describe('role × route matrix', () => {
  for (const row of ROWS) {
    it(`${row.method.toUpperCase()} ${row.route}`, async () => {
      const actual: Partial<Record<Persona, number>> = {};
      for (const persona of PERSONAS) {
        const path = await row.path(ctx, persona);
        if (row.multipart) {
          const { fields, file } = row.multipart(ctx);
          let req = who[persona].agent.post(path).set('X-CSRF-Token', who[persona].csrf).set('Accept', 'application/json');
          for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
          actual[persona] = (await req.attach('file', file.bytes, { filename: file.name, contentType: file.type })).status;
          continue;
        }
        const body = row.body ? await row.body(ctx) : row.method === 'get' ? undefined : {};
        const res = await call(who[persona], row.method, path, body);
        actual[persona] = res.status;
      }
      expect(actual).toEqual(row.expect);
    });
  }

  it('covers every route the app registers', () => {
    const registered = listRoutes(h.app).sort();
    const covered = ROWS.map((r) => `${r.method.toUpperCase()} ${r.route}`).sort();
    // A new route fails here until it gets a matrix row.
    expect(covered).toEqual(registered);
    // routes × personas, every cell asserted above
    expect(ROWS.length * PERSONAS.length).toBe(registered.length * 6);
  });
});

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
  matchers?: unknown[];
  regexp?: RegExp;
}

/** Every METHOD /api/path in the app's API router (all library routers are mounted at /api with no sub-path). */
function listRoutes(app: Harness['app']): string[] {
  const root = (app as unknown as { router: { stack: Layer[] } }).router.stack;
  const out: string[] = [];
  const walk = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [method, on] of Object.entries(layer.route.methods)) if (on && method !== '_all') out.push(`${method.toUpperCase()} /api${layer.route.path}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack);
      }
    }
  };
  walk(root);
  return [...new Set(out)];
}
