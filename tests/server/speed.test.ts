import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HTTPS, login, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { newJob, newRoom, patch } from './jobs-helpers';

// What issue 11's speed work changed in behaviour: the idle expiry written at most once a minute,
// API JSON compressed above ~1 KB, the built client served precompressed before any session work,
// and the one-statement reads answering exactly what the ORM paths answered.

let t: TestApp;
let a: TestCompany;
let dist: string;

const JS = 'export const greeting = "hello from the built client";\n'.repeat(40);
const HTML = '<!doctype html><html><head><title>Gaugeline</title></head><body><div id="root"></div></body></html>';

beforeAll(async () => {
  // A tiny built client, precompressed as `vite build` leaves it (file, file.br, file.gz).
  dist = mkdtempSync(join(tmpdir(), 'gaugeline-dist-'));
  mkdirSync(join(dist, 'assets'));
  const put = (name: string, body: string) => {
    writeFileSync(join(dist, name), body);
    writeFileSync(join(dist, `${name}.br`), brotliCompressSync(body));
    writeFileSync(join(dist, `${name}.gz`), gzipSync(body));
  };
  put('index.html', HTML);
  put('assets/app-abc123.js', JS);
  t = await buildTestApp({ CLIENT_DIST: dist });
  a = await makeCompany(t.orm.em.fork(), 'Speed');
});
afterAll(async () => t.close());

const sidOf = (cookies: string[]) =>
  decodeURIComponent(
    String(
      cookies
        .find((c) => c.startsWith('__Host-sid='))
        ?.split(';')[0]
        ?.split('=')[1] ?? '',
    ),
  )
    .slice(2)
    .split('.')[0];

async function storedExpiry(sid: string | undefined): Promise<number> {
  const [row] = await t.orm.em
    .fork()
    .getConnection()
    .execute<{ e: string }[]>(
      `select extract(epoch from expire::timestamptz) * 1000 as e from "session" where sid = ?`,
      [sid],
    );
  return Number(row?.e);
}

describe('session idle expiry', () => {
  it('is not written on every request, only once a minute or more has passed since the last write', async () => {
    const s = await login(t.app, a.users.estimator.email);
    const sid = sidOf(s.cookie);
    const db = t.orm.em.fork().getConnection();
    // As if the last write was 30 s ago: a request now must not write (the old rolling touch did, every time).
    await db.execute(`update "session" set expire = expire - interval '30 seconds' where sid = ?`, [sid]);
    const first = await storedExpiry(sid);
    expect(first).toBeGreaterThan(0);

    const r1 = await s.agent.get('/api/auth/me').set(HTTPS);
    expect(r1.status).toBe(200);
    expect(await storedExpiry(sid)).toBe(first);
    // The cookie still rolls with every answer, so the browser never drops it before the server does.
    expect(String(r1.headers['set-cookie'] ?? '')).toContain('__Host-sid=');

    // As if the last write was 90 s ago: the next request pushes the expiry forward by the idle timeout.
    await db.execute(`update "session" set expire = expire - interval '1 minute' where sid = ?`, [sid]);
    const backdated = await storedExpiry(sid);
    const before = Date.now();
    const r2 = await s.agent.get('/api/auth/me').set(HTTPS);
    expect(r2.status).toBe(200);
    const refreshed = await storedExpiry(sid);
    expect(refreshed).toBeGreaterThan(backdated);
    const idleMs = t.services.config.SESSION_IDLE_MINUTES * 60_000;
    expect(refreshed).toBeGreaterThanOrEqual(before + idleMs - 1000);
    expect(refreshed).toBeLessThanOrEqual(Date.now() + idleMs + 1000);
  });

  it('never lets a session outlive the idle timeout: one just past its stored expiry is refused', async () => {
    const s = await login(t.app, a.users.salesperson.email);
    const sid = sidOf(s.cookie);
    await t.orm.em
      .fork()
      .getConnection()
      .execute(`update "session" set expire = now() - interval '1 second' where sid = ?`, [sid]);
    const r = await s.agent.get('/api/auth/me').set(HTTPS);
    expect(r.status).toBe(401);
  });

  it('a role changed in the database counts on the very next request (the user is read with the session)', async () => {
    const em = t.orm.em.fork();
    const s = await login(t.app, a.users.installer.email);
    expect((await s.agent.get('/api/users').set(HTTPS)).status).toBe(403);
    await em.getConnection().execute(`update "app_user" set role = 'owner' where id = ?`, [a.users.installer.id]);
    try {
      expect((await s.agent.get('/api/users').set(HTTPS)).status).toBe(200);
    } finally {
      await em.getConnection().execute(`update "app_user" set role = 'installer' where id = ?`, [a.users.installer.id]);
    }
    expect((await s.agent.get('/api/users').set(HTTPS)).status).toBe(403);
  });
});

