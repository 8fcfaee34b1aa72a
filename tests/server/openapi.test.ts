import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openApiPath } from '../../server/src/lib/openapi';
import { routeRegistry } from '../../server/src/lib/route';
import { browserAgent, HTTPS } from '../helpers/fixtures';
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
