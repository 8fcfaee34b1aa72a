import type { EntityManager } from '@mikro-orm/postgresql';
import type { Clock } from '../services/services';
import type { Actor } from './route';

/**
 * What every service function takes first, in one object: the request's EntityManager, who is acting
 * (the tenant comes from here) and the clock. A service that needs more (storage, the queue) adds it
 * to its own context type. Routes hand it over as `ctx.service`.
 */
export interface ServiceContext {
  readonly em: EntityManager;
  readonly actor: Actor;
  readonly clock: Clock;
}
