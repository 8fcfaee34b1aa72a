import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { isProblem } from '../helpers/fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(async () => t.close());

describe('GET /api/health', () => {
  it('says ok when the database answers', async () => {
    const r = await request(t.app).get('/api/health');
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('answers unknown API routes with problem+json 404', async () => {
    const r = await request(t.app).get('/api/nope');
    expect(r.status).toBe(404);
    expect(isProblem(r)).toBe(true);
  });

  it('says db down with 503 once the pool is closed', async () => {
    const other = await buildTestApp();
    await other.orm.close();
    const r = await request(other.app).get('/api/health');
    expect(r.status).toBe(503);
    expect(r.body.db).toBe('down');
    await other.close();
  });
});
