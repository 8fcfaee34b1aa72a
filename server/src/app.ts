import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { RequestContext } from '@mikro-orm/core';
import compression from 'compression';
import express, { type Express, type RequestHandler } from 'express';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { constants as zlibConstants } from 'node:zlib';
import { logger } from './lib/logger';
import { requestLog } from './lib/request-log';
import { notFoundApi, problemHandler } from './lib/problem';
import { PayloadTooLargeError } from './lib/errors';
import { IMPORT_LIMITS } from '@calc';
import { apiVersionGuard, csrfGuard, deviceGuard, personGuard, sessionMiddleware } from './lib/session';
import { loadActor } from './modules/auth/load-actor';
import { mountHooks, mountModules, type ModuleMount } from './modules';
import type { Services } from './services/services';
import { browserPayments } from './services/payments';

const JSON_LIMIT = '256kb';
const IMPORT_JSON_LIMIT = '3mb';
const IMPORT_PATH = /^\/api\/company-data\/[a-z-]+\/import\/(preview|apply)$/;
const COMPRESS_ABOVE_BYTES = 1024;
const BROTLI_WINDOW_BITS = 18;

/**
 * The built client: files precompressed at build time (brotli, gzip) chosen by the request's
 * Accept-Encoding with `Vary: Accept-Encoding`; hashed assets cached for a year; any other GET
 * outside /api gets index.html (the SPA's routes), never cached without revalidation.
 */
function clientFiles(dist: string): RequestHandler | null {
  if (!existsSync(join(dist, 'index.html'))) return null;
  const assets = join(dist, 'assets');
  const serve = expressStaticGzip(dist, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      maxAge: '1h',
      setHeaders: (res, path) => {
        if (path.startsWith(assets)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        // The shell, the service worker and its manifest are revalidated on every load, so an update is seen.
        else if (/(index\.html|sw\.js|workbox-[\w-]+\.js|manifest\.webmanifest)(\.br|\.gz)?$/.test(path))
          res.setHeader('Cache-Control', 'no-cache');
      },
    },
  });
  const isApi = (path: string) => path === '/api' || path.startsWith('/api/');
  return (req, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || isApi(req.path)) return next();
    serve(req, res, (err?: unknown) => {
      if (err) return next(err);
      // Not a file: the SPA's own route.
      const original = req.url;
      req.url = '/index.html';
      serve(req, res, (err2?: unknown) => {
        req.url = original;
        next(err2);
      });
    });
  };
}

/** Routes only the tests add (a webhook, a link-session route), mounted exactly like the real ones. */
export interface AppExtras {
  modules?: readonly ModuleMount[];
  hooks?: readonly ModuleMount[];
}

/** Builds the whole HTTP app without listening: server.ts listens, the tests call it through supertest. */
export function createApp(services: Services, extras: AppExtras = {}): Express {
  const { orm, config } = services;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY === 'false' ? false : config.TRUST_PROXY);
  app.set('json spaces', 0);
  // No body-hash ETag on every JSON answer (a SHA-1 of each body): /api answers are no-store, and the routes
  // that take If-Match send their record's version as the ETag themselves (lib/route.ts).
  app.set('etag', false);

  app.use(requestLog(logger));
  const paysFrom = browserPayments(config);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          // The customer's page confirms a deposit with the payment service from the browser: the local fake's
          // loopback origin when it is the configured service, nothing else (services/payments.ts).
          connectSrc: ["'self'", ...(paysFrom ? [paysFrom.apiUrl] : [])],
          imgSrc: ["'self'", 'data:', 'blob:'],
          styleSrc: ["'self'", "'unsafe-inline'"],
          fontSrc: ["'self'", 'data:'],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: null,
        },
      },
      strictTransportSecurity: config.APP_ORIGIN.startsWith('https:')
        ? { maxAge: 31_536_000, includeSubDomains: true }
        : false,
    }),
  );

  // The built client is answered before the session, the actor and the ORM's context: it needs none of them.
  const client = clientFiles(resolve(config.CLIENT_DIST));
  if (client) app.use(client);

  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // Signed webhooks take their body raw and have no session or CSRF: before all of those.
  mountHooks(app, services, extras.hooks);
  app.use('/api', apiVersionGuard);
  // A CSV import carries the whole file (up to IMPORT_LIMITS.maxBytes, checked with a message naming the limit).
  const importJson = express.json({ limit: IMPORT_JSON_LIMIT, strict: true });
  const importTooLarge = new PayloadTooLargeError(
    `The file is larger than the ${IMPORT_LIMITS.maxBytes / 1_000_000} MB limit. Split it into smaller files.`,
  );
  app.use((req, res, next) =>
    IMPORT_PATH.test(req.path)
      ? importJson(req, res, (err?: unknown) =>
          next(err && (err as { type?: string }).type === 'entity.too.large' ? importTooLarge : err),
        )
      : next(),
  );
  // JSON answers above ~1 KB go compressed (gzip or brotli as the request accepts; Vary: Accept-Encoding).
  // Fast settings (gzip 3, brotli 2): on JSON they compress nearly as well as the defaults for a fraction of the CPU.
  // Brotli's window is 256 KB (lgwin 18) instead of its 4 MB default: every answer gets a new encoder, and with
  // 50 answers in flight the default's buffers cost the jobs list 6.6 ms of CPU per request instead of 2.4 ms
  // (bench, CPU ms/req); our answers are far smaller than the window, so they compress the same.
  app.use(
    '/api',
    compression({
      threshold: COMPRESS_ABOVE_BYTES,
      level: 3,
      brotli: {
        params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 2, [zlibConstants.BROTLI_PARAM_LGWIN]: BROTLI_WINDOW_BITS },
      },
    }),
  );
  app.use('/api', express.json({ limit: JSON_LIMIT, strict: true }));
  app.use(sessionMiddleware(config, services.sessionPool));
  app.use(loadActor(config, services.clock));
  app.use((req, _res, next) => RequestContext.create(orm.em, next));
  app.use('/api', csrfGuard);
  app.use('/api', personGuard);
  app.use('/api', deviceGuard);

  mountModules(app, services, extras.modules);
  app.use('/api', notFoundApi);

  app.use(problemHandler);
  return app;
}
