import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { problemRecord } from '../../server/src/contract';
import { openApiPath } from '../../server/src/lib/openapi';
import { escapeHtml, openApiPage } from '../../server/src/lib/openapi-page';
import { routeRegistry } from '../../server/src/lib/route';
import { browserAgent, HTTPS, login, makeCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';

/**
 * GET /api/openapi.json describes every registered route. (That the answers match the documented
 * schemas is checked on every answer of every server test: the test app validates each one against the
 * same zod schema the document is made from, and a mismatch is a 500.)
 */
let t: TestApp;
let doc: {
  openapi: string;
  paths: Record<string, Record<string, { 'x-policy': { kind: string }; responses: Record<string, unknown> }>>;
  components: { schemas: Record<string, unknown> };
};

beforeAll(async () => {
  t = await buildTestApp();
  const r = await browserAgent(t.app).get('/api/openapi.json').set(HTTPS);
  expect(r.status).toBe(200);
  doc = r.body;
});
afterAll(async () => t.close());

describe('the OpenAPI document', () => {
  it('is OpenAPI 3.1 with the problem shape', () => {
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.components.schemas.Problem).toMatchObject({ type: 'object' });
  });

  it('has every registered route, with its policy and its declared answer', () => {
    expect(routeRegistry.length).toBeGreaterThan(30);
    const missing = routeRegistry.filter((r) => !doc.paths[openApiPath(r.path)]?.[r.method]);
    expect(missing.map((r) => `${r.method} ${r.path}`)).toEqual([]);
    for (const r of routeRegistry) {
      const op = doc.paths[openApiPath(r.path)]?.[r.method];
      expect(op?.['x-policy'].kind, `${r.method} ${r.path}`).toBe(r.policy.kind);
      expect(Object.keys(op?.responses ?? {}), `${r.method} ${r.path}`).toContain(String(r.status));
    }
    const documented = Object.values(doc.paths).reduce((n, ops) => n + Object.keys(ops).length, 0);
    expect(documented).toBe(routeRegistry.length);
  });

  it('documents a job update with its body, If-Match, ETag and conflict answers', () => {
    const op = doc.paths['/api/jobs/{id}']?.patch as unknown as {
      parameters: { name: string; in: string }[];
      requestBody: { content: Record<string, unknown> };
      responses: Record<string, { headers?: Record<string, unknown> }>;
    };
    expect(op.parameters).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ name: 'id', in: 'path' }),
        expect.objectContaining({ name: 'If-Match', in: 'header' }),
      ]),
    );
    expect(op.requestBody.content['application/json']).toBeDefined();
    expect(op.responses['200']?.headers?.ETag).toBeDefined();
    expect(Object.keys(op.responses)).toEqual(expect.arrayContaining(['400', '401', '403', '404', '409', '428']));
  });
});

describe('problem answers', () => {
  it('match the documented Problem schema, with a status the route documents', async () => {
    const a = await makeCompany(t.orm.em.fork(), 'OpenApiProblems');
    const installer = await login(t.app, a.users.installer.email);
    const salesperson = await login(t.app, a.users.salesperson.email);
    const cases = [
      { method: 'get', path: '/api/jobs/{id}', res: await browserAgent(t.app).get(`/api/jobs/${crypto.randomUUID()}`) },
      {
        method: 'post',
        path: '/api/jobs',
        res: await installer.agent.post('/api/jobs').set('X-CSRF-Token', installer.csrf).send({}),
      },
      {
        method: 'post',
        path: '/api/jobs',
        res: await salesperson.agent.post('/api/jobs').set('X-CSRF-Token', salesperson.csrf).send({ street: 1 }),
      },
      {
        method: 'patch',
        path: '/api/jobs/{id}',
        res: await salesperson.agent
          .patch(`/api/jobs/${crypto.randomUUID()}`)
          .set('X-CSRF-Token', salesperson.csrf)
          .send({ notes: 'x' }),
      },
    ] as const;
    expect(cases.map((c) => c.res.status)).toEqual([401, 403, 400, 428]);
    for (const c of cases) {
      expect(c.res.headers['content-type']).toContain('application/problem+json');
      expect(problemRecord.safeParse(c.res.body).success, JSON.stringify(c.res.body)).toBe(true);
      expect(Object.keys(doc.paths[c.path]?.[c.method]?.responses ?? {}), `${c.method} ${c.path}`).toContain(
        String(c.res.status),
      );
    }
  });
});

describe('the page for developers (GET /api/docs)', () => {
  it('shows every operation of the document, with no script and nothing from another host', async () => {
    const r = await browserAgent(t.app).get('/api/docs').set(HTTPS);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toContain('text/html');
    expect(r.headers['content-security-policy']).toContain("default-src 'self'");
    const html = r.text;
    for (const ops of Object.values(doc.paths))
      for (const op of Object.values(ops) as unknown as { operationId: string }[])
        expect(html, op.operationId).toContain(`id="${op.operationId}"`);
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/(src|href)="(https?:)?\/\//i);
    expect(html).toContain('Signed in as owner, estimator, salesperson');
  });

  it('escapes what the document says (a summary is text, never markup)', () => {
    const html = openApiPage({
      openapi: '3.1.0',
      info: { title: 'T', version: '1', description: '<b>d</b>' },
      paths: {
        '/api/x': {
          get: { operationId: 'getX', summary: '<img src=x onerror=alert(1)>', 'x-policy': { kind: 'public' } },
        },
      },
    });
    expect(html).toContain(escapeHtml('<img src=x onerror=alert(1)>'));
    expect(html).not.toContain('<img');
    expect(html).not.toContain('<b>d</b>');
  });
});
