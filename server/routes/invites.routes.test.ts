import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { anonymous, call, resetToDemo, signIn, startHarness, type Harness, type SignedIn } from '../test/harness';

let h: Harness;
let lead: SignedIn;
let teamId: number;

beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h.close());

beforeEach(async () => {
  await resetToDemo(h.db);
  h.mail.messages.length = 0;
  lead = await signIn(h, 'amara.okafor');
  teamId = (await h.db.models.Team.findOne({ where: { slug: 'tail-structures' } }))!.id;
});

/** The link exactly as it arrived in the fake mailbox, read through the dev mailbox API. */
async function linkFromMailbox(email: string): Promise<string> {
  const box = await lead.agent.get('/api/dev/mailbox').expect(200);
  const mail = box.body.find((m: { to: string[] }) => m.to.includes(email));
  if (!mail) throw new Error(`no mail to ${email}`);
  return mail.text.match(/https?:\/\/\S+\/invite\/([A-Za-z0-9_-]+)/)![1];
}

const newPerson = { login: 'noor.hale', name: 'Noor Hale', email: 'noor.hale@tamsinbay.example' };

describe('invitations', () => {
  it('mails a link that signs the invitee into the team with the invited role', async () => {
    const res = await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'engineer' }).expect(201);
    expect(res.body).toMatchObject({ email: newPerson.email, role: 'engineer', status: 'open', mailStatus: 'sent' });
    const token = await linkFromMailbox(newPerson.email);

    const invitee = await signIn(h, newPerson, { next: `/invite/${token}` });
    expect(invitee.landedOn).toBe(`/invite/${token}`);
    const preview = await call(invitee, 'get', `/api/invites/${token}`).expect(200);
    expect(preview.body).toMatchObject({ teamName: 'Tail Structures Cell', role: 'engineer' });
    const accepted = await call(invitee, 'post', `/api/invites/${token}/accept`).expect(200);
    expect(accepted.body).toMatchObject({ teamId, role: 'engineer' });

    const me = await call(invitee, 'get', '/api/me').expect(200);
    expect(me.body.memberships).toEqual([expect.objectContaining({ teamId, role: 'engineer' })]);
    // an engineer may now save in the team
    await call(invitee, 'post', `/api/teams/${teamId}/parts`, { partNumber: 'TB-5000', name: 'Trim tab skin' }).expect(201);
    const audit = await call(lead, 'get', `/api/teams/${teamId}/audit`).expect(200);
    expect(audit.body.map((e: { action: string }) => e.action)).toEqual(expect.arrayContaining(['invite.create', 'invite.accept']));
  });

  it('stores only a hash of the token', async () => {
    await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'viewer' }).expect(201);
    const token = await linkFromMailbox(newPerson.email);
    const [rows] = await h.db.sequelize.query('SELECT token_hash FROM invites');
    const stored = (rows as { token_hash: string }[])[0].token_hash;
    expect(stored).toMatch(/^[0-9a-f]{64}$/);
    expect(stored).not.toContain(token);
  });

  it('works once: a second use of the same link is refused', async () => {
    await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'viewer' }).expect(201);
    const token = await linkFromMailbox(newPerson.email);
    const invitee = await signIn(h, newPerson);
    await call(invitee, 'post', `/api/invites/${token}/accept`).expect(200);
    const again = await call(invitee, 'post', `/api/invites/${token}/accept`).expect(410);
    expect(again.body.error).toMatch(/already used/);
    const someoneElse = await signIn(h, { login: 'li.second', name: 'Li Second', email: 'li@example.test' });
    await call(someoneElse, 'post', `/api/invites/${token}/accept`).expect(410);
    expect(await h.db.models.Membership.count({ where: { teamId, userId: someoneElse.userId! } })).toBe(0);
  });

  it('lets only one of two simultaneous accepts of one link through', async () => {
    await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'viewer' }).expect(201);
    const token = await linkFromMailbox(newPerson.email);
    // the invited person signed in twice (two browsers): both sessions may accept, only one does
    const a = await signIn(h, newPerson);
    const b = await signIn(h, newPerson);
    const statuses = (await Promise.all([a, b].map((who) => call(who, 'post', `/api/invites/${token}/accept`)))).map((r) => r.status).sort();
    expect(statuses).toEqual([200, 410]);
  });

  it('refuses an expired link with 410 and adds no one', async () => {
    await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'lead' }).expect(201);
    const token = await linkFromMailbox(newPerson.email);
    await h.db.models.Invite.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: newPerson.email } });
    const invitee = await signIn(h, newPerson);
    const res = await call(invitee, 'post', `/api/invites/${token}/accept`).expect(410);
    expect(res.body.error).toMatch(/expired/);
    expect(await h.db.models.Membership.count({ where: { userId: invitee.userId! } })).toBe(0);
    const list = await call(lead, 'get', `/api/teams/${teamId}/invites`).expect(200);
    expect(list.body[0].status).toBe('expired');
  });

  it('refuses someone signed in with another address (403 naming both) and keeps the link usable', async () => {
    await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'engineer' }).expect(201);
    const token = await linkFromMailbox(newPerson.email);
    const other = await signIn(h, { login: 'li.second', name: 'Li Second', email: 'li@example.test' });
    const res = await call(other, 'post', `/api/invites/${token}/accept`).expect(403);
    expect(res.body.error).toContain(newPerson.email);
    expect(res.body.error).toContain('li@example.test');
    expect(await h.db.models.Membership.count({ where: { teamId, userId: other.userId! } })).toBe(0);
    // the address is compared without regard to case
    const invitee = await signIn(h, { ...newPerson, email: newPerson.email.toUpperCase() });
    await call(invitee, 'post', `/api/invites/${token}/accept`).expect(200);
  });

  it('writes the expiry in the mail as a date and time with its zone', async () => {
    await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'viewer' }).expect(201);
    const mail = h.mail.messages.find((m) => m.to.includes(newPerson.email))!;
    const stored = (await h.db.models.Invite.findOne({ where: { email: newPerson.email } }))!.expiresAt;
    expect(mail.text).not.toMatch(/\d{4}-\d\d-\d\dT/);
    // e.g. "Tuesday, 1 December 2026 at 23:15 UTC", checked against the stored expiry
    const day = stored.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
    const hhmm = `${String(stored.getUTCHours()).padStart(2, '0')}:${String(stored.getUTCMinutes()).padStart(2, '0')}`;
    expect(mail.text).toContain(`${day} at ${hhmm} UTC`);
  });

  it('lets a site admin create a team and invite its first lead, who then manages it', async () => {
    const admin = await signIn(h, 'site.admin');
    const created = await call(admin, 'post', '/api/teams', { slug: 'nacelle-cell', name: 'Nacelle Cell', leadEmail: newPerson.email }).expect(201);
    expect(created.body.leadInvite).toMatchObject({ email: newPerson.email, role: 'lead', mailStatus: 'sent' });
    // the admin sees the team, its (empty) members and invitations, but not its studies
    await call(admin, 'get', `/api/teams/${created.body.id}/members`).expect(200);
    await call(admin, 'get', `/api/teams/${created.body.id}`).expect(403);
    const token = await linkFromMailbox(newPerson.email);
    const newLead = await signIn(h, newPerson);
    await call(newLead, 'post', `/api/invites/${token}/accept`).expect(200);
    await call(newLead, 'post', `/api/teams/${created.body.id}/invites`, { email: 'second@example.test', role: 'engineer' }).expect(201);
    const audit = await call(admin, 'get', `/api/teams/${created.body.id}/audit`).expect(200);
    expect(audit.body.map((e: { sentence: string }) => e.sentence)).toEqual(
      expect.arrayContaining(['created the team Nacelle Cell', `invited ${newPerson.email} as lead`]),
    );
  });

  it('shows the caught mails to signed-in people only', async () => {
    await (await anonymous(h.app)).agent.get('/api/dev/mailbox').expect(401);
  });

  it('answers an unknown token with 404', async () => {
    const someone = await signIn(h, newPerson);
    await call(someone, 'post', '/api/invites/not-a-real-token/accept').expect(404);
  });

  it('resends with a new token; the old link stops working', async () => {
    const created = await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: newPerson.email, role: 'viewer' }).expect(201);
    const oldToken = await linkFromMailbox(newPerson.email);
    h.mail.messages.length = 0;
    await call(lead, 'post', `/api/teams/${teamId}/invites/${created.body.id}/resend`).expect(200);
    const newToken = await linkFromMailbox(newPerson.email);
    expect(newToken).not.toBe(oldToken);
    const invitee = await signIn(h, newPerson);
    await call(invitee, 'post', `/api/invites/${oldToken}/accept`).expect(404);
    await call(invitee, 'post', `/api/invites/${newToken}/accept`).expect(200);
  });

  it('refuses an address that is not an e-mail with 400 naming the field', async () => {
    const res = await call(lead, 'post', `/api/teams/${teamId}/invites`, { email: 'not-an-address', role: 'viewer' }).expect(400);
    expect(res.body.field).toBe('email');
    expect(await h.db.models.Invite.count()).toBe(0);
  });
});

describe('invitations when the mail server is down', () => {
  let down: Harness;
  beforeAll(async () => {
    down = await startHarness({ env: { SMTP_PORT: '1' } }); // nothing listens on port 1
    await resetToDemo(down.db);
  });
  afterAll(() => down.close());

  it('reports the failure and keeps the invitation for a resend', async () => {
    const lead = await signIn(down, 'amara.okafor');
    const team = (await down.db.models.Team.findOne({ where: { slug: 'tail-structures' } }))!;
    const res = await call(lead, 'post', `/api/teams/${team.id}/invites`, { email: 'kept@example.test', role: 'viewer' }).expect(201);
    expect(res.body.mailStatus).toBe('failed');
    expect(res.body.mailError).toMatch(/ECONNREFUSED|connect/i);
    const stored = await down.db.models.Invite.findOne({ where: { email: 'kept@example.test' } });
    expect(stored).toMatchObject({ mailStatus: 'failed' });
    const list = await call(lead, 'get', `/api/teams/${team.id}/invites`).expect(200);
    expect(list.body[0]).toMatchObject({ email: 'kept@example.test', mailStatus: 'failed', status: 'open' });
  });
});