describe('API compression', () => {
  it('compresses JSON above ~1 KB when the request accepts it, with Vary: Accept-Encoding', async () => {
    const s = await login(t.app, a.users.owner.email);
    const job = await newJob(s);
    for (let i = 0; i < 4; i += 1) await newRoom(s, job.id);
    const gz = await s.agent.get(`/api/jobs/${job.id}/rooms`).set(HTTPS).set('Accept-Encoding', 'gzip');
    expect(gz.status).toBe(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(String(gz.headers.vary)).toMatch(/Accept-Encoding/i);
    expect(gz.headers['cache-control']).toBe('no-store');
    expect(gz.body.rooms).toHaveLength(4);

    const br = await s.agent.get(`/api/jobs/${job.id}/rooms`).set(HTTPS).set('Accept-Encoding', 'br');
    expect(br.headers['content-encoding']).toBe('br');

    const plain = await s.agent.get(`/api/jobs/${job.id}/rooms`).set(HTTPS).set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body).toEqual(gz.body);
  });

  it('leaves small answers as they are', async () => {
    const s = await login(t.app, a.users.owner.email);
    const r = await s.agent.get('/api/health').set(HTTPS).set('Accept-Encoding', 'gzip');
    expect(r.status).toBe(200);
    expect(r.headers['content-encoding']).toBeUndefined();
  });
});

describe('the built client', () => {
  it('serves precompressed files by Accept-Encoding with Vary, hashed assets cached for a year, no session', async () => {
    const br = await request(t.app).get('/assets/app-abc123.js').set('Accept-Encoding', 'gzip, deflate, br');
    expect(br.status).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(String(br.headers['content-type'])).toMatch(/javascript/);
    expect(String(br.headers.vary)).toMatch(/Accept-Encoding/i);
    expect(br.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(br.headers['set-cookie']).toBeUndefined();

    const gz = await request(t.app).get('/assets/app-abc123.js').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(JS);

    const plain = await request(t.app).get('/assets/app-abc123.js').set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(JS);
  });

  it('answers the SPA routes with index.html (compressed, revalidated) and keeps /api answers as problems', async () => {
    const page = await request(t.app).get('/jobs/some-job/walkthrough').set('Accept-Encoding', 'gzip');
    expect(page.status).toBe(200);
    expect(page.headers['content-encoding']).toBe('gzip');
    expect(page.headers['cache-control']).toBe('no-cache');
    expect(String(page.headers['content-type'])).toMatch(/text\/html/);
    expect(page.text).toBe(HTML);
    expect(page.headers['content-security-policy']).toBeTruthy();

    const api = await request(t.app).get('/api/no-such-thing').set(HTTPS);
    expect(api.status).toBe(404);
    expect(String(api.headers['content-type'])).toMatch(/problem\+json/);
  });
});

describe('one-statement reads', () => {
  it('the jobs list counts every job even on a page past the end', async () => {
    const s = await login(t.app, a.users.owner.email);
    const all = await s.agent.get('/api/jobs?page=1&pageSize=1').set(HTTPS);
    expect(all.status).toBe(200);
    expect(all.body.items).toHaveLength(1);
    const total = all.body.total as number;
    expect(total).toBeGreaterThanOrEqual(1);
    const past = await s.agent.get(`/api/jobs?page=${total + 5}&pageSize=1`).set(HTTPS);
    expect(past.body.items).toEqual([]);
    expect(past.body.total).toBe(total);
  });

  it('a room save answers the same room a read gives, and a stale version still gets the 409 with the current room', async () => {
    const s = await login(t.app, a.users.owner.email);
    const job = await newJob(s);
    const room = await newRoom(s, job.id);
    const saved = await patch(s, `/api/jobs/${job.id}/rooms/${room.id}`, room.version).set(HTTPS).send({ position: 3 });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.headers.etag).toBe(`"${room.version + 1}"`);
    const read = await s.agent.get(`/api/jobs/${job.id}/rooms/${room.id}`).set(HTTPS);
    expect(saved.body.room).toEqual(read.body.room);
    expect(read.body.room.position).toBe(3);

    const stale = await patch(s, `/api/jobs/${job.id}/rooms/${room.id}`, room.version).set(HTTPS).send({ position: 4 });
    expect(stale.status).toBe(409);
    expect(stale.body.currentVersion).toBe(room.version + 1);
  });
});
