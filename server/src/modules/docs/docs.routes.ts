import { z } from 'zod';
import { openApiDocument } from '../../lib/openapi';
import { openApiPage } from '../../lib/openapi-page';
import { PUBLIC, rawResponse, routeRegistry, type ApiRouter } from '../../lib/route';

/** GET /api/openapi.json: the API's own description, made from the route registry on each request. */
export function docsRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: PUBLIC,
    summary: 'This document (OpenAPI 3.1)',
    response: z.looseObject({ openapi: z.literal('3.1.0'), paths: z.record(z.string(), z.unknown()) }),
    handler: async () => openApiDocument(routeRegistry) as { openapi: '3.1.0'; paths: Record<string, unknown> },
  });
}

/** GET /api/docs: the same document as a page for developers (plain HTML, no script). */
export function docsPageRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/',
    policy: PUBLIC,
    summary: 'The API document as a page to read (HTML)',
    response: rawResponse('text/html'),
    handler: async ({ res }) => {
      res.type('html').send(openApiPage(openApiDocument(routeRegistry)));
      return undefined;
    },
  });
}
