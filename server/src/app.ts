import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { RequestContext } from '@mikro-orm/core';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { randomUUID } from 'node:crypto';
import { logger } from './lib/logger';
import { notFoundApi, problemHandler } from './lib/problem';
import { csrfGuard, personGuard, sessionMiddleware } from './lib/session';
import { loadActor } from './modules/auth/load-actor';
import { mountModules } from './modules';
import type { Services } from './services/services';

const JSON_LIMIT = '256kb';
const IMPORT_JSON_LIMIT = '3mb';
const IMPORT_PATH = /^\/api\/company-data\/[a-z-]+\/import\/(preview|apply)$/;

/** Builds the whole HTTP app without listening: server.ts listens, the tests call it through supertest. */
export function createApp(services: Services): Express {
  const { orm, config } = services;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY === 'false' ? false : config.TRUST_PROXY);
  app.set('json spaces', 0);

  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const id = randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      customLogLevel: (_req, res, err) =>
        err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'info' : 'debug',
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
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

  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // A CSV import carries the whole file (up to IMPORT_LIMITS.maxBytes, checked with a message naming the limit).
  const importJson = express.json({ limit: IMPORT_JSON_LIMIT, strict: true });
  app.use((req, res, next) => (IMPORT_PATH.test(req.path) ? importJson(req, res, next) : next()));
  app.use('/api', express.json({ limit: JSON_LIMIT, strict: true }));
  app.use((req, _res, next) => RequestContext.create(orm.em, next));
  app.use(sessionMiddleware(config, services.sessionPool));
  app.use(loadActor(config, services.clock));
  app.use('/api', csrfGuard);
  app.use('/api', personGuard);

  mountModules(app, services);
  app.use('/api', notFoundApi);

  const dist = resolve(config.CLIENT_DIST);
  if (existsSync(join(dist, 'index.html'))) {
    app.use(
      express.static(dist, {
        index: false,
        maxAge: '1h',
        setHeaders: (res, path) => {
          if (path.includes(`${join(dist, 'assets')}`))
            res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        },
      }),
    );
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(join(dist, 'index.html'));
    });
  }
  app.use(problemHandler);
  return app;
}
