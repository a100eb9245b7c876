import { describe, expect, it } from 'vitest';
import { checkHealth } from './health.service';

describe('checkHealth', () => {
  it('reports the database up with 200 when the ping answers', async () => {
    const result = await checkHealth(async () => [[{ 1: 1 }]], '9.9.9');
    expect(result).toEqual({ httpStatus: 200, body: { status: 'ok', db: 'up', version: '9.9.9' } });
  });

  it('reports the database down with 503 when the ping fails', async () => {
    const result = await checkHealth(() => Promise.reject(new Error('ECONNREFUSED')), '9.9.9');
    expect(result.httpStatus).toBe(503);
    expect(result.body.db).toBe('down');
    expect(result.body.status).toBe('degraded');
  });

  it('reports down instead of hanging when the ping never answers', async () => {
    const started = Date.now();
    const result = await checkHealth(() => new Promise(() => {}), '9.9.9', 50);
    expect(result.httpStatus).toBe(503);
    expect(Date.now() - started).toBeLessThan(1_000);
  });
});
