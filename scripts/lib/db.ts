import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../../mikro-orm.config';
import { migrateQueue } from '../../server/src/services/queue';
import { log } from './system';

/** Applies every committed migration that has not run yet, then graphile-worker's own (schema graphile_worker). */
export async function migrate(databaseUrl: string): Promise<void> {
  const orm = await MikroORM.init(ormConfig(databaseUrl, 2));
  try {
    const pending = await orm.getMigrator().getPendingMigrations();
    if (pending.length) {
      log(`applying ${pending.length} migration(s)…`);
      await orm.getMigrator().up();
    }
  } finally {
    await orm.close();
  }
  await migrateQueue(databaseUrl);
}

export async function withOrm<T>(databaseUrl: string, fn: (orm: MikroORM) => Promise<T>): Promise<T> {
  const orm = await MikroORM.init(ormConfig(databaseUrl, 2));
  try {
    return await fn(orm);
  } finally {
    await orm.close();
  }
}
