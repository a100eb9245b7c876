import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { anonymous, call, resetToDemo, signIn, signInSession, startHarness, type Harness } from '../test/harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
  await resetToDemo(h.db);
});
afterAll(() => h.close());

describe('sign-in through the local OAuth provider', () => {
  it('signs a demo person in with the seeded role', async () => {
    const lead = await signIn(h, 'amara.okafor');
    const me = await lead.agent.get('/api/me').expect(200);
    expect(me.body.user.login).toBe('amara.okafor');
    expect(me.body.memberships).toEqual([expect.objectContaining({ teamSlug: 'tail-structures', role: 'lead' })]);
  });

  it('creates the user on a first sign-in, with no team yet', async () => {
    const before = await h.db.models.User.count();
    const newcomer = await signIn(h, { login: 'pia.newcomer', name: 'Pia Newcomer', email: 'pia@example.test' });
    expect(await h.db.models.User.count()).toBe(before + 1);
    const me = await newcomer.agent.get('/api/me').expect(200);
    expect(me.body.user).toMatchObject({ login: 'pia.newcomer', email: 'pia@example.test', isAdmin: false });
    expect(me.body.memberships).toEqual([]);
    // a second sign-in finds the same user
    await signIn(h, { login: 'pia.newcomer', name: 'Pia Newcomer', email: 'pia@example.test' });
    expect(await h.db.models.User.count()).toBe(before + 1);
  });

  it('sets an HttpOnly, SameSite session cookie', async () => {
    const agent = request.agent(h.app);
    const res = await agent.get('/api/auth/github').expect(302);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/dwellform\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('refuses a callback whose state does not match the session', async () => {
    const agent = request.agent(h.app);
    await agent.get('/api/auth/github').expect(302);
    const res = await agent.get('/api/auth/github/callback?code=whatever&state=forged').expect(302);
    expect(res.headers.location).toBe('/sign-in?error=denied');
    const me = await agent.get('/api/me').expect(200);
    expect(me.body.user).toBeNull();
  });

  it('signs out, after which the session no longer reads team data', async () => {
    const viewer = await signIn(h, 'ines.varga');
    await call(viewer, 'get', '/api/teams').expect(200);
    await call(viewer, 'post', '/api/auth/logout').expect(204);
    await viewer.agent.get('/api/teams').expect(401);
  });

  it('refuses a state-changing request without the CSRF token, even when signed in', async () => {
    const engineer = await signIn(h, 'tomas.reed');
    const team = await h.db.models.Team.findOne({ where: { slug: 'tail-structures' } });
    const body = { partNumber: 'TB-9001', name: 'Hatch doubler, 16 plies' };
    const missing = await engineer.agent.post(`/api/teams/${team!.id}/parts`).send(body).expect(403);
    expect(missing.body.error).toMatch(/csrf/i);
    await engineer.agent.post(`/api/teams/${team!.id}/parts`).set('X-CSRF-Token', 'not-the-token').send(body).expect(403);
    expect(await h.db.models.Part.count({ where: { partNumber: 'TB-9001' } })).toBe(0);
    await call(engineer, 'post', `/api/teams/${team!.id}/parts`, body).expect(201);
  });

  it('hands every first request of a new session the same CSRF token, however they overlap', async () => {
    const { agent } = await signInSession(h, 'tomas.reed');
    // What a page does on arrival, side by side: who am I, and a token for a write.
    const [me, token] = await Promise.all([agent.get('/api/me').expect(200), agent.get('/api/auth/csrf').expect(200)]);
    expect(token.body.csrfToken).toMatch(/^[0-9a-f]{64}$/);
    expect(me.body.csrfToken).toBe(token.body.csrfToken);
    const team = await h.db.models.Team.findOne({ where: { slug: 'tail-structures' } });
    await agent
      .post(`/api/teams/${team!.id}/parts`)
      .set('X-CSRF-Token', token.body.csrfToken as string)
      .send({ partNumber: 'TB-9002', name: 'Access panel, 12 plies' })
      .expect(201);
  });

  it('returns to the page the user came from, but never to another site', async () => {
    expect((await signIn(h, 'ines.varga', { next: '/parts/1' })).landedOn).toBe('/parts/1');
    expect((await signIn(h, 'ines.varga', { next: '//evil.example/x' })).landedOn).toBe('/');
    expect((await signIn(h, 'ines.varga', { next: 'https://evil.example/' })).landedOn).toBe('/');
  });

  it('gives an anonymous visitor a CSRF token on request but no user', async () => {
    const anon = await anonymous(h.app);
    expect(anon.userId).toBeNull();
    expect(anon.csrf).toMatch(/^[0-9a-f]{64}$/);
  });

  it('stores no session for an anonymous GET /api/me (no row, no cookie)', async () => {
    const count = async () => Number(((await h.db.sequelize.query('SELECT COUNT(*) AS n FROM sessions'))[0] as { n: number }[])[0].n);
    const before = await count();
    for (let i = 0; i < 3; i++) {
      const res = await request(h.app).get('/api/me').expect(200);
      expect(res.body).toMatchObject({ user: null, csrfToken: null });
      expect(res.headers['set-cookie']).toBeUndefined();
    }
    expect(await count()).toBe(before);
  });
});

describe('rate limiting on /api/me', () => {
  let limited: Harness;
  beforeAll(async () => {
    limited = await startHarness({ env: { ME_RATE_LIMIT: '2' } });
  });
  afterAll(() => limited.close());

  it('answers 429 once the per-minute budget is spent', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await request(limited.app).get('/api/me')).status);
    expect(statuses).toEqual([200, 200, 429]);
  });
});

describe('rate limiting on the auth routes', () => {
  let limited: Harness;
  beforeAll(async () => {
    limited = await startHarness({ env: { AUTH_RATE_LIMIT: '3' } });
  });
  afterAll(() => limited.close());

  it('answers 429 once the per-minute budget is spent', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await request(limited.app).get('/api/auth/github')).status);
    expect(statuses).toEqual([302, 302, 302, 429, 429]);
  });
});
