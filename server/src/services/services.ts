import type { MikroORM } from '@mikro-orm/postgresql';
import type pg from 'pg';
import type { Config } from '../config';
import type { Outbox } from '../fakes/smtp-fake';
import type { Mailer } from './mailer';
import type { Payments } from './payments';
import type { Queue } from './queue';
import type { Storage } from './storage';

export interface Clock {
  now(): Date;
}
export const systemClock: Clock = { now: () => new Date() };

/** What createApp is given: every outside dependency, so tests can build the app with their own. */
export interface Services {
  orm: MikroORM;
  /** A small pool of its own for the session store (connect-pg-simple speaks pg directly). */
  sessionPool: pg.Pool;
  config: Config;
  /** Used by the queue's workers only: requests put e-mail on the queue (modules/mail), never send it. */
  mailer: Mailer;
  /** Background work in PostgreSQL (services/queue.ts); task kinds in tasks/kinds.ts. */
  queue: Queue;
  /** Deposits through the payment service's SDK (the local fake unless a real key is configured). */
  payments: Payments;
  /** Uploaded files (room photos). */
  storage: Storage;
  clock: Clock;
  /** Only where the dev outbox page is on (never in production). */
  outbox?: Outbox;
}
