import type { EntityManager } from '@mikro-orm/postgresql';
import type { Clock } from '../services/services';
import type { Actor } from './route';

/**
 * What every service function takes first, in one object: the request's EntityManager, who is acting
 * (the tenant comes from here) and the clock. A service that needs more (storage, the queue) adds it
 * to its own context type. Routes hand it over as `ctx.service`; a public route's actor is null
 * (`ServiceContext<Actor | null>`, the sign-in and reset services).
 *
 * Inside a transaction a service passes `{ ...ctx, em: tx }` on. Helpers keyed by a company rather than
 * a person (a company's price-book settings, a table lock) take `(em, companyId)`: other modules and
 * the worker call them without an actor.
 */
export interface ServiceContext<A extends Actor | null = Actor> {
  readonly em: EntityManager;
  readonly actor: A;
  readonly clock: Clock;
}
