import type { RequestHandler } from 'express';
import type { Config } from '../../config';
import type { Actor } from '../../lib/route';
import type { Clock } from '../../services/services';

/**
 * Turns the session into `req.actor`. The user is read with the session on every request (one
 * statement, lib/session.ts), never cached, so a deactivated user or a role change takes effect at
 * once; enforces the absolute session lifetime.
 */
export function loadActor(config: Config, clock: Clock): RequestHandler {
  const absoluteMs = config.SESSION_ABSOLUTE_HOURS * 3_600_000;
  return async (req, _res, next) => {
    const s = req.session;
    if (!s?.userId) return next();
    const tooOld = !s.authAt || clock.now().getTime() - s.authAt > absoluteMs;
    const user = tooOld ? null : req.sessionUser;
    if (!user || user.id !== s.userId || !user.active) {
      await new Promise<void>((resolve) => s.destroy(() => resolve()));
      return next();
    }
    req.actor = {
      userId: user.id,
      companyId: user.companyId,
      role: user.role as Actor['role'],
      name: user.name,
      email: user.email,
    };
    next();
  };
}
