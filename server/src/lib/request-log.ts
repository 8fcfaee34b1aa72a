import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';
import type { Logger } from 'pino';
// pino-http's declarations give Express's request `id` and `log`; this middleware fills them itself.
import type {} from 'pino-http';

type Level = 'error' | 'info' | 'debug';

/**
 * A request id (X-Request-Id) and `req.log`, with one line when the answer is finished: error for
 * 5xx, info for 4xx, debug for the rest. Cheap at the production level (info): the child logger is
 * made only when something logs, and a 2xx answer costs a level check, not a serialized request
 * (pino-http serialized every request's headers up front). Health checks are not logged.
 */
export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    const id = randomUUID();
    req.id = id;
    res.setHeader('X-Request-Id', id);
    let child: Logger | undefined;
    Object.defineProperty(req, 'log', {
      configurable: true,
      enumerable: false,
      get: () => (child ??= logger.child({ reqId: id })),
      set: (v: Logger) => {
        child = v;
      },
    });
    const started = performance.now();
    res.on('finish', () => {
      if (req.originalUrl === '/api/health') return;
      const level: Level = res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'info' : 'debug';
      if (!logger.isLevelEnabled(level)) return;
      req.log[level](
        {
          req: { method: req.method, url: req.originalUrl.split('?')[0], remoteAddress: req.ip },
          res: { statusCode: res.statusCode },
          responseTime: Math.round(performance.now() - started),
        },
        'request completed',
      );
    });
    next();
  };
}
