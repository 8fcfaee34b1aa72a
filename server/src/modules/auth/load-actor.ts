import type { RequestHandler } from 'express';
import { RequestContext } from '@mikro-orm/core';
import type { Config } from '../../config';
import type { Clock } from '../../services/services';
import { UserSchema } from '../users/user.entity';

/**
 * Turns the session into `req.actor`, re-reading the user on every request so that a deactivated
 * user or a role change takes effect at once, and enforcing the absolute session lifetime.
 */
export function loadActor(config: Config, clock: Clock): RequestHandler {
  const absoluteMs = config.SESSION_ABSOLUTE_HOURS * 3_600_000;
  return async (req, _res, next) => {
    const s = req.session;
    if (!s?.userId) return next();
    const tooOld = !s.authAt || clock.now().getTime() - s.authAt > absoluteMs;
    const em = RequestContext.getEntityManager();
    const user = tooOld || !em ? null : await em.findOne(UserSchema, { id: s.userId }, { populate: ['company'] });
    if (!user || !user.active) {
      await new Promise<void>((resolve) => s.destroy(() => resolve()));
      return next();
    }
    req.actor = { userId: user.id, companyId: user.company.id, role: user.role, name: user.name, email: user.email };
    next();
  };
}
