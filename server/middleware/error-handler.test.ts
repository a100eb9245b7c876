import express from 'express';
import request from 'supertest';
import { z } from 'zod';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../app';
import { openTestDb } from '../test/test-db';

const db = openTestDb();
afterAll(() => db.sequelize.close());

const logged: unknown[] = [];
const probe = express.Router();
const cureBody = z.object({ dwell: z.object({ holdMin: z.number().min(1).max(1440) }) });
probe.post('/probe/validate', (req, res) => {
  res.json(cureBody.parse(req.body));
});
probe.get('/probe/explode', () => {
  throw new Error('secret internals at /srv/db password=hunter2');
});
probe.get('/probe/async-explode', async () => {
  await Promise.resolve();
  throw new TypeError('cannot read x of undefined');
});

const app = createApp({ config: db.config, sequelize: db.sequelize, apiRouters: [probe], logError: (e) => logged.push(e) });
afterAll(() => app.locals.shutdown());

/** POSTs as the client does: same session, with its CSRF token. */
async function post(url: string, payload: string | object) {
  const agent = request.agent(app);
  const { body } = await agent.get('/api/auth/csrf');
  return agent.post(url).set('X-CSRF-Token', body.csrfToken).set('Content-Type', 'application/json').send(payload);
}

describe('error handling', () => {
  it('turns a validation error into 400 naming the field and the limit', async () => {
    const res = await post('/api/probe/validate', { dwell: { holdMin: 5000 } });
    expect(res.status).toBe(400);
    expect(res.body.field).toBe('dwell.holdMin');
    expect(res.body.error).toContain('dwell.holdMin');
    expect(res.body.error).toContain('1440');
  });

  it('accepts the same body inside the limit', async () => {
    expect((await post('/api/probe/validate', { dwell: { holdMin: 120 } })).status).toBe(200);
  });

  it('answers malformed JSON with 400, not 500', async () => {
    const res = await post('/api/probe/validate', '{"dwell":');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/JSON/);
  });

  it('answers an unknown API route with 404 JSON', async () => {
    const res = await request(app).get('/api/no/such/route').expect(404).expect('Content-Type', /json/);
    expect(res.body.error).toContain('/api/no/such/route');
  });

  it('answers unexpected errors with a bare 500 and logs them server-side', async () => {
    for (const url of ['/api/probe/explode', '/api/probe/async-explode']) {
      const res = await request(app).get(url).expect(500);
      expect(res.body).toEqual({ error: 'Internal server error.' });
      expect(res.text).not.toMatch(/secret|hunter2|at .*\.ts|TypeError/);
    }
    expect(logged).toHaveLength(2);
  });

  it('sends a Content-Security-Policy that allows only our own scripts and blob workers', async () => {
    const res = await request(app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).not.toContain('unsafe-eval');
  });
});
