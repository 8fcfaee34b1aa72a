import { z, type ZodType } from 'zod';
import { API_VERSION, problemRecord } from '@contract';
import type { Policy, RegisteredRoute } from './route';

/**
 * The API's self-description (OpenAPI 3.1), made from the route registry's zod schemas with zod 4's
 * JSON Schema output (draft 2020-12, which OpenAPI 3.1 uses): every route with its method, path, policy,
 * parameters, body, answer and problem answers. Served at GET /api/openapi.json.
 */
type Json = Record<string, unknown>;

const toSchema = (schema: ZodType, io: 'input' | 'output'): Json =>
  z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as Json;

function describePolicy(p: Policy): Json {
  if (p.kind === 'public') return { kind: 'public' };
  if (p.kind === 'roles') return { kind: 'roles', roles: [...p.roles] };
  if (p.kind === 'link') return { kind: 'link', param: p.param };
  return { kind: 'signed' };
}

/** `/api/jobs/:jobId/rooms` → `/api/jobs/{jobId}/rooms`; a module's own root `/api/jobs/` → `/api/jobs`. */
export const openApiPath = (expressPath: string): string =>
  expressPath.replace(/:([A-Za-z0-9_]+)/g, '{$1}').replace(/(.)\/$/, '$1');

function parameters(route: RegisteredRoute): Json[] {
  const out: Json[] = [];
  const add = (schema: ZodType | undefined, where: 'path' | 'query') => {
    if (!schema) return;
    const js = toSchema(schema, 'input');
    const props = (js.properties ?? {}) as Record<string, Json>;
    const required = new Set((js.required ?? []) as string[]);
    for (const [name, s] of Object.entries(props)) {
      out.push({ name, in: where, required: where === 'path' || required.has(name), schema: s });
    }
  };
  add(route.params, 'path');
  add(route.query, 'query');
  for (const m of openApiPath(route.path).matchAll(/\{([^}]+)\}/g)) {
    const name = m[1] ?? '';
    if (!out.some((p) => p.name === name && p.in === 'path'))
      out.push({ name, in: 'path', required: true, schema: { type: 'string' } });
  }
  if (route.ifMatch) {
    out.push({
      name: 'If-Match',
      in: 'header',
      required: true,
      description: 'The version edited, quoted: "3". None: 428; stale: 409 with the record as it is now.',
      schema: { type: 'string', pattern: '^"\\d+"$' },
    });
  }
  return out;
}

const problem = (description: string): Json => ({
  description,
  content: { 'application/problem+json': { schema: { $ref: '#/components/schemas/Problem' } } },
});

function responses(route: RegisteredRoute): Json {
  const out: Json = {};
  const r = route.response;
  if ('safeParse' in r) {
    out[String(route.status)] = {
      description: 'Success',
      ...(route.versioned
        ? { headers: { ETag: { schema: { type: 'string' }, description: 'The version: "N"' } } }
        : {}),
      content: { 'application/json': { schema: toSchema(r as ZodType, 'output') } },
    };
  } else if (r.kind === 'no-content') {
    out['204'] = { description: 'Done; no body' };
  } else {
    out[String(route.status)] = { description: 'The file', content: { [r.contentType]: {} } };
  }
  if (route.params || route.query || route.body) out['400'] = problem('A field is missing or wrong (errors name each)');
  if (route.policy.kind !== 'public') out['401'] = problem('Not signed in (or the signature does not match)');
  if (route.policy.kind === 'roles') out['403'] = problem('The role may not do this, or the CSRF token is missing');
  if (route.params || route.policy.kind === 'link') out['404'] = problem('Not found (or not yours to see)');
  if (route.policy.kind === 'link')
    out['410'] = problem('The link ended (expired, withdrawn or replaced): why, and whom to contact');
  if (route.ifMatch) {
    out['409'] = problem('Changed by someone else since the version sent: the answer carries the record now');
    out['428'] = problem('If-Match is missing');
  }
  if (route.method !== 'get') out['415'] = problem('The body is not JSON (or multipart on upload routes)');
  out['500'] = problem('Our fault; logged with the request id');
  return out;
}

export function openApiDocument(routes: readonly RegisteredRoute[]): Json {
  const paths: Record<string, Json> = {};
  for (const route of routes) {
    const op: Json = {
      operationId: `${route.method}${openApiPath(route.path).replace(/[^A-Za-z0-9]+(.)?/g, (_m, c: string | undefined) => (c ?? '').toUpperCase())}`,
      ...(route.summary ? { summary: route.summary } : {}),
      'x-policy': describePolicy(route.policy),
      parameters: parameters(route),
      responses: responses(route),
    };
    if (route.body) {
      op.requestBody = { required: true, content: { 'application/json': { schema: toSchema(route.body, 'input') } } };
    } else if (route.multipart) {
      op.requestBody = {
        required: true,
        content: {
          'multipart/form-data': {
            schema: { type: 'object', properties: { file: { type: 'string', format: 'binary' } }, required: ['file'] },
          },
        },
      };
    } else if (route.raw) {
      op.requestBody = { required: true, content: { '*/*': { schema: { type: 'string', format: 'binary' } } } };
    }
    const path = openApiPath(route.path);
    paths[path] = { ...(paths[path] ?? {}), [route.method]: op };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Gaugeline API',
      version: String(API_VERSION),
      description:
        'Every route of the server, generated from its declaration. Policies: x-policy (public, roles, link, signed). Writes need X-CSRF-Token (GET /api/auth/csrf) except signed webhooks.',
    },
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    paths,
    components: { schemas: { Problem: toSchema(problemRecord, 'output') } },
  };
}
