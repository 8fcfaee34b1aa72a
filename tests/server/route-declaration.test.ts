import { createHmac, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { z } from 'zod';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { link, NO_CONTENT, PUBLIC, signed, type ApiRouter } from '../../server/src/lib/route';
import { browserAgent, HTTPS, login, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem } from './jobs-helpers';

/**
 * The route declaration's newer parts, on routes only this file mounts (through createApp's extras, so
 * they go through the real middleware order): signed raw-body webhooks, the proposal-link policy,
 * per-route middleware, 204, and the test app's response check.
 */
const SECRET = 'test-webhook-secret';
const sign = (body: string) => createHmac('sha256', SECRET).update(body).digest('hex');
const received: string[] = [];

function testHook(api: ApiRouter): void {
  api.route({
    method: 'post',
    path: '/',
    policy: signed((raw, req) => {
      const sent = Buffer.from(req.get('X-Test-Signature') ?? '', 'hex');
      const want = Buffer.from(sign(raw.toString('utf8')), 'hex');
      return sent.length === want.length && timingSafeEqual(sent, want);
    }),
    response: z.object({ received: z.literal(true) }),
    handler: async ({ rawBody }) => {
      received.push(rawBody.toString('utf8'));
      return { received: true as const };
    },
  });
}

const PROPOSAL_A = '0b6f2d3e-8a31-4f57-9d6a-3c1e2b4a5f60';
const PROPOSAL_B = '7c2e9a14-5b63-4d08-8e1f-2a9b7c6d5e40';
const stamp: RequestHandler = (_req, res, next) => {
  res.setHeader('X-Stamped', 'yes');
  next();
};

function testRoutes(api: ApiRouter): void {
  // Stands in for the route a proposal link opens (the proposal issue adds the real one).
  api.route({
    method: 'post',
    path: '/open-link/:proposalId',
    policy: PUBLIC,
    params: z.strictObject({ proposalId: z.uuid() }),
    response: NO_CONTENT,
    handler: async ({ req, params }) => {
      req.session.link = { proposalId: params.proposalId, companyId: 'c', expiresAt: Date.now() + 60_000 };
    },
  });
  api.route({
    method: 'get',
    path: '/proposals/:proposalId',
    policy: link('proposalId'),
    params: z.strictObject({ proposalId: z.uuid() }),
    response: z.object({ proposalId: z.string() }),
    use: [stamp],
    handler: async ({ link: grant }) => ({ proposalId: grant?.proposalId ?? '' }),
  });
  // A POST action on a versioned record takes If-Match like a PATCH; a POST create (201) only sends the ETag.
  api.route({
    method: 'post',
    path: '/counters/:id/bump',
    policy: PUBLIC,
    params: z.strictObject({ id: z.string() }),
    response: z.object({ version: z.number() }),
    versioned: (out) => out.version,
    handler: async ({ ifMatch }) => ({ version: ifMatch + 1 }),
  });
  api.route({
    method: 'post',
    path: '/counters',
    policy: PUBLIC,
    status: 201,
    response: z.object({ version: z.number() }),
    versioned: (out) => out.version,
    handler: async ({ ifMatch }) => ({ version: Number.isNaN(ifMatch) ? 1 : -1 }),
  });
  api.route({
    method: 'get',
    path: '/wrong-shape',
    policy: PUBLIC,
    response: z.object({ count: z.number() }),
    handler: async () => ({ count: 'three' }) as unknown as { count: number },
  });
}

let t: TestApp;
let a: TestCompany;

beforeAll(async () => {
  t = await buildTestApp({}, undefined, { hooks: [['/test', testHook]], modules: [['/route-test', testRoutes]] });
  a = await makeCompany(t.orm.em.fork(), 'RouteDecl');
});
afterAll(async () => t.close());

describe('signed webhook routes', () => {
  it('take the body as received, with no session or CSRF token, when the signature matches', async () => {
    const body = '{"event":"paid","amount":1200}';
    const r = await browserAgent(t.app)
      .post('/api/hooks/test')
      .set(HTTPS)
      .set('Content-Type', 'application/json')
      .set('X-Test-Signature', sign(body))
      .send(body);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(received).toContain(body);
  });

  it('refuse a wrong signature with 401 and do not run the handler', async () => {
    const body = '{"event":"paid","amount":999999}';
    const r = await browserAgent(t.app)
      .post('/api/hooks/test')
      .set(HTTPS)
      .set('Content-Type', 'application/json')
      .set('X-Test-Signature', sign('{"event":"other"}'))
      .send(body);
    expectProblem(r, 401);
    expect(received).not.toContain(body);
  });
});

describe('the proposal-link policy', () => {
  it('lets a link session reach only its own proposal (another is 404), and no staff route (401)', async () => {
    const customer = browserAgent(t.app);
    const { body: csrf } = await customer.get('/api/auth/csrf').set(HTTPS);
    const none = await customer.get(`/api/route-test/proposals/${PROPOSAL_A}`).set(HTTPS);
    expectProblem(none, 401);
    const opened = await customer
      .post(`/api/route-test/open-link/${PROPOSAL_A}`)
      .set(HTTPS)
      .set('X-CSRF-Token', String(csrf.token));
    expect(opened.status).toBe(204);
    const own = await customer.get(`/api/route-test/proposals/${PROPOSAL_A}`).set(HTTPS);
    expect(own.status, JSON.stringify(own.body)).toBe(200);
    expect(own.body).toEqual({ proposalId: PROPOSAL_A });
    expect(own.headers['x-stamped']).toBe('yes');
    expectProblem(await customer.get(`/api/route-test/proposals/${PROPOSAL_B}`).set(HTTPS), 404);
    expectProblem(await customer.get('/api/jobs').set(HTTPS), 401);
  });

  it('is refused to staff sessions (they hold no link)', async () => {
    const owner = await login(t.app, a.users.owner.email);
    expectProblem(await owner.agent.get(`/api/route-test/proposals/${PROPOSAL_A}`), 401);
  });
});

describe('versioned POST routes', () => {
  const post = async (path: string, ifMatch?: string) => {
    const agent = browserAgent(t.app);
    const { body: csrf } = await agent.get('/api/auth/csrf').set(HTTPS);
    const req = agent.post(path).set(HTTPS).set('X-CSRF-Token', String(csrf.token));
    return ifMatch === undefined ? req : req.set('If-Match', ifMatch);
  };

  it('an action (not a 201 create) requires If-Match: 428 without, 400 malformed, the version handed on', async () => {
    expectProblem(await post('/api/route-test/counters/c1/bump'), 428);
    const bad = await post('/api/route-test/counters/c1/bump', 'three');
    expectProblem(bad, 400);
    expect(bad.body.errors).toEqual([{ path: 'If-Match', message: expect.stringContaining('quoted version') }]);
    const ok = await post('/api/route-test/counters/c1/bump', '"3"');
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body).toEqual({ version: 4 });
    expect(ok.headers.etag).toBe('"4"');
  });

  it('a create (201) takes no If-Match and sends the new ETag; the API document says which take it', async () => {
    const created = await post('/api/route-test/counters');
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.headers.etag).toBe('"1"');
    const doc = (await browserAgent(t.app).get('/api/openapi.json').set(HTTPS)).body as {
      paths: Record<string, Record<string, { parameters?: Array<{ name: string; in: string }> }>>;
    };
    const header = (path: string) =>
      (doc.paths[path]?.post?.parameters ?? []).some((p) => p.in === 'header' && p.name === 'If-Match');
    expect(header('/api/route-test/counters/{id}/bump')).toBe(true);
    expect(header('/api/route-test/counters')).toBe(false);
  });
});

describe('response schemas', () => {
  it('in the test app, an answer that does not match its schema fails loudly (500 naming the field)', async () => {
    const r = await browserAgent(t.app).get('/api/route-test/wrong-shape').set(HTTPS);
    expectProblem(r, 500);
    expect(String(r.body.detail)).toContain('count');
  });
});
